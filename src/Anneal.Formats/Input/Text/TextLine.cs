namespace Anneal.Formats.Input.Text;

/// <summary>One line of a text file with its 1-based row number and its whitespace-separated tokens.</summary>
internal sealed record TextLine(int Row, string Text, string[] Tokens)
{
    public bool IsBlank => Tokens.Length == 0;
}

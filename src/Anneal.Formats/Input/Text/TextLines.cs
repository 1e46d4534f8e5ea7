namespace Anneal.Formats.Input.Text;

/// <summary>Splits benchmark text into lines, accepting LF, CRLF and lone CR, so rows count the way editors show them.</summary>
internal static class TextLines
{
    private static readonly char[] Blanks = [' ', '\t', '\f', '\v', '\u00A0'];

    public static List<TextLine> Split(string text)
    {
        var lines = new List<TextLine>();
        int row = 1;
        int start = 0;
        for (int i = 0; i <= text.Length; i++)
        {
            bool end = i == text.Length;
            if (!end && text[i] != '\n' && text[i] != '\r')
            {
                continue;
            }

            string line = text[start..i];
            lines.Add(new TextLine(row, line, Tokenize(line)));
            row++;
            if (!end && text[i] == '\r' && i + 1 < text.Length && text[i + 1] == '\n')
            {
                i++;
            }

            start = i + 1;
        }

        return lines;
    }

    public static string[] Tokenize(string line) => line.Split(Blanks, StringSplitOptions.RemoveEmptyEntries);
}

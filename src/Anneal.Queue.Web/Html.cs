using System.Globalization;
using System.Text;
using System.Text.Encodings.Web;

namespace Anneal.Queue.Web;

/// <summary>A page being written: every piece of text from the database goes through <see cref="Text"/>, which encodes it.</summary>
internal sealed class Html
{
    private readonly StringBuilder _b = new();

    public static string Encode(string? text) => HtmlEncoder.Default.Encode(text ?? string.Empty);

    public static string Number(double? value, string format = "0.00") =>
        value is { } v && double.IsFinite(v) ? v.ToString(format, CultureInfo.InvariantCulture) : "-";

    public static string Time(DateTimeOffset? at) => at is { } t ? t.ToLocalTime().ToString("yyyy-MM-dd HH:mm:ss", CultureInfo.InvariantCulture) : "-";

    /// <summary>Markup written as it is: only literals of this project's code, never text from the database.</summary>
    public Html Raw(string markup)
    {
        _b.Append(markup);
        return this;
    }

    public Html Text(string? text)
    {
        _b.Append(Encode(text));
        return this;
    }

    /// <summary>A table row of already encoded cells.</summary>
    public Html Row(params string[] cells)
    {
        _b.Append("<tr>");
        foreach (var cell in cells)
        {
            _b.Append("<td>").Append(cell).Append("</td>");
        }

        _b.Append("</tr>\n");
        return this;
    }

    public override string ToString() => _b.ToString();
}

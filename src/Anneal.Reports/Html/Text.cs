using System.Globalization;
using System.Net;

namespace Anneal.Reports.Html;

/// <summary>Encoding and number formats for the report. Every string that came from the user's files goes through <see cref="E"/>.</summary>
internal static class Text
{
    public static string E(string? s) => WebUtility.HtmlEncode(s ?? string.Empty);

    public static string Money(double x) => double.IsFinite(x) ? x.ToString("#,0.00", CultureInfo.InvariantCulture) : "n/a";

    public static string Num(double x, string format = "0.##") => double.IsFinite(x) ? x.ToString(format, CultureInfo.InvariantCulture) : "n/a";

    public static string Seconds(double s) => s < 10 ? Num(s, "0.0#") + " s" : Num(s, "0") + " s";

    public static string Percent(double p) => Num(p, p < 10 ? "0.0#" : "0.0") + "%";
}

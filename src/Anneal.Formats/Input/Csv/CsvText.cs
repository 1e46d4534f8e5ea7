using System.Text;

namespace Anneal.Formats.Input.Csv;

/// <summary>
/// A CSV file's bytes as text: UTF-8 (with or without a BOM) when they are valid UTF-8, else Windows-1252, the code
/// page spreadsheets in Western European locales save "CSV" in (so "Café" stays "Café" rather than "Caf\uFFFD").
/// </summary>
internal static class CsvText
{
    public const string LegacyName = "Windows-1252";

    private static readonly UTF8Encoding StrictUtf8 = new(false, true);

    static CsvText()
    {
        Encoding.RegisterProvider(CodePagesEncodingProvider.Instance);
    }

    public static string Decode(byte[] bytes, out bool legacy)
    {
        legacy = false;
        string text;
        try
        {
            text = StrictUtf8.GetString(bytes);
        }
        catch (DecoderFallbackException)
        {
            legacy = true;
            text = Encoding.GetEncoding(1252).GetString(bytes);
        }

        return text.Length > 0 && text[0] == '\uFEFF' ? text[1..] : text;
    }
}

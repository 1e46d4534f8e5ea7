using System.Text.Encodings.Web;

namespace Anneal.Formats.Output;

/// <summary>How Anneal's JSON files are written: non-ASCII text as UTF-8 ("Fennick Wharf — north"), not \u escapes.</summary>
public static class JsonText
{
    /// <summary>
    /// Escapes only what JSON requires (quotes, backslashes, control characters). The "unsafe" in the name concerns
    /// JSON pasted into HTML script blocks; these files are read as JSON, and the HTML report escapes its own text.
    /// </summary>
    public static JavaScriptEncoder Encoder => JavaScriptEncoder.UnsafeRelaxedJsonEscaping;
}

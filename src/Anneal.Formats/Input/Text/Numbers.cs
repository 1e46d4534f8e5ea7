using System.Globalization;

namespace Anneal.Formats.Input.Text;

/// <summary>
/// Strict number parsing for benchmark files: invariant culture, finite, and small enough that sums and
/// squared distances cannot overflow to infinity.
/// </summary>
internal static class Numbers
{
    /// <summary>Largest magnitude accepted; squares of differences stay far from double overflow.</summary>
    public const double Limit = 1e15;

    public static bool TryFinite(string token, out double value)
    {
        bool ok = double.TryParse(token, NumberStyles.Float, CultureInfo.InvariantCulture, out value)
            && double.IsFinite(value) && Math.Abs(value) <= Limit;
        if (!ok)
        {
            value = 0;
        }

        return ok;
    }

    /// <summary>A whole number, written either as an integer or as a real with no fraction (e.g. "25" or "25.0").</summary>
    public static bool TryWhole(string token, out long value)
    {
        value = 0;
        if (long.TryParse(token, NumberStyles.Integer, CultureInfo.InvariantCulture, out long v) && v >= -(long)Limit && v <= (long)Limit)
        {
            value = v;
            return true;
        }

        if (TryFinite(token, out double d) && d == Math.Floor(d))
        {
            value = (long)d;
            return true;
        }

        return false;
    }

    public static bool LooksNumeric(string token) =>
        token.Length > 0 && (char.IsAsciiDigit(token[0]) || token[0] is '-' or '+' or '.');
}

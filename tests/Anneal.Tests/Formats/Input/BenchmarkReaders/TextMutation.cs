using CsCheck;

namespace Anneal.Tests.Formats.Input.BenchmarkReaders;

/// <summary>One edit of a text file: the kind of damage and where it lands.</summary>
internal readonly record struct TextMutation(int Kind, int A, int B, string Garbage)
{
    /// <summary>Tokens that have broken readers before in practice (common practice in parser fuzzing).</summary>
    private static readonly string[] Nasty =
    [
        "NaN", "-NaN", "Infinity", "-Infinity", "inf", "-1", "-0", "0", "1e308", "-1e308", "1e400", "99999999999999999999",
        "-9223372036854775808", "2147483648", "abc", "#", ":", "Route", "#1:", "0x1F", "1,5", "1.5", "", "\t", "EOF",
        "DEPOT_SECTION", "NODE_COORD_SECTION", "CUSTOMER", "VEHICLE", "DIMENSION : 3", "\u00A0", "Route #2: 1 1",
    ];

    public static readonly Gen<TextMutation> Gen =
        CsCheck.Gen.Select(CsCheck.Gen.Int[0, 8], CsCheck.Gen.Int[0, 1000], CsCheck.Gen.Int[0, 1000], CsCheck.Gen.Int[0, Nasty.Length - 1],
            (kind, a, b, g) => new TextMutation(kind, a, b, Nasty[g]));

    public static readonly Gen<TextMutation[]> Several = Gen.Array[1, 4];

    public static string Apply(string text, TextMutation[] mutations)
    {
        foreach (var m in mutations)
        {
            text = m.Apply(text);
        }

        return text;
    }

    public string Apply(string text)
    {
        var lines = text.Replace("\r\n", "\n").Split('\n').ToList();
        int i = A % lines.Count;
        int j = B % lines.Count;
        switch (Kind)
        {
            case 0: lines.RemoveAt(i); break;
            case 1: lines.Insert(i, lines[i]); break;
            case 2: (lines[i], lines[j]) = (lines[j], lines[i]); break;
            case 3: lines[i] = ReplaceToken(lines[i], B, Garbage); break;
            case 4: return text[..(int)((long)A * text.Length / 1000)];
            case 5: lines.Insert(i, Garbage + " " + B); break;
            case 6: return string.Join(B % 2 == 0 ? "\r\n" : "\r", lines);
            case 7: lines[i] += " " + Garbage; break;
            default: lines[i] = ReplaceToken(lines[i], B, B % 2 == 0 ? "1e15" : "-1e15"); break;
        }

        return string.Join("\n", lines);
    }

    private static string ReplaceToken(string line, int which, string with)
    {
        var tokens = line.Split([' ', '\t'], StringSplitOptions.RemoveEmptyEntries);
        if (tokens.Length == 0)
        {
            return with;
        }

        tokens[which % tokens.Length] = with;
        return string.Join(' ', tokens);
    }
}

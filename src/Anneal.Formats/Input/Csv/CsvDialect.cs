namespace Anneal.Formats.Input.Csv;

/// <summary>
/// How a CSV file separates its fields, found from its header line: spreadsheets in many European locales export
/// with ';' and write decimals with a comma; tab-separated exports exist too. With ';' or tab a decimal comma cannot
/// be a field separator, so it is read as a decimal point.
/// </summary>
public sealed record CsvDialect(char Delimiter)
{
    public static readonly CsvDialect Comma = new(',');

    /// <summary>Whether "12,5" means twelve and a half (it cannot be two fields).</summary>
    public bool DecimalComma => Delimiter != ',';

    public string Name => Delimiter switch
    {
        ';' => "semicolon-separated",
        '\t' => "tab-separated",
        _ => "comma-separated",
    };

    /// <summary>The separator that occurs most often outside quotes on the first non-blank line; ',' when none does.</summary>
    public static CsvDialect Detect(string text)
    {
        int commas = 0, semicolons = 0, tabs = 0;
        bool quoted = false, content = false;
        foreach (char c in text)
        {
            if (c == '"')
            {
                quoted = !quoted;
            }
            else if (!quoted && (c == '\n' || c == '\r'))
            {
                if (content)
                {
                    break;
                }
            }
            else if (!quoted)
            {
                switch (c)
                {
                    case ',': commas++; break;
                    case ';': semicolons++; break;
                    case '\t': tabs++; break;
                }
            }

            content |= !char.IsWhiteSpace(c);
        }

        if (semicolons > commas && semicolons >= tabs)
        {
            return new CsvDialect(';');
        }

        return tabs > commas && tabs > semicolons ? new CsvDialect('\t') : Comma;
    }
}

using System.Text.RegularExpressions;
using Npgsql;

namespace Anneal.Queue.Database;

/// <summary>
/// How a connection string may appear in messages and logs: as host, port, database and user only. The password never
/// does; <see cref="Scrub"/> also removes it from texts that came from elsewhere (a driver's error message).
/// </summary>
public static partial class ConnectionText
{
    public const string Hidden = "***";

    /// <summary>"user@host:port/database", or a neutral phrase when the string cannot be read.</summary>
    public static string Describe(string connectionString)
    {
        try
        {
            var b = new NpgsqlConnectionStringBuilder(connectionString);
            string user = string.IsNullOrEmpty(b.Username) ? string.Empty : b.Username + "@";
            return $"{user}{b.Host ?? "localhost"}:{b.Port}/{b.Database ?? b.Username ?? "(default database)"}";
        }
        catch (ArgumentException)
        {
            return "(a connection string that cannot be read)";
        }
    }

    /// <summary>The connection string with its password replaced by ***.</summary>
    public static string Mask(string connectionString)
    {
        try
        {
            var b = new NpgsqlConnectionStringBuilder(connectionString);
            if (!string.IsNullOrEmpty(b.Password))
            {
                b.Password = Hidden;
            }

            return b.ConnectionString;
        }
        catch (ArgumentException)
        {
            return PasswordPair().Replace(connectionString, m => m.Groups["key"].Value + "=" + Hidden);
        }
    }

    /// <summary><paramref name="text"/> with the connection string's password (and anything that looks like one) removed.</summary>
    public static string Scrub(string text, string connectionString)
    {
        string? password = null;
        try
        {
            password = new NpgsqlConnectionStringBuilder(connectionString).Password;
        }
        catch (ArgumentException)
        {
            var m = PasswordPair().Match(connectionString);
            password = m.Success ? m.Groups["value"].Value : null;
        }

        if (!string.IsNullOrEmpty(password))
        {
            text = text.Replace(password, Hidden, StringComparison.Ordinal);
        }

        return PasswordPair().Replace(text, m => m.Groups["key"].Value + "=" + Hidden);
    }

    [GeneratedRegex(@"(?<key>\b(password|pwd)\s*)=\s*(?<value>'[^']*'|""[^""]*""|[^;]*)", RegexOptions.IgnoreCase)]
    private static partial Regex PasswordPair();
}

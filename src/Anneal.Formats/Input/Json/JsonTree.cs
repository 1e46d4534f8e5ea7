using System.Text.Json;

namespace Anneal.Formats.Input.Json;

/// <summary>
/// A JSON value that remembers where it was written (line and character column, both from 1), so that problems in
/// settings and experiment files can point at the place to fix; System.Text.Json's document model keeps no positions.
/// </summary>
public sealed record JsonTree(JsonTokenType Kind, int Line, int Column = 1)
{
    public string? Text { get; init; }
    public double Number { get; init; }
    public List<(string Key, int Line, int Column, JsonTree Value)> Members { get; } = [];
    public List<JsonTree> Items { get; } = [];

    public bool IsObject => Kind == JsonTokenType.StartObject;

    /// <summary>Parses UTF-8 JSON (a BOM, comments and trailing commas allowed).</summary>
    /// <exception cref="JsonSyntaxException">with the line, column and what is wrong, in plain words.</exception>
    public static JsonTree Parse(ReadOnlySpan<byte> utf8)
    {
        if (utf8.StartsWith((ReadOnlySpan<byte>)[0xEF, 0xBB, 0xBF]))
        {
            utf8 = utf8[3..];
        }

        var lines = new LineIndex(utf8);
        var reader = new Utf8JsonReader(utf8, new JsonReaderOptions { CommentHandling = JsonCommentHandling.Skip, AllowTrailingCommas = true });
        try
        {
            if (!reader.Read())
            {
                throw new JsonSyntaxException(1, 1, "the file holds no JSON value");
            }

            var tree = ReadValue(ref reader, lines);
            if (reader.Read())
            {
                var (line, column) = lines.At(reader.TokenStartIndex);
                throw new JsonSyntaxException(line, column, "more than one JSON value (text after the closing '}')");
            }

            return tree;
        }
        catch (JsonException e)
        {
            throw Explain(e, utf8, lines);
        }
        catch (InvalidOperationException)
        {
            // A string whose bytes are not UTF-8: the reader accepts them and fails only when asked for the text.
            var (line, column) = lines.At(reader.TokenStartIndex);
            throw new JsonSyntaxException(line, column, "text that is not valid UTF-8 (save the file as UTF-8)");
        }
    }

    /// <summary>The reader's fault, reworded: where it is, and what a person would look for there.</summary>
    private static JsonSyntaxException Explain(JsonException e, ReadOnlySpan<byte> utf8, LineIndex lines)
    {
        int line = (int)(e.LineNumber ?? 0) + 1;
        long offset = lines.Offset(line, e.BytePositionInLine ?? 0);
        int column = lines.At(offset).Column;
        while (offset < utf8.Length && utf8[(int)offset] is (byte)' ' or (byte)'\t' or (byte)'\r' or (byte)'\n')
        {
            offset++;
        }

        if (offset >= utf8.Length)
        {
            return new JsonSyntaxException(line, column, "the file ends too early: a '{', '[' or '\"' is not closed, or a value is missing");
        }

        char c = (char)utf8[(int)offset];
        string what = c switch
        {
            '}' or ']' => $"unexpected '{c}': a value is missing before it, or a bracket is closed twice",
            ',' => "unexpected ',': a value is missing before it",
            ':' => "unexpected ':': a key must be text in double quotes",
            '\'' => "single quotes: write text and keys in double quotes",
            _ when char.IsAsciiLetter(c) => "a word without double quotes: write text and keys in double quotes (true, false and null stay bare)",
            _ => $"unexpected '{c}': a comma, colon, quote or bracket may be missing before it",
        };
        return new JsonSyntaxException(line, column, what);
    }

    private static JsonTree ReadValue(ref Utf8JsonReader reader, LineIndex lines)
    {
        var (line, column) = lines.At(reader.TokenStartIndex);
        switch (reader.TokenType)
        {
            case JsonTokenType.StartObject:
                var obj = new JsonTree(JsonTokenType.StartObject, line, column);
                while (reader.Read() && reader.TokenType != JsonTokenType.EndObject)
                {
                    string key = reader.GetString() ?? string.Empty;
                    var (keyLine, keyColumn) = lines.At(reader.TokenStartIndex);
                    reader.Read();
                    obj.Members.Add((key, keyLine, keyColumn, ReadValue(ref reader, lines)));
                }

                return obj;
            case JsonTokenType.StartArray:
                var array = new JsonTree(JsonTokenType.StartArray, line, column);
                while (reader.Read() && reader.TokenType != JsonTokenType.EndArray)
                {
                    array.Items.Add(ReadValue(ref reader, lines));
                }

                return array;
            case JsonTokenType.String:
                return new JsonTree(JsonTokenType.String, line, column) { Text = reader.GetString() };
            case JsonTokenType.Number:
                return new JsonTree(JsonTokenType.Number, line, column) { Number = reader.TryGetDouble(out double d) ? d : double.NaN, Text = System.Text.Encoding.UTF8.GetString(reader.ValueSpan) };
            case JsonTokenType.True:
            case JsonTokenType.False:
            case JsonTokenType.Null:
                return new JsonTree(reader.TokenType, line, column) { Text = reader.TokenType.ToString().ToLowerInvariant() };
            default:
                throw new JsonSyntaxException(line, column, "unexpected " + reader.TokenType);
        }
    }

    /// <summary>The member of this object written as <paramref name="key"/> on <paramref name="line"/> (any line when none is there).</summary>
    public (int Line, int Column)? Find(string key, int line)
    {
        (int, int)? any = null;
        foreach (var m in Members)
        {
            if (string.Equals(m.Key, key, StringComparison.OrdinalIgnoreCase))
            {
                if (m.Line == line)
                {
                    return (m.Line, m.Column);
                }

                any ??= (m.Line, m.Column);
            }
        }

        return any;
    }

    /// <summary>The place of the key at dotted <paramref name="path"/> (e.g. "rules.timeWindows.hard") written on <paramref name="line"/>.</summary>
    public (int Line, int Column)? Locate(string path, int line)
    {
        var node = this;
        var parts = path.Split('.');
        for (int i = 0; i < parts.Length - 1; i++)
        {
            JsonTree? next = null;
            foreach (var m in node.Members)
            {
                if (string.Equals(m.Key, parts[i], StringComparison.OrdinalIgnoreCase) && m.Value.IsObject)
                {
                    next = m.Value;
                }
            }

            if (next is null)
            {
                return null;
            }

            node = next;
        }

        return node.Find(parts[^1], line);
    }

    /// <summary>Short text of the value for messages.</summary>
    public string Shown => Kind switch
    {
        JsonTokenType.StartObject => "{...}",
        JsonTokenType.StartArray => "[...]",
        JsonTokenType.String => "\"" + Text + "\"",
        _ => Text ?? string.Empty,
    };

    /// <summary>Line starts of a UTF-8 text, to turn byte offsets into a line and a character column.</summary>
    private sealed class LineIndex
    {
        private readonly List<int> _starts = [0];
        private readonly byte[] _text;

        public LineIndex(ReadOnlySpan<byte> utf8)
        {
            _text = utf8.ToArray();
            for (int i = 0; i < utf8.Length; i++)
            {
                if (utf8[i] == (byte)'\n')
                {
                    _starts.Add(i + 1);
                }
            }
        }

        public long Offset(int line, long bytesIntoLine) => _starts[Math.Clamp(line - 1, 0, _starts.Count - 1)] + bytesIntoLine;

        public (int Line, int Column) At(long offset)
        {
            int index = _starts.BinarySearch((int)Math.Min(offset, int.MaxValue));
            int line = index >= 0 ? index : ~index - 1;
            int column = 1;
            for (long i = _starts[line]; i < offset && i < _text.Length; i++)
            {
                if ((_text[i] & 0xC0) != 0x80)
                {
                    column++; // count characters, not the continuation bytes of UTF-8
                }
            }

            return (line + 1, column);
        }
    }
}

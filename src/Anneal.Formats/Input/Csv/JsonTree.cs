using System.Text.Json;

namespace Anneal.Formats.Input.Csv;

/// <summary>
/// A JSON value that remembers its line, so settings problems can point at the line to fix
/// (System.Text.Json's document model does not keep positions).
/// </summary>
internal sealed record JsonTree(JsonTokenType Kind, int Line)
{
    public string? Text { get; init; }
    public double Number { get; init; }
    public List<(string Key, int Line, JsonTree Value)> Members { get; } = [];
    public List<JsonTree> Items { get; } = [];

    public bool IsObject => Kind == JsonTokenType.StartObject;

    /// <summary>Parses UTF-8 JSON with comments and trailing commas allowed; throws JsonException with a line number.</summary>
    public static JsonTree Parse(ReadOnlySpan<byte> utf8)
    {
        var lineStarts = new List<int> { 0 };
        for (int i = 0; i < utf8.Length; i++)
        {
            if (utf8[i] == (byte)'\n')
            {
                lineStarts.Add(i + 1);
            }
        }

        var reader = new Utf8JsonReader(utf8, new JsonReaderOptions { CommentHandling = JsonCommentHandling.Skip, AllowTrailingCommas = true });
        if (!reader.Read())
        {
            throw new JsonException("the file holds no JSON value", null, 0, 0);
        }

        var tree = ReadValue(ref reader, lineStarts);
        if (reader.Read())
        {
            throw new JsonException("more than one JSON value", null, LineOf(reader, lineStarts) - 1, 0);
        }

        return tree;
    }

    private static JsonTree ReadValue(ref Utf8JsonReader reader, List<int> lineStarts)
    {
        int line = LineOf(reader, lineStarts);
        switch (reader.TokenType)
        {
            case JsonTokenType.StartObject:
                var obj = new JsonTree(JsonTokenType.StartObject, line);
                while (reader.Read() && reader.TokenType != JsonTokenType.EndObject)
                {
                    string key = reader.GetString() ?? string.Empty;
                    int keyLine = LineOf(reader, lineStarts);
                    reader.Read();
                    obj.Members.Add((key, keyLine, ReadValue(ref reader, lineStarts)));
                }

                return obj;
            case JsonTokenType.StartArray:
                var array = new JsonTree(JsonTokenType.StartArray, line);
                while (reader.Read() && reader.TokenType != JsonTokenType.EndArray)
                {
                    array.Items.Add(ReadValue(ref reader, lineStarts));
                }

                return array;
            case JsonTokenType.String:
                return new JsonTree(JsonTokenType.String, line) { Text = reader.GetString() };
            case JsonTokenType.Number:
                return new JsonTree(JsonTokenType.Number, line) { Number = reader.TryGetDouble(out double d) ? d : double.NaN, Text = System.Text.Encoding.UTF8.GetString(reader.ValueSpan) };
            case JsonTokenType.True:
            case JsonTokenType.False:
            case JsonTokenType.Null:
                return new JsonTree(reader.TokenType, line) { Text = reader.TokenType.ToString().ToLowerInvariant() };
            default:
                throw new JsonException($"unexpected {reader.TokenType}", null, line - 1, 0);
        }
    }

    private static int LineOf(in Utf8JsonReader reader, List<int> lineStarts)
    {
        int index = lineStarts.BinarySearch((int)reader.TokenStartIndex);
        return (index >= 0 ? index : ~index - 1) + 1;
    }

    /// <summary>Short text of the value for messages.</summary>
    public string Shown => Kind switch
    {
        JsonTokenType.StartObject => "{...}",
        JsonTokenType.StartArray => "[...]",
        JsonTokenType.String => "\"" + Text + "\"",
        _ => Text ?? string.Empty,
    };
}

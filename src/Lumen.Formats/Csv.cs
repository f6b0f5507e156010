namespace Lumen.Formats;

/// <summary>RFC 4180 field quoting, the one CSV rule every writer uses.</summary>
public static class Csv
{
    /// <summary>Quotes a CSV field when it holds a comma, quote or line break (RFC 4180).</summary>
    /// <param name="text">The field text.</param>
    /// <returns>The field, quoted when needed.</returns>
    public static string Quote(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        return text.AsSpan().IndexOfAny(",\"\n\r") >= 0 ? "\"" + text.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"" : text;
    }

    /// <summary>Splits one CSV line written by <see cref="Quote"/> into its fields (RFC 4180 quotes; no line breaks inside
    /// fields). An empty field is <c>""</c>.</summary>
    /// <param name="line">The line.</param>
    /// <returns>The fields.</returns>
    public static string[] Split(string line)
    {
        ArgumentNullException.ThrowIfNull(line);
        var fields = new List<string>();
        var sb = new System.Text.StringBuilder();
        bool quoted = false;
        for (int i = 0; i < line.Length; i++)
        {
            char c = line[i];
            if (quoted)
            {
                if (c == '"' && i + 1 < line.Length && line[i + 1] == '"') { sb.Append('"'); i++; }
                else if (c == '"') quoted = false;
                else sb.Append(c);
            }
            else if (c == '"') quoted = true;
            else if (c == ',') { fields.Add(sb.ToString()); sb.Clear(); }
            else sb.Append(c);
        }
        fields.Add(sb.ToString());
        return fields.ToArray();
    }
}

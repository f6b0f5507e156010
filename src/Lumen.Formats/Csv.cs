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
}

using System.Text.Json;

namespace Lumen.Formats;

/// <summary>The one dispatch from an <see cref="OutputFormat"/> to a writer: a JSON array of objects, a CSV from a schema, or a text form.</summary>
public static class FormattedOutput
{
    /// <summary>Writes records in a format.</summary>
    /// <typeparam name="T">The record type.</typeparam>
    /// <param name="items">The records, in order.</param>
    /// <param name="format">Text, JSON or CSV.</param>
    /// <param name="output">Destination.</param>
    /// <param name="json">Writes one record as a JSON object.</param>
    /// <param name="csv">The CSV schema.</param>
    /// <param name="text">Writes the text form of all records.</param>
    public static void Write<T>(IReadOnlyList<T> items, OutputFormat format, TextWriter output, Action<Utf8JsonWriter, T> json, ColumnSchema<T> csv, Action<IReadOnlyList<T>, TextWriter> text)
    {
        ArgumentNullException.ThrowIfNull(items);
        ArgumentNullException.ThrowIfNull(output);
        ArgumentNullException.ThrowIfNull(json);
        ArgumentNullException.ThrowIfNull(csv);
        ArgumentNullException.ThrowIfNull(text);
        switch (format)
        {
            case OutputFormat.Json:
                JsonOutput.Write(output, w =>
                {
                    w.WriteStartArray();
                    foreach (var item in items) json(w, item);
                    w.WriteEndArray();
                });
                break;
            case OutputFormat.Csv:
                csv.WriteCsvHeader(output);
                foreach (var item in items) csv.WriteCsvRow(output, item);
                break;
            default:
                text(items, output);
                break;
        }
    }
}

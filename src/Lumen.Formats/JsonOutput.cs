using System.Text;
using System.Text.Encodings.Web;
using System.Text.Json;

namespace Lumen.Formats;

/// <summary>
/// The one way Lumen writes JSON: UTF-8, readable escaping, and one rule for numbers that are not finite — they are
/// written as <c>null</c>, never as a crash or an invalid token (the result that produced them carries a warning).
/// </summary>
public static class JsonOutput
{
    private static readonly JsonWriterOptions Indented = new() { Indented = true, Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping };
    private static readonly JsonWriterOptions Compact = new() { Indented = false, Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping };

    /// <summary>Writes one JSON value to a text writer, followed by a line break.</summary>
    /// <param name="output">Destination.</param>
    /// <param name="body">Writes the value.</param>
    /// <param name="indented">Indented (documents) or compact (one line per record).</param>
    public static void Write(TextWriter output, Action<Utf8JsonWriter> body, bool indented = true)
    {
        ArgumentNullException.ThrowIfNull(output);
        ArgumentNullException.ThrowIfNull(body);
        using var ms = new MemoryStream();
        using (var w = new Utf8JsonWriter(ms, indented ? Indented : Compact)) body(w);
        output.WriteLine(Encoding.UTF8.GetString(ms.GetBuffer(), 0, (int)ms.Length));
    }

    /// <summary>Writes a number, or <c>null</c> when it is missing or not finite.</summary>
    /// <param name="writer">The JSON writer.</param>
    /// <param name="name">Property name.</param>
    /// <param name="value">The value.</param>
    public static void NumberOrNull(this Utf8JsonWriter writer, string name, double? value)
    {
        ArgumentNullException.ThrowIfNull(writer);
        if (value is { } x && double.IsFinite(x)) writer.WriteNumber(name, x);
        else writer.WriteNull(name);
    }

    /// <summary>Writes a number array element, or <c>null</c> when it is not finite.</summary>
    /// <param name="writer">The JSON writer.</param>
    /// <param name="value">The value.</param>
    public static void NumberOrNullValue(this Utf8JsonWriter writer, double value)
    {
        ArgumentNullException.ThrowIfNull(writer);
        if (double.IsFinite(value)) writer.WriteNumberValue(value);
        else writer.WriteNullValue();
    }

    /// <summary>Writes an array of strings.</summary>
    /// <param name="writer">The JSON writer.</param>
    /// <param name="name">Property name.</param>
    /// <param name="values">The strings.</param>
    public static void StringArray(this Utf8JsonWriter writer, string name, IEnumerable<string> values)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(values);
        writer.WriteStartArray(name);
        foreach (var v in values) writer.WriteStringValue(v);
        writer.WriteEndArray();
    }

    /// <summary>Writes an <c>error</c> object {line, column, message}.</summary>
    /// <param name="writer">The JSON writer.</param>
    /// <param name="error">The diagnostic.</param>
    public static void Error(this Utf8JsonWriter writer, Lumen.Analysis.ReadDiagnostic error)
    {
        ArgumentNullException.ThrowIfNull(writer);
        ArgumentNullException.ThrowIfNull(error);
        writer.WriteStartObject("error");
        writer.WriteNumber("line", error.Line);
        writer.WriteNumber("column", error.Column);
        writer.WriteString("message", error.Message);
        writer.WriteEndObject();
    }
}

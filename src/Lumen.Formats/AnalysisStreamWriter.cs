using Lumen.Analysis;

namespace Lumen.Formats;

/// <summary>
/// Writes <c>lumen analyze</c> results as JSON or CSV one record at a time, as they are computed, so memory stays flat
/// however many spectra there are. (The text table needs every row to size its columns and is written by
/// <see cref="AnalysisWriter"/>.)
/// </summary>
public sealed class AnalysisStreamWriter
{
    private readonly TextWriter _out;
    private readonly bool _json, _lines;
    private readonly ColumnSchema<RecordOutcome> _csv;
    private readonly Lumen.Conformance.PreparedSpec? _spec;
    private bool _first = true;

    /// <summary>Starts the output: the CSV header, or the opening bracket of the JSON array.</summary>
    /// <param name="output">Destination.</param>
    /// <param name="format"><see cref="OutputFormat.Json"/> or <see cref="OutputFormat.Csv"/>.</param>
    /// <exception cref="ArgumentException">The format is <see cref="OutputFormat.Text"/>.</exception>
    /// <param name="withVerdict">CSV: add the verdict columns (a specification was given).</param>
    /// <param name="spec">JSON: the specification behind the verdicts, written as each row's <c>verdict.target</c>; null for none.</param>
    /// <param name="withUncertainty">CSV: add <c>_u</c>, <c>_low</c>, <c>_high</c> beside each result field.</param>
    public AnalysisStreamWriter(TextWriter output, OutputFormat format, bool withVerdict = false, Lumen.Conformance.PreparedSpec? spec = null, bool withUncertainty = false)
    {
        _spec = spec;
        ArgumentNullException.ThrowIfNull(output);
        if (format == OutputFormat.Text) throw new ArgumentException("The text table is not streamed.", nameof(format));
        _out = output;
        _json = format is OutputFormat.Json or OutputFormat.JsonLines;
        _lines = format == OutputFormat.JsonLines;
        _csv = withVerdict ? AnalysisColumns.CsvWithVerdict : AnalysisColumns.Csv;
        if (withUncertainty) _csv = AnalysisColumns.WithUncertainty(_csv);
        if (_lines) { }
        else if (_json) _out.Write('[');
        else _csv.WriteCsvHeader(_out);
    }

    /// <summary>Writes one record.</summary>
    /// <param name="item">The outcome.</param>
    public void Write(RecordOutcome item)
    {
        ArgumentNullException.ThrowIfNull(item);
        if (!_json) { _csv.WriteCsvRow(_out, item); return; }
        if (_lines)
        {
            using var line = new StringWriter();
            JsonOutput.Write(line, w => AnalysisWriter.WriteRecord(w, item, _spec), indented: false);
            _out.WriteLine(line.ToString().TrimEnd('\n', '\r'));
            return;
        }
        _out.Write(_first ? "\n" : ",\n");
        _first = false;
        using var sw = new StringWriter();
        JsonOutput.Write(sw, w => AnalysisWriter.WriteRecord(w, item, _spec));
        _out.Write(sw.ToString().TrimEnd('\n', '\r'));
    }

    /// <summary>Finishes the output (the closing bracket of the JSON array).</summary>
    public void Complete()
    {
        if (_json && !_lines) _out.WriteLine(_first ? "]" : "\n]");
        _out.Flush();
    }
}

using Lumen.Analysis;
using Lumen.Conformance;

namespace Lumen.Formats;

/// <summary>Streams batch results, one row or object per input record in input order, as CSV or as a JSON array.</summary>
public sealed class BatchResultWriter
{
    private readonly TextWriter _out;
    private readonly bool _json, _lines;
    private readonly IReadOnlyList<string> _metadataKeys;
    private readonly bool _withUncertainty;
    private ColumnSchema<RecordOutcome>? _csv;
    private readonly PreparedSpec? _prepared;
    private bool _first = true;

    /// <summary>Starts the output (CSV header, or the opening bracket of the JSON array).</summary>
    /// <param name="output">Destination.</param>
    /// <param name="json">JSON instead of CSV.</param>
    /// <param name="spec">The specification (its criteria become CSV columns).</param>
    public BatchResultWriter(TextWriter output, bool json, ToleranceSpec spec)
        : this(output, json, new PreparedSpec(spec ?? throw new ArgumentNullException(nameof(spec))))
    {
    }

    /// <summary>Starts the output for a prepared specification (JSON rows then carry its target in each verdict).</summary>
    /// <param name="output">Destination.</param>
    /// <param name="json">JSON instead of CSV.</param>
    /// <param name="prepared">The prepared specification.</param>
    /// <param name="metadataKeys">Metadata keys known before the first record (from the input files' headers); the first
    /// record's keys are added to them, and the CSV header is written with the first record.</param>
    /// <param name="withUncertainty">CSV: add <c>_u</c>, <c>_low</c>, <c>_high</c> beside each result field.</param>
    /// <param name="lines">With <paramref name="json"/>: JSON Lines, one object per line without the enclosing array.</param>
    public BatchResultWriter(TextWriter output, bool json, PreparedSpec prepared, IReadOnlyList<string>? metadataKeys = null, bool withUncertainty = false, bool lines = false)
    {
        ArgumentNullException.ThrowIfNull(output);
        ArgumentNullException.ThrowIfNull(prepared);
        _prepared = prepared;
        _out = output;
        _json = json;
        _lines = json && lines;
        _metadataKeys = metadataKeys ?? [];
        _withUncertainty = withUncertainty;
        if (json && !_lines) _out.WriteLine("[");
    }

    /// <summary>The CSV schema, made (and its header written) with the first record, whose metadata keys it includes.</summary>
    private ColumnSchema<RecordOutcome> Csv(RecordOutcome? first)
    {
        if (_csv is not null) return _csv;
        var keys = _metadataKeys.Concat(first?.Record.Metadata.Select(kv => kv.Key) ?? []).Distinct(StringComparer.Ordinal).ToArray();
        _csv = BatchColumns.For(_prepared!.Spec, keys);
        if (_withUncertainty) _csv = AnalysisColumns.WithUncertainty(_csv);
        _csv.WriteCsvHeader(_out);
        return _csv;
    }

    /// <summary>For CSV output, whether each column holds numbers (known once the header is written: after the first
    /// record or <see cref="Complete"/>); empty for JSON.</summary>
    public IReadOnlyList<bool> NumericColumns => _csv?.Columns.Select(c => c.IsNumeric).ToArray() ?? [];

    /// <summary>Writes one record.</summary>
    /// <param name="item">The outcome.</param>
    public void Write(RecordOutcome item)
    {
        ArgumentNullException.ThrowIfNull(item);
        if (!_json) { Csv(item).WriteCsvRow(_out, item); return; }
        if (_lines)
        {
            using var line = new StringWriter();
            JsonOutput.Write(line, w => WriteObject(w, item, _prepared), indented: false);
            _out.WriteLine(line.ToString().TrimEnd('\n', '\r'));
            return;
        }
        if (!_first) _out.WriteLine(",");
        _first = false;
        using var sw = new StringWriter();
        JsonOutput.Write(sw, w => WriteObject(w, item, _prepared), indented: false);
        _out.Write(sw.ToString().TrimEnd('\n', '\r'));
    }

    /// <summary>Finishes the output (the closing bracket of a JSON array) and flushes it.</summary>
    public void Complete()
    {
        if (!_json) Csv(null);
        else if (!_lines)
        {
            _out.WriteLine();
            _out.WriteLine("]");
        }
        _out.Flush();
    }

    /// <summary>The result fields of a JSON row, nested by their paths (<c>cri.r9</c> → <c>"cri": {"r9": …}</c>) so each
    /// quantity has the name it has in specs and CSV headers.</summary>
    private static readonly (string Group, (string Name, Func<Assessment, double?> Get)[] Fields)[] ResultGroups =
        new[] { "cct.kelvin", "cct.duv", "chromaticity.x", "chromaticity.y", "chromaticity.uPrime", "chromaticity.vPrime", "cri.ra", "cri.r9", "fidelity.rf", "fidelity.rg" }
            .GroupBy(p => p[..p.IndexOf('.', StringComparison.Ordinal)], StringComparer.Ordinal)
            .Select(g => (g.Key, g.Select(p => (p[(g.Key.Length + 1)..], ResultFields.Accessor(p))).ToArray()))
            .ToArray();

    private static void WriteObject(System.Text.Json.Utf8JsonWriter w, RecordOutcome item, PreparedSpec? prepared)
    {
        w.WriteStartObject();
        w.WriteString("id", item.Record.Name);
        w.WriteString("location", item.Record.Location);
        w.WriteStartObject("metadata");
        foreach (var (key, value) in item.Record.Metadata) w.WriteString(key, value);
        w.WriteEndObject();
        w.WriteString("status", item.Status);
        if (item.Assessment is { } a && item.Verdict is { } v)
        {
            w.WriteStartObject("result");
            foreach (var (group, fields) in ResultGroups)
            {
                w.WriteStartObject(group);
                foreach (var (name, get) in fields) w.NumberOrNull(name, get(a));
                w.WriteEndObject();
            }
            w.WriteEndObject();
            JsonVerdict.Write(w, v, prepared, item);
            if (item.Uncertainty is { } u) JsonUncertainty.Write(w, u);
            w.StringArray("warnings", a.Warnings);
        }
        else if (item.Error is { } e) w.Error(e);
        w.WriteEndObject();
    }
}

using Lumen.Analysis;
using Lumen.Conformance;

namespace Lumen.Formats;

/// <summary>Streams batch results, one row or object per input record in input order, as CSV or as a JSON array.</summary>
public sealed class BatchResultWriter
{
    private readonly TextWriter _out;
    private readonly ColumnSchema<RecordOutcome>? _csv;
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
    public BatchResultWriter(TextWriter output, bool json, PreparedSpec prepared)
    {
        ArgumentNullException.ThrowIfNull(output);
        ArgumentNullException.ThrowIfNull(prepared);
        var spec = prepared.Spec;
        _prepared = prepared;
        _out = output;
        if (json) _out.WriteLine("[");
        else
        {
            _csv = BatchColumns.For(spec);
            _csv.WriteCsvHeader(_out);
        }
    }

    /// <summary>Writes one record.</summary>
    /// <param name="item">The outcome.</param>
    public void Write(RecordOutcome item)
    {
        ArgumentNullException.ThrowIfNull(item);
        if (_csv is not null) { _csv.WriteCsvRow(_out, item); return; }
        if (!_first) _out.WriteLine(",");
        _first = false;
        using var sw = new StringWriter();
        JsonOutput.Write(sw, w => WriteObject(w, item, _prepared), indented: false);
        _out.Write(sw.ToString().TrimEnd('\n', '\r'));
    }

    /// <summary>Finishes the output (the closing bracket of a JSON array) and flushes it.</summary>
    public void Complete()
    {
        if (_csv is null)
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
            JsonVerdict.Write(w, v, prepared);
            w.StringArray("warnings", a.Warnings);
        }
        else if (item.Error is { } e) w.Error(e);
        w.WriteEndObject();
    }
}

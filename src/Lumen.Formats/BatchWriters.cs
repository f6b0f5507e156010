using System.Globalization;
using System.Text.Json;
using Lumen.Conformance;
using Lumen.Quality;

namespace Lumen.Formats;

/// <summary>One batch row: the record, its assessment and verdict, or its error.</summary>
/// <param name="Record">The input record.</param>
/// <param name="Result">The assessment (null for an error row).</param>
/// <param name="Verdict">The verdict (null for an error row).</param>
public sealed record BatchItem(SpectrumRecord Record, Lumen.Assessment.Assessment? Result, Verdict? Verdict)
{
    /// <summary>"pass", "fail" or "error".</summary>
    public string Status => Verdict is null ? "error" : Verdict.Pass ? "pass" : "fail";

    /// <summary>Where the record is: "file:line" (row layout) or "file (column k)".</summary>
    public string Location => Record.Line > 0 ? $"{Record.Source}:{Record.Line}" : Record.Column > 0 ? $"{Record.Source} (column {Record.Column})" : Record.Source;
}

/// <summary>Streams batch rows to CSV or JSON (one row per input record, in input order).</summary>
public abstract class BatchWriter : IDisposable
{
    /// <summary>Creates a writer for a path's extension (.json → JSON, else CSV).</summary>
    /// <param name="output">Destination.</param>
    /// <param name="json">JSON instead of CSV.</param>
    /// <param name="spec">The spec (its criteria become columns).</param>
    /// <returns>The writer.</returns>
    public static BatchWriter Create(TextWriter output, bool json, ToleranceSpec spec) => json ? new JsonBatchWriter(output) : new CsvBatchWriter(output, spec);

    /// <summary>Writes one row.</summary>
    /// <param name="item">The row.</param>
    public abstract void Write(BatchItem item);

    /// <summary>Finishes the output.</summary>
    public abstract void Complete();

    /// <inheritdoc/>
    public void Dispose()
    {
        Dispose(true);
        GC.SuppressFinalize(this);
    }

    /// <summary>Releases resources.</summary>
    /// <param name="disposing">True from <see cref="Dispose()"/>.</param>
    protected virtual void Dispose(bool disposing) { }
}

/// <summary>CSV batch rows (columns documented in the README).</summary>
public sealed class CsvBatchWriter : BatchWriter
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;
    private readonly TextWriter _out;
    private readonly int _criteria;

    /// <summary>Writes the header.</summary>
    /// <param name="output">Destination.</param>
    /// <param name="spec">The spec.</param>
    public CsvBatchWriter(TextWriter output, ToleranceSpec spec)
    {
        ArgumentNullException.ThrowIfNull(spec);
        _out = output;
        var names = new List<string>();
        if (spec.Tolerance.Kind != ToleranceKind.None) names.Add("chromaticity");
        names.AddRange(spec.Limits.Select(l => l.Field));
        _criteria = names.Count;
        var header = new List<string> { "id", "location", "status", "failed", "cct_k", "duv", "x", "y", "u_prime", "v_prime", "ra", "r9", "rf", "rg", "steps_from_target", "delta_uv_from_target" };
        foreach (var n in names) header.AddRange([$"{n}:value", $"{n}:limit", $"{n}:margin", $"{n}:pass"]);
        header.AddRange(["error_line", "error_column", "error"]);
        _out.WriteLine(string.Join(',', header.Select(ResultWriters.Csv)));
    }

    /// <inheritdoc/>
    public override void Write(BatchItem item)
    {
        ArgumentNullException.ThrowIfNull(item);
        var cells = new List<string> { ResultWriters.Csv(item.Record.Name), ResultWriters.Csv(item.Location), item.Status };
        if (item.Result is { } a && item.Verdict is { } v)
        {
            cells.Add(ResultWriters.Csv(string.Join(" | ", v.Criteria.Where(c => !c.Pass).Select(c => c.Criterion))));
            cells.AddRange(new double?[] { a.Cct.CctKelvin, a.Cct.Duv, a.Chromaticity2Degree.X, a.Chromaticity2Degree.Y, a.Chromaticity2Degree.UPrime, a.Chromaticity2Degree.VPrime,
                a.Cri?.Ra, a.Cri?.R9, a.Fidelity?.Rf, a.Fidelity?.Rg, v.StepsFromTarget, v.DeltaUPrimeVPrimeFromTarget }.Select(F));
            foreach (var c in v.Criteria) cells.AddRange([F(c.Measured), ResultWriters.Csv(c.Limit), F(c.Margin), c.Pass ? "yes" : "no"]);
            for (int i = v.Criteria.Count; i < _criteria; i++) cells.AddRange(["", "", "", ""]);
            cells.AddRange(["", "", ""]);
        }
        else
        {
            cells.Add("");
            cells.AddRange(Enumerable.Repeat("", 12 + 4 * _criteria));
            var e = item.Record.Error!;
            cells.AddRange([e.Line.ToString(Inv), e.Column.ToString(Inv), ResultWriters.Csv(e.Message)]);
        }
        _out.WriteLine(string.Join(',', cells));
    }

    /// <inheritdoc/>
    public override void Complete() => _out.Flush();

    private static string F(double? v) => v is { } x && double.IsFinite(x) ? x.ToString("R", Inv) : "";
}

/// <summary>JSON batch rows: an array streamed object by object.</summary>
public sealed class JsonBatchWriter : BatchWriter
{
    private readonly TextWriter _out;
    private bool _first = true;

    /// <summary>Starts the array.</summary>
    /// <param name="output">Destination.</param>
    public JsonBatchWriter(TextWriter output)
    {
        _out = output;
        _out.WriteLine("[");
    }

    /// <inheritdoc/>
    public override void Write(BatchItem item)
    {
        ArgumentNullException.ThrowIfNull(item);
        using var ms = new MemoryStream();
        using (var w = new Utf8JsonWriter(ms, new JsonWriterOptions { Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping }))
        {
            w.WriteStartObject();
            w.WriteString("id", item.Record.Name);
            w.WriteString("location", item.Location);
            w.WriteString("status", item.Status);
            if (item.Result is { } a && item.Verdict is { } v)
            {
                w.WriteStartObject("result");
                Num(w, "cctKelvin", a.Cct.CctKelvin); Num(w, "duv", a.Cct.Duv);
                Num(w, "x", a.Chromaticity2Degree.X); Num(w, "y", a.Chromaticity2Degree.Y);
                Num(w, "uPrime", a.Chromaticity2Degree.UPrime); Num(w, "vPrime", a.Chromaticity2Degree.VPrime);
                Num(w, "ra", a.Cri?.Ra); Num(w, "r9", a.Cri?.R9); Num(w, "rf", a.Fidelity?.Rf); Num(w, "rg", a.Fidelity?.Rg);
                w.WriteEndObject();
                w.WriteStartObject("verdict");
                w.WriteBoolean("pass", v.Pass);
                Num(w, "stepsFromTarget", v.StepsFromTarget);
                Num(w, "deltaUPrimeVPrimeFromTarget", v.DeltaUPrimeVPrimeFromTarget);
                w.WriteStartArray("criteria");
                foreach (var c in v.Criteria)
                {
                    w.WriteStartObject();
                    w.WriteString("criterion", c.Criterion);
                    Num(w, "measured", c.Measured);
                    w.WriteString("limit", c.Limit);
                    Num(w, "margin", c.Margin);
                    w.WriteBoolean("pass", c.Pass);
                    if (c.Note is not null) w.WriteString("note", c.Note);
                    w.WriteEndObject();
                }
                w.WriteEndArray();
                w.WriteEndObject();
                w.WriteStartArray("warnings");
                foreach (var x in a.Warnings) w.WriteStringValue(x);
                w.WriteEndArray();
            }
            else
            {
                var e = item.Record.Error!;
                w.WriteStartObject("error");
                w.WriteNumber("line", e.Line); w.WriteNumber("column", e.Column); w.WriteString("message", e.Message);
                w.WriteEndObject();
            }
            w.WriteEndObject();
        }
        if (!_first) _out.WriteLine(",");
        _first = false;
        _out.Write(System.Text.Encoding.UTF8.GetString(ms.GetBuffer(), 0, (int)ms.Length));
    }

    /// <inheritdoc/>
    public override void Complete()
    {
        _out.WriteLine();
        _out.WriteLine("]");
        _out.Flush();
    }

    private static void Num(Utf8JsonWriter w, string name, double? v)
    {
        if (v is { } x && double.IsFinite(x)) w.WriteNumber(name, x); else w.WriteNull(name);
    }
}

/// <summary>Writes a batch summary as text or JSON.</summary>
public static class BatchSummaryWriter
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>The screening caution printed with every summary.</summary>
    public const string Caution = "A pass here is a screening result on the data given, not a certification: accredited photometric testing, the applicable standards and local codes decide conformance.";

    /// <summary>Writes the summary as text.</summary>
    /// <param name="s">Summary.</param>
    /// <param name="spec">Spec.</param>
    /// <param name="output">Destination.</param>
    public static void WriteText(BatchSummary s, ToleranceSpec spec, TextWriter output)
    {
        ArgumentNullException.ThrowIfNull(s);
        ArgumentNullException.ThrowIfNull(spec);
        ArgumentNullException.ThrowIfNull(output);
        output.WriteLine($"Batch summary — {SpecReader.Describe(spec)}");
        output.WriteLine(string.Create(Inv, $"Records read {s.RecordsRead} = results {s.Results} + errors {s.Errors}"));
        output.WriteLine(string.Create(Inv, $"Pass {s.Passed}, fail {s.Failed}, pass rate {(double.IsNaN(s.PassRate) ? "—" : (s.PassRate * 100).ToString("0.0", Inv) + " %")}"));
        output.WriteLine();
        output.WriteLine($"{"field",-14} {"mean",10} {"SD",10} {"min",10} {"max",10}");
        foreach (var (name, st) in s.Statistics)
            output.WriteLine(string.Create(Inv, $"{name,-14} {G(st.Mean),10} {G(st.StandardDeviation),10} {G(st.Min),10} {G(st.Max),10}"));
        output.WriteLine();
        output.WriteLine(string.Create(Inv, $"Chromaticity: mean u' {s.MeanUPrime:0.00000}, v' {s.MeanVPrime:0.00000}; largest Δu'v' between two units {s.MaxPairwiseDeltaUPrimeVPrime:0.00000}"));
        output.WriteLine(string.Create(Inv, $"Steps from batch mean: mean {G(s.StepsFromMean.Mean)}, 95th percentile {G(s.StepsFromMeanP95)}, max {G(s.StepsFromMean.Max)}"));
        if (s.StepsFromTarget.Count > 0)
            output.WriteLine(string.Create(Inv, $"Steps from target: mean {G(s.StepsFromTarget.Mean)}, 95th percentile {G(s.StepsFromTargetP95)}, max {G(s.StepsFromTarget.Max)}"));
        output.WriteLine();
        output.WriteLine(s.Outliers.Count == 0 ? "Chromaticity outliers (robust z > 3.5): none" : $"Chromaticity outliers (robust z > 3.5): {s.Outliers.Count}");
        foreach (var o in s.Outliers.Take(50)) output.WriteLine(string.Create(Inv, $"  {o.Id}: Δu'v' {o.DeltaUPrimeVPrime:0.00000} from the median, z = {o.RobustZ:0.0}"));
        if (s.Outliers.Count > 50) output.WriteLine($"  … and {s.Outliers.Count - 50} more (see the results file)");
        if (s.Capabilities.Count > 0)
        {
            output.WriteLine();
            output.WriteLine("Process capability (Cpk = min((USL − mean)/3σ, (mean − LSL)/3σ)):");
            foreach (var c in s.Capabilities)
                output.WriteLine(string.Create(Inv, $"  {c.Field,-22} mean {G(c.Mean)}, SD {G(c.StandardDeviation)}, Cpk {G(c.Cpk)}"));
        }
        output.WriteLine();
        output.WriteLine(Caution);
    }

    /// <summary>Writes the summary as JSON.</summary>
    /// <param name="s">Summary.</param>
    /// <param name="spec">Spec.</param>
    /// <param name="output">Destination.</param>
    public static void WriteJson(BatchSummary s, ToleranceSpec spec, TextWriter output)
    {
        ArgumentNullException.ThrowIfNull(s);
        ArgumentNullException.ThrowIfNull(spec);
        ArgumentNullException.ThrowIfNull(output);
        using var ms = new MemoryStream();
        using (var w = new Utf8JsonWriter(ms, new JsonWriterOptions { Indented = true, Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping }))
        {
            w.WriteStartObject();
            w.WriteString("spec", SpecReader.Describe(spec));
            w.WriteNumber("recordsRead", s.RecordsRead);
            w.WriteNumber("results", s.Results);
            w.WriteNumber("errors", s.Errors);
            w.WriteNumber("passed", s.Passed);
            w.WriteNumber("failed", s.Failed);
            Num(w, "passRate", s.PassRate);
            w.WriteStartObject("statistics");
            foreach (var (name, st) in s.Statistics)
            {
                w.WriteStartObject(name);
                w.WriteNumber("count", st.Count); Num(w, "mean", st.Mean); Num(w, "sd", st.StandardDeviation); Num(w, "min", st.Min); Num(w, "max", st.Max);
                w.WriteEndObject();
            }
            w.WriteEndObject();
            w.WriteStartObject("chromaticity");
            Num(w, "meanUPrime", s.MeanUPrime); Num(w, "meanVPrime", s.MeanVPrime);
            Num(w, "maxPairwiseDeltaUPrimeVPrime", s.MaxPairwiseDeltaUPrimeVPrime);
            Num(w, "stepsFromMeanMean", s.StepsFromMean.Mean); Num(w, "stepsFromMeanP95", s.StepsFromMeanP95); Num(w, "stepsFromMeanMax", s.StepsFromMean.Max);
            Num(w, "stepsFromTargetMean", s.StepsFromTarget.Mean); Num(w, "stepsFromTargetP95", s.StepsFromTargetP95); Num(w, "stepsFromTargetMax", s.StepsFromTarget.Max);
            w.WriteEndObject();
            w.WriteStartArray("outliers");
            foreach (var o in s.Outliers)
            {
                w.WriteStartObject(); w.WriteString("id", o.Id); Num(w, "deltaUPrimeVPrime", o.DeltaUPrimeVPrime); Num(w, "robustZ", o.RobustZ); w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteStartArray("capability");
            foreach (var c in s.Capabilities)
            {
                w.WriteStartObject(); w.WriteString("field", c.Field);
                if (c.Lower is { } lo) w.WriteNumber("min", lo);
                if (c.Upper is { } hi) w.WriteNumber("max", hi);
                Num(w, "mean", c.Mean); Num(w, "sd", c.StandardDeviation); Num(w, "cpk", c.Cpk);
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteString("caution", Caution);
            w.WriteEndObject();
        }
        output.WriteLine(System.Text.Encoding.UTF8.GetString(ms.ToArray()));
    }

    private static void Num(Utf8JsonWriter w, string name, double v)
    {
        if (double.IsFinite(v)) w.WriteNumber(name, v); else w.WriteNull(name);
    }

    private static string G(double v) => double.IsFinite(v) ? v.ToString("0.####", Inv) : "—";
}

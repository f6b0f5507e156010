using System.Globalization;
using Lumen.Conformance;
using Lumen.BatchStatistics;

namespace Lumen.Formats;

/// <summary>Writes a batch summary as text or JSON.</summary>
public static class BatchSummaryWriter
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;


    /// <summary>Writes the summary as text.</summary>
    /// <param name="s">Summary.</param>
    /// <param name="spec">Spec.</param>
    /// <param name="output">Destination.</param>
    public static void WriteText(BatchSummary s, PreparedSpec spec, TextWriter output)
    {
        ArgumentNullException.ThrowIfNull(s);
        ArgumentNullException.ThrowIfNull(spec);
        ArgumentNullException.ThrowIfNull(output);
        output.WriteLine($"Batch summary — {spec.Spec.Description}");
        if (spec.TargetDescription is { } target) output.WriteLine($"Target: {target}");
        foreach (var c in spec.Cautions) output.WriteLine($"! {c}");
        output.WriteLine(string.Create(Inv, $"Records read {s.RecordsRead} = results {s.Results} + errors {s.Errors}"));
        output.WriteLine(string.Create(Inv, $"Pass {s.Passed}, fail {s.Failed}{(s.Rule == Lumen.Uncertainty.DecisionRule.Guarded ? $", inconclusive {s.Inconclusive}" : "")}, pass rate {(double.IsNaN(s.PassRate) ? "—" : (s.PassRate * 100).ToString("0.0", Inv) + " %")}"));
        output.WriteLine($"Decision rule: {Lumen.Uncertainty.Decisions.Describe(s.Rule)}.");
        output.WriteLine();
        output.WriteLine($"{"field",-14} {"mean",10} {"SD",10} {"min",10} {"max",10}");
        foreach (var (name, st) in s.Statistics)
            output.WriteLine(string.Create(Inv, $"{name,-14} {G(st.Mean),10} {G(st.StandardDeviation),10} {G(st.Min),10} {G(st.Max),10}"));
        var missing = s.Statistics.Where(kv => kv.Value.Count == 0).Select(kv => kv.Key).ToList();
        if (missing.Count > 0 && s.Results > 0)
            output.WriteLine($"({string.Join(", ", missing)} not computed: the spec does not limit them; add --metrics all to include them.)");
        output.WriteLine();
        output.WriteLine(string.Create(Inv, $"Chromaticity: mean u' {s.MeanUPrime:0.00000}, v' {s.MeanVPrime:0.00000}; largest Δu'v' between two units {s.MaxPairwiseDeltaUPrimeVPrime:0.00000}"));
        output.WriteLine(string.Create(Inv, $"Steps from batch mean: mean {G(s.StepsFromMean.Mean)}, 95th percentile {G(s.StepsFromMeanP95)}, max {G(s.StepsFromMean.Max)}"));
        if (s.StepsFromTarget.Count > 0)
            output.WriteLine(string.Create(Inv, $"Steps from target: mean {G(s.StepsFromTarget.Mean)}, 95th percentile {G(s.StepsFromTargetP95)}, max {G(s.StepsFromTarget.Max)}"));
        output.WriteLine();
        output.WriteLine(s.Outliers.Count == 0 ? "Chromaticity outliers (robust z > 3.5): none" : $"Chromaticity outliers (robust z > 3.5): {s.Outliers.Count}");
        foreach (var o in s.Outliers.Take(50)) output.WriteLine(string.Create(Inv, $"  {o.Id}: Δu'v' {o.DeltaUPrimeVPrime:0.00000} from the median, z = {o.RobustZ:0.0}"));
        if (s.Outliers.Count > 50) output.WriteLine($"  … and {s.Outliers.Count - 50} more (a JSON summary, --summary NAME.json, lists all)");
        WriteCapabilityText(s, output);
        if (s.Groups.Count > 0)
        {
            output.WriteLine();
            output.WriteLine($"By '{s.GroupedBy}' ({s.Groups.Count} groups; each as a separate batch of its records would give it):");
            foreach (var g in s.Groups)
            {
                var x = g.Summary;
                output.WriteLine(string.Create(Inv, $"  {(g.Value.Length == 0 ? "(none)" : g.Value)}: records {x.RecordsRead} (errors {x.Errors}), pass {x.Passed}, fail {x.Failed}, pass rate {(double.IsNaN(x.PassRate) ? "—" : (x.PassRate * 100).ToString("0.0", Inv) + " %")}, outliers {x.Outliers.Count}"));
                foreach (var c in x.Capabilities)
                    output.WriteLine(string.Create(Inv, $"      {c.Field,-22} mean {G(c.Mean)}, SD {G(c.StandardDeviation)}, Ppk {P(c.Ppk)} ({P(c.PpkLower95)} to {P(c.PpkUpper95)}){(c.Within is { } w ? $", Cpk {P(w.Cpk)} ({P(w.CpkLower95)} to {P(w.CpkUpper95)})" : "")}"));
            }
        }
        output.WriteLine();
        output.WriteLine(BatchSummary.Caution);
    }

    private static void WriteCapabilityText(BatchSummary s, TextWriter output)
    {
        if (s.Capabilities.Count == 0) return;
        output.WriteLine();
        output.WriteLine("Process performance (Ppk = min((USL − mean)/3s, (mean − LSL)/3s), s = overall SD; 95 % interval after Bissell 1990, approximate):");
        foreach (var c in s.Capabilities)
            output.WriteLine(string.Create(Inv, $"  {c.Field,-22} n {c.Count}, mean {G(c.Mean)}, SD {G(c.StandardDeviation)}, Ppk {P(c.Ppk)} (95 %: {P(c.PpkLower95)} to {P(c.PpkUpper95)})"));
        if (s.SubgroupRule is null)
        {
            output.WriteLine("  (No Cpk: it needs subgroups; give --subgroup-size N or --group-by COLUMN.)");
            return;
        }
        output.WriteLine($"Process capability (Cpk: as Ppk with s = pooled within-subgroup SD; {s.SubgroupRule}; 95 % interval after Bissell with the pooled degrees of freedom):");
        foreach (var c in s.Capabilities)
            if (c.Within is { } w)
                output.WriteLine(string.Create(Inv, $"  {c.Field,-22} {w.Subgroups} subgroups, within SD {G(w.StandardDeviation)} (ν = {w.DegreesOfFreedom}), Cpk {P(w.Cpk)} (95 %: {P(w.CpkLower95)} to {P(w.CpkUpper95)})"));
    }

    /// <summary>Writes the summary as JSON.</summary>
    /// <param name="s">Summary.</param>
    /// <param name="spec">Spec.</param>
    /// <param name="output">Destination.</param>
    public static void WriteJson(BatchSummary s, PreparedSpec spec, TextWriter output)
    {
        ArgumentNullException.ThrowIfNull(s);
        ArgumentNullException.ThrowIfNull(spec);
        ArgumentNullException.ThrowIfNull(output);
        JsonOutput.Write(output, w =>
        {
            w.WriteStartObject();
            w.WriteString("spec", spec.Spec.Description);
            JsonTarget.Write(w, spec);
            WriteBody(w, s);
            if (s.GroupedBy is { } by)
            {
                w.WriteString("groupedBy", by);
                w.WriteStartArray("groups");
                foreach (var g in s.Groups)
                {
                    w.WriteStartObject();
                    w.WriteString("value", g.Value);
                    WriteBody(w, g.Summary);
                    w.WriteEndObject();
                }
                w.WriteEndArray();
            }
            w.WriteString("caution", BatchSummary.Caution);
            w.WriteEndObject();
        });
    }

    /// <summary>The body of a summary object (shared by the batch and each of its groups, so both read alike).</summary>
    private static void WriteBody(System.Text.Json.Utf8JsonWriter w, BatchSummary s)
    {
        w.WriteNumber("recordsRead", s.RecordsRead);
        w.WriteNumber("results", s.Results);
        w.WriteNumber("errors", s.Errors);
        w.WriteNumber("passed", s.Passed);
        w.WriteNumber("failed", s.Failed);
        w.WriteNumber("inconclusive", s.Inconclusive);
        w.WriteString("rule", Lumen.Uncertainty.Decisions.Describe(s.Rule));
        w.NumberOrNull("passRate", s.PassRate);
        w.WriteStartObject("statistics");
        foreach (var (name, st) in s.Statistics)
        {
            w.WriteStartObject(name);
            w.WriteNumber("count", st.Count); w.NumberOrNull("mean", st.Mean); w.NumberOrNull("sd", st.StandardDeviation); w.NumberOrNull("min", st.Min); w.NumberOrNull("max", st.Max);
            w.WriteEndObject();
        }
        w.WriteEndObject();
        w.WriteStartObject("chromaticity");
        w.NumberOrNull("meanUPrime", s.MeanUPrime); w.NumberOrNull("meanVPrime", s.MeanVPrime);
        w.NumberOrNull("maxPairwiseDeltaUPrimeVPrime", s.MaxPairwiseDeltaUPrimeVPrime);
        w.NumberOrNull("stepsFromMeanMean", s.StepsFromMean.Mean); w.NumberOrNull("stepsFromMeanP95", s.StepsFromMeanP95); w.NumberOrNull("stepsFromMeanMax", s.StepsFromMean.Max);
        w.NumberOrNull("stepsFromTargetMean", s.StepsFromTarget.Mean); w.NumberOrNull("stepsFromTargetP95", s.StepsFromTargetP95); w.NumberOrNull("stepsFromTargetMax", s.StepsFromTarget.Max);
        w.WriteEndObject();
        w.WriteStartArray("outliers");
        foreach (var o in s.Outliers)
        {
            w.WriteStartObject(); w.WriteString("id", o.Id); w.NumberOrNull("deltaUPrimeVPrime", o.DeltaUPrimeVPrime); w.NumberOrNull("robustZ", o.RobustZ); w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteStartArray("capability");
        foreach (var c in s.Capabilities)
        {
            w.WriteStartObject(); w.WriteString("field", c.Field);
            if (c.Lower is { } lo) w.NumberOrNull("min", lo);
            if (c.Upper is { } hi) w.NumberOrNull("max", hi);
            w.WriteNumber("n", c.Count); w.NumberOrNull("mean", c.Mean); w.NumberOrNull("sd", c.StandardDeviation);
            w.NumberOrNull("ppk", c.Ppk); w.NumberOrNull("ppkLower95", c.PpkLower95); w.NumberOrNull("ppkUpper95", c.PpkUpper95);
            if (c.Within is { } within)
            {
                w.WriteStartObject("within");
                w.WriteNumber("subgroups", within.Subgroups); w.WriteNumber("degreesOfFreedom", within.DegreesOfFreedom);
                w.NumberOrNull("sd", within.StandardDeviation);
                w.NumberOrNull("cpk", within.Cpk); w.NumberOrNull("cpkLower95", within.CpkLower95); w.NumberOrNull("cpkUpper95", within.CpkUpper95);
                w.WriteEndObject();
            }
            w.WriteEndObject();
        }
        w.WriteEndArray();
        if (s.SubgroupRule is { } rule) w.WriteString("subgroups", rule);
    }

    private static string P(double v) => double.IsFinite(v) ? v.ToString("0.00", Inv) : "—";

    private static string G(double v) => double.IsFinite(v) ? v.ToString("0.####", Inv) : "—";
}

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
        if (s.Outliers.Count > 50) output.WriteLine($"  … and {s.Outliers.Count - 50} more (a JSON summary, --summary NAME.json, lists all)");
        if (s.Capabilities.Count > 0)
        {
            output.WriteLine();
            output.WriteLine("Process performance (Ppk = min((USL − mean)/3s, (mean − LSL)/3s), s = overall SD; 95 % interval after Bissell 1990, approximate):");
            foreach (var c in s.Capabilities)
                output.WriteLine(string.Create(Inv, $"  {c.Field,-22} n {c.Count}, mean {G(c.Mean)}, SD {G(c.StandardDeviation)}, Ppk {P(c.Ppk)} (95 %: {P(c.PpkLower95)} to {P(c.PpkUpper95)})"));
        }
        output.WriteLine();
        output.WriteLine(BatchSummary.Caution);
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
            w.WriteNumber("recordsRead", s.RecordsRead);
            w.WriteNumber("results", s.Results);
            w.WriteNumber("errors", s.Errors);
            w.WriteNumber("passed", s.Passed);
            w.WriteNumber("failed", s.Failed);
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
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteString("caution", BatchSummary.Caution);
            w.WriteEndObject();
        });
    }

    private static string P(double v) => double.IsFinite(v) ? v.ToString("0.00", Inv) : "—";

    private static string G(double v) => double.IsFinite(v) ? v.ToString("0.####", Inv) : "—";
}

using System.Globalization;
using System.Text.Json;
using Lumen.Mixing;

namespace Lumen.Formats;

/// <summary>Writes <c>lumen mix</c> results as text, JSON or CSV (one object or row per target; fields in the README).</summary>
public static class MixWriter
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>The CSV schema for a set of channels: the target, one level column per channel, then the results.</summary>
    /// <param name="channels">The channel names.</param>
    /// <returns>The schema.</returns>
    public static ColumnSchema<MixResult> Csv(IReadOnlyList<string> channels)
    {
        ArgumentNullException.ThrowIfNull(channels);
        var c = new List<Column<MixResult>>
        {
            Column<MixResult>.Number("target_x", r => r.Target.SmallX, "0.0000"),
            Column<MixResult>.Number("target_y", r => r.Target.SmallY, "0.0000"),
        };
        for (int i = 0; i < channels.Count; i++)
        {
            int k = i;
            c.Add(Column<MixResult>.Number($"level_{channels[k]}", r => r.Levels[k], "0.000", channels[k]));
        }
        c.AddRange(
        [
            Column<MixResult>.Number("chromaticity.x", r => r.Chromaticity.SmallX, "0.0000", "x"),
            Column<MixResult>.Number("chromaticity.y", r => r.Chromaticity.SmallY, "0.0000", "y"),
            Column<MixResult>.Number("chromaticity.uPrime", r => r.Chromaticity.UPrime, "0.0000", "u'"),
            Column<MixResult>.Number("chromaticity.vPrime", r => r.Chromaticity.VPrime, "0.0000", "v'"),
            Column<MixResult>.Number("cct.kelvin", r => r.Cct.CctKelvin, "0", "CCT (K)"),
            Column<MixResult>.Number("cct.duv", r => r.Cct.Duv, "+0.0000;-0.0000;0.0000", "Duv"),
            Column<MixResult>.Number("delta_u_prime_v_prime", r => r.DeltaUPrimeVPrime, "0.0000", "Δu'v'"),
            Column<MixResult>.Text("reachable", r => r.Reachable ? "yes" : "no"),
            Column<MixResult>.Number("objective_value", r => r.ObjectiveValue, "0.0##", "objective"),
            Column<MixResult>.Number("cri.ra", r => r.Metrics.Ra, "0.0", "Ra"),
            Column<MixResult>.Number("cri.r9", r => r.Metrics.R9, "0.0", "R9"),
            Column<MixResult>.Number("fidelity.rf", r => r.Metrics.Rf, "0.0", "Rf"),
            Column<MixResult>.Number("fidelity.rg", r => r.Metrics.Rg, "0.0", "Rg"),
            Column<MixResult>.Number("photometry.ler", r => r.Metrics.LerLumensPerWatt, "0", "LER"),
            Column<MixResult>.Number("relative_output", r => r.Metrics.RelativeOutput, "0.000", "output"),
            Column<MixResult>.Number("nonVisual.melanopic.der", r => r.Metrics.MelanopicDer, "0.000", "mel DER"),
            Column<MixResult>.Number("ssi", r => r.Metrics.Ssi, "0", "SSI"),
            Column<MixResult>.Number("iterations", r => r.Iterations, "0"),
        ]);
        return new ColumnSchema<MixResult>(c);
    }

    /// <summary>Writes one result or a sweep.</summary>
    /// <param name="items">The results (one per target).</param>
    /// <param name="format">Text, JSON or CSV.</param>
    /// <param name="output">Destination.</param>
    /// <param name="sweep">True for a sweep (JSON array; text table); false for a single target (JSON object; text block).</param>
    public static void Write(IReadOnlyList<MixResult> items, OutputFormat format, TextWriter output, bool sweep)
    {
        ArgumentNullException.ThrowIfNull(items);
        ArgumentNullException.ThrowIfNull(output);
        if (items.Count == 0) return;
        if (format == OutputFormat.Json && !sweep) { JsonOutput.Write(output, w => WriteJson(w, items[0])); return; }
        FormattedOutput.Write(items, format, output, WriteJson, Csv(items[0].Channels), (all, o) => WriteText(all, o, sweep));
    }

    private static void WriteText(IReadOnlyList<MixResult> items, TextWriter o, bool sweep)
    {
        if (sweep)
        {
            Csv(items[0].Channels).WriteTable(o, items);
        }
        else
        {
            var r = items[0];
            static string N(double v, string f) => double.IsFinite(v) ? v.ToString(f, Inv) : "—";
            o.WriteLine(string.Create(Inv, $"Target: x {r.Target.SmallX:0.0000}, y {r.Target.SmallY:0.0000} — {(r.Reachable ? "reachable" : "NOT reachable with these channels")}"));
            o.WriteLine();
            for (int i = 0; i < r.Channels.Count; i++)
                o.WriteLine(string.Create(Inv, $"  {r.Channels[i],-16} {r.Levels[i],6:0.000}  ({r.Levels[i] * 100,5:0.0} %)"));
            o.WriteLine();
            o.WriteLine($"Mix: x {N(r.Chromaticity.SmallX, "0.0000")}, y {N(r.Chromaticity.SmallY, "0.0000")}, CCT {N(r.Cct.CctKelvin, "0")} K, Duv {N(r.Cct.Duv, "+0.0000;-0.0000;0.0000")}, Δu'v' to target {N(r.DeltaUPrimeVPrime, "0.00000")}");
            o.WriteLine($"     Ra {N(r.Metrics.Ra, "0.0")}, R9 {N(r.Metrics.R9, "0.0")}, Rf {N(r.Metrics.Rf, "0.0")}, Rg {N(r.Metrics.Rg, "0.0")}, LER {N(r.Metrics.LerLumensPerWatt, "0")} lm/W, output {N(r.Metrics.RelativeOutput * 100, "0.0")} % of all channels at full, melanopic DER {N(r.Metrics.MelanopicDer, "0.000")}{(r.Metrics.Ssi is { } ssi ? $", SSI {ssi}" : "")}");
            o.WriteLine($"Objective: {Name(r.Objective)} = {N(r.ObjectiveValue, "0.###")}");
            o.WriteLine($"Method: {r.Method}{(r.Iterations > 0 ? $" ({r.Iterations} evaluations)" : "")}.");
        }
        foreach (var w in items.SelectMany(i => i.Warnings).Distinct()) o.WriteLine($"! {w}");
    }

    /// <summary>The objective's name as the command line and the JSON write it.</summary>
    /// <param name="objective">The objective.</param>
    /// <returns>For example <c>maximize rf</c>.</returns>
    public static string Name(MixObjective objective) => objective switch
    {
        MixObjective.MaximizeRf => "maximize rf",
        MixObjective.MaximizeRa => "maximize ra",
        MixObjective.MaximizeR9 => "maximize r9",
        MixObjective.MaximizeSsi => "maximize ssi",
        MixObjective.MaximizeOutput => "maximize output",
        MixObjective.MaximizeMelanopicDer => "maximize melanopic-der",
        _ => "minimize melanopic-der",
    };

    private static void WriteJson(Utf8JsonWriter w, MixResult r)
    {
        w.WriteStartObject();
        w.WriteStartObject("levels");
        for (int i = 0; i < r.Channels.Count; i++) w.NumberOrNull(r.Channels[i], r.Levels[i]);
        w.WriteEndObject();
        w.WriteStartObject("levelsPercent");
        for (int i = 0; i < r.Channels.Count; i++) w.NumberOrNull(r.Channels[i], Math.Round(100 * r.Levels[i], 2));
        w.WriteEndObject();
        w.WriteStartObject("chromaticity");
        w.NumberOrNull("x", r.Chromaticity.SmallX); w.NumberOrNull("y", r.Chromaticity.SmallY);
        w.NumberOrNull("uPrime", r.Chromaticity.UPrime); w.NumberOrNull("vPrime", r.Chromaticity.VPrime);
        w.WriteEndObject();
        w.WriteStartObject("cct");
        w.NumberOrNull("kelvin", r.Cct.CctKelvin); w.NumberOrNull("duv", r.Cct.Duv);
        w.WriteEndObject();
        w.WriteStartObject("target");
        w.NumberOrNull("x", r.Target.SmallX); w.NumberOrNull("y", r.Target.SmallY);
        w.NumberOrNull("uPrime", r.Target.UPrime); w.NumberOrNull("vPrime", r.Target.VPrime);
        w.WriteEndObject();
        w.NumberOrNull("deltaUPrimeVPrime", r.DeltaUPrimeVPrime);
        w.WriteBoolean("reachable", r.Reachable);
        w.WriteStartObject("objective");
        w.WriteString("name", Name(r.Objective));
        w.NumberOrNull("value", r.ObjectiveValue);
        w.WriteEndObject();
        w.WriteStartObject("metrics");
        w.NumberOrNull("cri.ra", r.Metrics.Ra); w.NumberOrNull("cri.r9", r.Metrics.R9); w.NumberOrNull("fidelity.rf", r.Metrics.Rf); w.NumberOrNull("fidelity.rg", r.Metrics.Rg);
        w.NumberOrNull("lerLmPerW", r.Metrics.LerLumensPerWatt); w.NumberOrNull("relativeOutput", r.Metrics.RelativeOutput);
        w.NumberOrNull("melanopicDer", r.Metrics.MelanopicDer); w.NumberOrNull("ssi", r.Metrics.Ssi);
        w.WriteEndObject();
        w.WriteString("method", r.Method);
        w.WriteNumber("iterations", r.Iterations);
        w.StringArray("warnings", r.Warnings);
        w.WriteEndObject();
    }
}

using System.Globalization;
using System.Text.Json;
using Lumen.Comparison;

namespace Lumen.Formats;

/// <summary>Writes <c>lumen compare</c> results as text, JSON or CSV (fields documented in the README).</summary>
public static class ComparisonWriter
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>The flat CSV schema: one row per compared source.</summary>
    public static ColumnSchema<SourceComparison> Csv { get; } = new(
    [
        Column<SourceComparison>.Text("reference", c => c.Reference.Name),
        Column<SourceComparison>.Text("source", c => c.Source.Name),
        Column<SourceComparison>.Number("delta_u_prime_v_prime", c => c.DeltaUPrimeVPrime, "0.0000", "Δu'v'"),
        Column<SourceComparison>.Number("reference_cct_k", c => c.Reference.Cct.CctKelvin, "0"),
        Column<SourceComparison>.Number("source_cct_k", c => c.Source.Cct.CctKelvin, "0", "CCT (K)"),
        Column<SourceComparison>.Number("delta_k", c => c.DeltaKelvin, "+0;-0;0"),
        Column<SourceComparison>.Number("delta_mired", c => c.DeltaMired, "+0;-0;0"),
        Column<SourceComparison>.Number("reference_duv", c => c.Reference.Cct.Duv, "+0.0000;-0.0000;0.0000"),
        Column<SourceComparison>.Number("source_duv", c => c.Source.Cct.Duv, "+0.0000;-0.0000;0.0000", "Duv"),
        Column<SourceComparison>.Number("delta_duv", c => c.DeltaDuv, "+0.0000;-0.0000;0.0000"),
        Column<SourceComparison>.Number("mired_shift", c => c.Correction.MiredShift, "+0;-0;0", "fix MK⁻¹"),
        Column<SourceComparison>.Number("duv_shift", c => c.Correction.DuvShift, "+0.0000;-0.0000;0.0000", "fix Duv"),
        Column<SourceComparison>.Text("correction", c => c.Correction.Description),
        Column<SourceComparison>.Text("best_filter", c => c.Filters.Count > 0 ? c.Filters[0].Name : null),
        Column<SourceComparison>.Number("best_filter_residual", c => c.Filters.Count > 0 ? c.Filters[0].ResidualDeltaUPrimeVPrime : null, "0.0000"),
        Column<SourceComparison>.Number("mean_delta_e00", c => c.SampleShift?.MeanDeltaE00, "0.00", "ΔE00 mean"),
        Column<SourceComparison>.Number("max_delta_e00", c => c.SampleShift?.MaxDeltaE00, "0.00", "ΔE00 max"),
        Column<SourceComparison>.Number("worst_sample", c => c.SampleShift is { Worst.Count: > 0 } s ? s.Worst[0].Sample : null, "0"),
        Column<SourceComparison>.Number("tcs13_delta_e00", c => c.SampleShift?.Tcs13DeltaE00, "0.00", "skin ΔE00"),
        Column<SourceComparison>.Number("ssi", c => c.Ssi.Value, "0", "SSI"),
        Column<SourceComparison>.Number("ssi_unrounded", c => c.Ssi.Unrounded, "0.00"),
        Column<SourceComparison>.Number("ssi_source_default", c => c.Ssi.SourceToDefaultReference, "0"),
        Column<SourceComparison>.Number("ssi_reference_default", c => c.Ssi.ReferenceToDefaultReference, "0"),
        Column<SourceComparison>.Text("warnings", c => string.Join(" | ", c.Warnings)),
    ]);

    private static readonly ColumnSchema<SourceComparison> Table = new(
    [
        Column<SourceComparison>.Text("source", c => c.Source.Name, "Source"),
        Column<SourceComparison>.Number("source_cct_k", c => c.Source.Cct.CctKelvin, "0", "CCT (K)"),
        Column<SourceComparison>.Number("source_duv", c => c.Source.Cct.Duv, "+0.0000;-0.0000;0.0000", "Duv"),
        Column<SourceComparison>.Number("delta_u_prime_v_prime", c => c.DeltaUPrimeVPrime, "0.0000", "Δu'v'"),
        Column<SourceComparison>.Number("mired_shift", c => c.Correction.MiredShift, "+0;-0;0", "fix MK⁻¹"),
        Column<SourceComparison>.Number("duv_shift", c => c.Correction.DuvShift, "+0.0000;-0.0000;0.0000", "fix Duv"),
        Column<SourceComparison>.Number("mean_delta_e00", c => c.SampleShift?.MeanDeltaE00, "0.00", "ΔE00 mean"),
        Column<SourceComparison>.Number("max_delta_e00", c => c.SampleShift?.MaxDeltaE00, "0.00", "ΔE00 max"),
        Column<SourceComparison>.Number("tcs13_delta_e00", c => c.SampleShift?.Tcs13DeltaE00, "0.00", "skin ΔE00"),
        Column<SourceComparison>.Number("ssi", c => c.Ssi.Value, "0", "SSI"),
    ]);

    /// <summary>Writes the comparisons.</summary>
    /// <param name="items">One comparison per other source, in input order.</param>
    /// <param name="format">Text, JSON or CSV.</param>
    /// <param name="output">Destination.</param>
    public static void Write(IReadOnlyList<SourceComparison> items, OutputFormat format, TextWriter output)
    {
        FormattedOutput.Write(items, format, output, WriteJson, Csv, WriteText);
    }

    private static void WriteText(IReadOnlyList<SourceComparison> items, TextWriter output)
    {
        if (items.Count == 0) { output.WriteLine("Nothing to compare: give a reference and at least one other source."); return; }
        var r = items[0].Reference;
        output.WriteLine(string.Create(Inv, $"Reference: {r.Name} — CCT {N(r.Cct.CctKelvin, "0")} K, Duv {N(r.Cct.Duv, "+0.0000;-0.0000;0.0000")}, u'v' ({N(r.Chromaticity2Degree.UPrime, "0.0000")}, {N(r.Chromaticity2Degree.VPrime, "0.0000")})"));
        output.WriteLine();
        Table.WriteTable(output, items);
        output.WriteLine();
        foreach (var c in items)
        {
            output.WriteLine($"{c.Source.Name}: {c.Correction.Description}.");
            if (c.Filters.Count > 0)
                output.WriteLine("  filters, best first: " + string.Join("; ", c.Filters.Take(5).Select(f => string.Create(Inv, $"{f.Name} → Δu'v' {f.ResidualDeltaUPrimeVPrime:0.0000} ({f.Transmission * 100:0} % transmission{(f.Percent ? ", read as %" : "")})"))));
            if (c.SampleShift is { } s && s.Worst.Count > 0)
                output.WriteLine("  colours that shift most: " + string.Join(", ", s.Worst.Take(3).Select(p => string.Create(Inv, $"CES{p.Sample} ΔE00 {p.DeltaE00:0.0}"))));
            foreach (var w in c.Warnings) output.WriteLine($"  ! {w}");
        }
        output.WriteLine();
        output.WriteLine("fix MK⁻¹ > 0: warm the source (amber filter); < 0: cool it. fix Duv > 0: add green; < 0: add magenta.");
        output.WriteLine("ΔE00: object colours after white balance on each source (CAT16 to D65, CIEDE2000), mean and max over the 99 CIE 224 samples; skin = CIE 13.3 TCS13.");
        output.WriteLine("SSI: Academy Spectral Similarity Index of the source against the reference (100 = same spectral shape).");
    }

    private static void WriteJson(Utf8JsonWriter w, SourceComparison c)
    {
        w.WriteStartObject();
        w.WriteString("reference", c.Reference.Name);
        w.WriteString("source", c.Source.Name);
        w.NumberOrNull("deltaUPrimeVPrime", c.DeltaUPrimeVPrime);
        w.WriteStartObject("cct");
        w.NumberOrNull("reference", c.Reference.Cct.CctKelvin); w.NumberOrNull("source", c.Source.Cct.CctKelvin);
        w.NumberOrNull("deltaKelvin", c.DeltaKelvin); w.NumberOrNull("deltaMired", c.DeltaMired);
        w.WriteEndObject();
        w.WriteStartObject("duv");
        w.NumberOrNull("reference", c.Reference.Cct.Duv); w.NumberOrNull("source", c.Source.Cct.Duv); w.NumberOrNull("delta", c.DeltaDuv);
        w.WriteEndObject();
        w.WriteStartObject("correction");
        w.NumberOrNull("miredShift", c.Correction.MiredShift);
        w.NumberOrNull("duvShift", c.Correction.DuvShift);
        w.WriteString("description", c.Correction.Description);
        w.WriteStartArray("filters");
        foreach (var f in c.Filters)
        {
            w.WriteStartObject();
            w.WriteString("name", f.Name);
            w.StringArray("stack", f.Filters);
            w.NumberOrNull("residualDeltaUPrimeVPrime", f.ResidualDeltaUPrimeVPrime);
            w.NumberOrNull("cctKelvin", f.CctKelvin);
            w.NumberOrNull("duv", f.Duv);
            w.NumberOrNull("miredShift", f.MiredShift);
            w.NumberOrNull("transmission", f.Transmission);
            w.WriteString("transmittanceScale", f.Percent ? "percent" : "fraction");
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteEndObject();
        if (c.SampleShift is { } s)
        {
            w.WriteStartObject("sampleShift");
            w.WriteString("method", s.Method);
            w.NumberOrNull("meanDeltaE00", s.MeanDeltaE00);
            w.NumberOrNull("maxDeltaE00", s.MaxDeltaE00);
            w.WriteStartArray("worst");
            foreach (var (sample, de) in s.Worst)
            {
                w.WriteStartObject();
                w.WriteNumber("sample", sample);
                w.NumberOrNull("deltaE00", de);
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.NumberOrNull("tcs13DeltaE00", s.Tcs13DeltaE00);
            w.WriteEndObject();
        }
        else w.WriteNull("sampleShift");
        w.WriteStartObject("ssi");
        w.NumberOrNull("value", c.Ssi.Value);
        w.NumberOrNull("unrounded", c.Ssi.Unrounded);
        w.NumberOrNull("sourceToDefaultReference", c.Ssi.SourceToDefaultReference);
        w.NumberOrNull("referenceToDefaultReference", c.Ssi.ReferenceToDefaultReference);
        w.WriteString("defaultReference", "Planckian below 4000 K, CIE daylight from 4000 K, at each source's CCT (from memory)");
        w.WriteEndObject();
        w.StringArray("warnings", c.Warnings);
        w.WriteStartObject("provenance");
        w.WriteString("deltaUPrimeVPrime", "CIE 1976 u′v′, CIE 1931 2° observer (CIE 15:2018)");
        w.WriteString("cct", "nearest point of the Planckian locus in CIE 1960 uv (CIE 15), c2 = 1.4388e-2 m·K");
        w.WriteString("correction", "mired shift = M(reference) − M(source), positive = warming; Duv shift = Duv(reference) − Duv(source), positive = green");
        w.WriteString("sampleShift", c.SampleShift?.Method ?? SampleShift.Method);
        w.WriteString("ssi", "Academy Spectral Similarity Index (2016), 375–675 nm in 10 nm bins");
        w.WriteEndObject();
        w.WriteEndObject();
    }

    private static string N(double v, string f) => double.IsFinite(v) ? v.ToString(f, Inv) : "—";
}

using Lumen.Rendition;
using Lumen.Spectra;
using System.Globalization;
using System.Net;
using System.Text;
using Lumen.Conformance;
using Lumen.Analysis;
using Lumen.BatchStatistics;

namespace Lumen.Graphics;

/// <summary>
/// A self-contained HTML report (inline SVG and CSS, no scripts, nothing fetched): one source in full, or a
/// batch with summary, pass/fail table, spread plot, histograms, outliers and per-unit detail.
/// </summary>
public static class HtmlReport
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Units detailed in full in a batch report (the table lists more).</summary>
    public const int DetailLimit = 20;

    /// <summary>Rows listed in the batch table.</summary>
    public const int TableLimit = 2000;

    private const string Css = """
        body{font-family:"DejaVu Sans",Verdana,sans-serif;color:#22262b;margin:0;background:#f4f5f7}
        main{max-width:1280px;margin:0 auto;padding:24px 32px;background:#fff}
        h1{font-size:26px;margin:8px 0 4px} h2{font-size:20px;margin:28px 0 8px;border-bottom:2px solid #e3e6ea;padding-bottom:4px}
        h3{font-size:16px;margin:18px 0 6px}
        table{border-collapse:collapse;margin:8px 0;font-size:14px} th,td{border:1px solid #e3e6ea;padding:4px 8px;text-align:right}
        th{background:#f0f2f5;text-align:left} td.t{text-align:left}
        .pass{color:#1f6f8b;font-weight:bold} .fail{color:#c2410c;font-weight:bold} .error{color:#8a2b6e;font-weight:bold}
        .caution{background:#fff7e6;border-left:4px solid #e0a030;padding:8px 12px;margin:12px 0;font-size:14px}
        .warn{background:#fdeeee;border-left:4px solid #c2410c;padding:6px 12px;margin:6px 0;font-size:14px}
        .muted{color:#6b727a;font-size:13px} figure{margin:12px 0} svg{max-width:100%;height:auto;border:1px solid #e3e6ea}
        .grid{display:grid;grid-template-columns:1fr 1fr;gap:12px}
        """;

    /// <summary>Escapes text for HTML (every name from a file goes through this).</summary>
    /// <param name="text">Text.</param>
    /// <returns>HTML-safe text.</returns>
    public static string E(string text) => WebUtility.HtmlEncode(text);

    private static string F(double? v, string format = "0.####")
    {
        if (v is not { } x || !double.IsFinite(x)) return "—";
        var t = x.ToString(format, Inv);
        return t.StartsWith('-') && t.Trim('-', '0', '.').Length == 0 ? t[1..] : t; // no "-0"
    }

    private static string InlineSvg(int w, int h, Action<SkiaSharp.SKCanvas, SkiaSharp.SKSize> draw, string id, string label)
    {
        var svg = Render.Svg(w, h, draw);
        int start = svg.IndexOf("<svg", StringComparison.Ordinal);
        svg = svg[start..];
        svg = "<svg id=\"" + id + "\" role=\"img\" aria-label=\"" + E(label) + "\" viewBox=\"0 0 " + w + " " + h + "\" " + svg[5..];
        return "<figure>" + svg + "</figure>";
    }

    private static void Head(StringBuilder sb, string title)
    {
        sb.Append("<!DOCTYPE html><html lang=\"en\"><head><meta charset=\"utf-8\"><title>").Append(E(title)).Append("</title><style>").Append(Css).Append("</style></head><body><main>");
    }

    private static void Cautions(StringBuilder sb, bool batch)
    {
        sb.Append("<div class=\"caution\" id=\"cautions\"><b>Cautions.</b> ");
        if (batch) sb.Append(E(BatchSummary.Caution)).Append(' ');
        sb.Append("Non-visual (CIE S 026) quantities are metrology, not medical or health advice; defer to local codes, applicable standards and qualified practice for lighting design decisions. ");
        sb.Append("Results describe the data given; calibration, stray light and wavelength accuracy of the measurement decide their quality.</div>");
    }

    /// <summary>A report for one source (or a few): all results, plots, warnings, provenance, cautions.</summary>
    /// <param name="items">Analysed records.</param>
    /// <param name="spec">Optional spec.</param>
    /// <returns>HTML.</returns>
    public static string Single(IReadOnlyList<RecordOutcome> items, PreparedSpec? spec)
    {
        ArgumentNullException.ThrowIfNull(items);
        var sb = new StringBuilder();
        Head(sb, "Lumen report");
        sb.Append("<h1>Light source report</h1><p class=\"muted\">Lumen: CIE colorimetry, CCT/Duv, CIE 13.3, CIE 224 / IES TM-30, CIE S 026.</p>");
        Cautions(sb, spec is not null);
        sb.Append("<h2>Summary</h2><table id=\"summary\"><tr><th>name</th><th>source</th><th>CCT (K)</th><th>Duv</th><th>x</th><th>y</th><th>u′</th><th>v′</th><th>Ra</th><th>R9</th><th>Rf</th><th>Rg</th>");
        if (spec is not null) sb.Append("<th>verdict</th>");
        sb.Append("</tr>");
        int k = 0;
        foreach (var item in items)
        {
            k++;
            if (item.Assessment is not { } a)
            {
                sb.Append("<tr><td class=\"t\">").Append(E(item.Record.Name)).Append("</td><td class=\"t\" colspan=\"11\"><span class=\"error\">error</span> ").Append(E(item.Error?.ToString() ?? "")).Append("</td></tr>");
                continue;
            }
            var c = a.Chromaticity2Degree;
            sb.Append(Inv, $"<tr><td class=\"t\"><a href=\"#unit-{k}\">{E(a.Name)}</a></td><td class=\"t\">{E(a.Origin.ToString())}</td><td>{F(a.Cct.CctKelvin, "0")}</td><td>{F(a.Cct.Duv, "+0.0000;-0.0000;0.0000")}</td><td>{F(c.SmallX)}</td><td>{F(c.SmallY)}</td><td>{F(c.UPrime)}</td><td>{F(c.VPrime)}</td><td>{F(a.Cri?.Ra, "0.0")}</td><td>{F(a.Cri?.R9, "0.0")}</td><td>{F(a.Fidelity?.Rf, "0.0")}</td><td>{F(a.Fidelity?.Rg, "0.0")}</td>");
            if (spec is not null)
            {
                var v = spec.Evaluate(a);
                sb.Append(v.Pass ? "<td class=\"t pass\">pass</td>" : "<td class=\"t fail\">fail</td>");
            }
            sb.Append("</tr>");
        }
        sb.Append("</table>");
        var ok = items.Where(i => i.Assessment is not null).ToList();
        if (ok.Count > 0)
        {
            sb.Append("<h2>Chromaticity</h2>");
            var pts = ok.Select(i => new DiagramPoint(i.Record.Name, i.Assessment!.Chromaticity2Degree, Status(spec, i.Assessment!))).ToList();
            sb.Append(InlineSvg(1200, 900, (cv, z) => ChromaticityDiagram.Draw(cv, z, new DiagramOptions(DiagramSpace.Xy, pts, spec, "CIE 1931 chromaticity")), "locus", "chromaticity diagram"));
        }
        k = 0;
        foreach (var item in items)
        {
            k++;
            if (item.Assessment is { } a) Detail(sb, a, item.Record, spec, k);
        }
        sb.Append("</main></body></html>");
        return sb.ToString();
    }

    private static PointStatus Status(PreparedSpec? spec, Assessment a) =>
        spec is null ? PointStatus.None : spec.Evaluate(a).Pass ? PointStatus.Pass : PointStatus.Fail;

    private static void Detail(StringBuilder sb, Assessment a, InputRecord record, PreparedSpec? spec, int k)
    {
        sb.Append(Inv, $"<section id=\"unit-{k}\"><h2>{E(a.Name)}</h2><p class=\"muted\">{E(a.Origin.ToString())}; unit {E(Lumen.Spectra.SpectralUnits.Symbol(a.Unit))}</p>");
        foreach (var w in a.Warnings) sb.Append("<div class=\"warn\">").Append(E(w)).Append("</div>");
        var c = a.Chromaticity2Degree;
        sb.Append("<table><tr><th>quantity</th><th>value</th></tr>");
        void Row(string n, string v) => sb.Append("<tr><td class=\"t\">").Append(n).Append("</td><td>").Append(v).Append("</td></tr>");
        Row("CCT (K), Duv", $"{F(a.Cct.CctKelvin, "0.0")}, {F(a.Cct.Duv, "+0.00000;-0.00000;0")}");
        Row("x, y (CIE 1931 2°)", $"{F(c.SmallX, "0.00000")}, {F(c.SmallY, "0.00000")}");
        Row("u′, v′ (CIE 1976)", $"{F(c.UPrime, "0.00000")}, {F(c.VPrime, "0.00000")}");
        Row("X, Y, Z (Y = 100)", $"{F(a.Tristimulus.X, "0.000")}, {F(a.Tristimulus.Y, "0.000")}, {F(a.Tristimulus.Z, "0.000")}");
        if (a.Cri is { } cri) Row("Ra (CIE 13.3), DC", $"{F(cri.Ra, "0.0")}, {F(cri.Dc, "0.0000")} ({E(cri.Reference.Description)})");
        if (a.Fidelity is { } fi) Row("Rf (CIE 224), Rg (TM-30)", $"{F(fi.Rf, "0.0")}, {F(fi.Rg, "0.0")} ({E(fi.Reference.Description)})");
        if (a.Photometry is { } ph)
        {
            Row("LER (lm/W), S/P", $"{F(ph.LerLumensPerWatt, "0.0")} over {ph.BandFirstNm:0}–{ph.BandLastNm:0} nm, {F(ph.SpRatio, "0.000")}");
            if (ph.Quantity is { } q) Row("photometric", $"{F(ph.Photometric, "0.###")} {Lumen.Photometry.Photometer.UnitSymbol(q)}");
        }
        if (a.NonVisual is { } nv)
            Row("melanopic efficacy (mW/lm), DER" + (nv[0].Edi is not null ? ", EDI" : ""), $"{F(nv[0].EfficacyMilliwattsPerLumen, "0.0000")}, {F(nv[0].Der, "0.000")}{(nv[0].Edi is { } edi ? ", " + F(edi, "0.#") : "")}");
        if (a.Spectral is { } sd) Row("peak, centroid, FWHM, dominant (nm), purity", $"{F(sd.PeakNm, "0.#")}, {F(sd.CentroidNm, "0.#")}, {F(sd.FwhmNm, "0.#")}, {F(sd.DominantNm, "0.#")}, {F(sd.Purity, "0.000")}");
        sb.Append("</table>");
        if (a.Cri is { } cr)
        {
            sb.Append("<h3>CIE 13.3 special indices</h3><table><tr>");
            for (int i = 1; i <= 14; i++) sb.Append(Inv, $"<th>R{i}</th>");
            sb.Append("</tr><tr>");
            foreach (var r in cr.R) sb.Append("<td>").Append(F(r, "0.0")).Append("</td>");
            sb.Append("</tr></table>");
        }
        if (a.Fidelity is { } f)
        {
            sb.Append("<h3>TM-30 hue bins</h3><table><tr><th>bin</th>");
            for (int j = 1; j <= 16; j++) sb.Append(Inv, $"<th>{j}</th>");
            sb.Append("</tr><tr><td class=\"t\">Rf,hj</td>");
            foreach (var b in f.HueBins) sb.Append("<td>").Append(F(b.Rf, "0")).Append("</td>");
            sb.Append("</tr><tr><td class=\"t\">Rcs,hj (%)</td>");
            foreach (var b in f.HueBins) sb.Append("<td>").Append(F(b.Rcs * 100, "0")).Append("</td>");
            sb.Append("</tr><tr><td class=\"t\">Rhs,hj</td>");
            foreach (var b in f.HueBins) sb.Append("<td>").Append(F(b.Rhs, "0.00")).Append("</td>");
            sb.Append("</tr></table>");
        }
        if (spec is not null)
        {
            var v = spec.Evaluate(a);
            sb.Append("<h3>Verdict: ").Append(v.Pass ? "<span class=\"pass\">pass</span>" : "<span class=\"fail\">fail</span>").Append("</h3><table><tr><th>criterion</th><th>measured</th><th>limit</th><th>margin</th><th>result</th></tr>");
            foreach (var cr2 in v.Criteria)
                sb.Append(Inv, $"<tr><td class=\"t\">{E(cr2.Criterion)}</td><td>{F(cr2.Measured, "0.#####")}</td><td class=\"t\">{E(cr2.Limit)}</td><td>{F(cr2.Margin, "0.#####")}</td><td class=\"t {(cr2.Pass ? "pass" : "fail")}\">{(cr2.Pass ? "pass" : "fail")}</td></tr>");
            sb.Append("</table>");
        }
        if (record is SpectrumRecord { Spectrum: var spectrum })
        {
            sb.Append("<div class=\"grid\">");
            sb.Append(InlineSvg(1200, 900, (cv, z) => SpectrumPlot.Draw(cv, z, spectrum, a.Fidelity?.Reference), $"spectrum-{k}", "spectrum"));
            if (a.Fidelity is { } fid) sb.Append(InlineSvg(1200, 900, (cv, z) => VectorGraphic.Draw(cv, z, fid, a.Name), $"vector-{k}", "colour vector graphic"));
            sb.Append("</div>");
            sb.Append(InlineSvg(1200, 520, (cv, z) => SwatchPlot.Draw(cv, z, spectrum, a), $"swatch-{k}", "colour samples"));
        }
        sb.Append("<h3>Provenance</h3><table>");
        foreach (var (key, value) in a.Provenance.Methods) sb.Append("<tr><td class=\"t\">").Append(E(key)).Append("</td><td class=\"t\">").Append(E(value)).Append("</td></tr>");
        sb.Append("<tr><td class=\"t\">standards</td><td class=\"t\">").Append(E(string.Join("; ", a.Provenance.Standards))).Append("</td></tr>");
        sb.Append(Inv, $"<tr><td class=\"t\">c2</td><td class=\"t\">{a.Provenance.C2MetreKelvin} m·K</td></tr>");
        sb.Append(Inv, $"<tr><td class=\"t\">measured range</td><td class=\"t\">{a.Provenance.MeasuredFirstNm:0.###}–{a.Provenance.MeasuredLastNm:0.###} nm</td></tr></table></section>");
    }

    /// <summary>The batch histograms: CCT, Duv, Ra, R9, Rf, the steps from the target, and every other limited field,
    /// each with its specification limits.</summary>
    private static List<(string Field, string Title, double[] Values, List<(string, double)> Limits)> HistogramPanels(List<RecordOutcome> ok, PreparedSpec spec)
    {
        var fields = new List<(string Field, string Title)> { ("cct.kelvin", "CCT (K)"), ("cct.duv", "Duv"), ("cri.ra", "Ra"), ("cri.r9", "R9"), ("fidelity.rf", "Rf") };
        foreach (var l in spec.Spec.Limits) if (!fields.Exists(f => f.Field == l.Field)) fields.Add((l.Field, l.Field));
        var panels = fields.Select(f =>
        {
            var limits = new List<(string, double)>();
            foreach (var l in spec.Spec.Limits.Where(l => l.Field == f.Field))
            {
                if (l.Min is { } lo) limits.Add((string.Create(Inv, $"min {lo:G6}"), lo));
                if (l.Max is { } hi) limits.Add((string.Create(Inv, $"max {hi:G6}"), hi));
            }
            var values = ok.Select(i => ResultFields.Get(i.Assessment!, f.Field) ?? double.NaN).Where(double.IsFinite).ToArray();
            return (f.Field, f.Title, values, limits);
        }).ToList();
        if (spec.Centre is not null)
        {
            var steps = ok.Select(i => i.Verdict?.StepsFromTarget ?? double.NaN).Where(double.IsFinite).ToArray();
            var limits = spec.Spec.Tolerance.Kind == ToleranceKind.EllipseSteps ? new List<(string, double)> { (string.Create(Inv, $"max {spec.Spec.Tolerance.Value:G6} steps"), spec.Spec.Tolerance.Value) } : [];
            panels.Add(("steps_from_target", "Steps from target", steps, limits));
        }
        return panels;
    }

    /// <summary>Most rows of the report's outlier table (largest robust z first); the rest are counted.</summary>
    public const int OutlierTableLimit = 20;

    /// <summary>A batch report: summary, pass/fail table, spread plot, histograms, outliers, per-unit detail.</summary>
    /// <param name="items">Judged records (in input order; the first <see cref="TableLimit"/> are tabled).</param>
    /// <param name="summary">The batch summary.</param>
    /// <param name="spec">The spec.</param>
    /// <returns>HTML.</returns>
    public static string Batch(IReadOnlyList<RecordOutcome> items, BatchSummary summary, PreparedSpec spec)
    {
        ArgumentNullException.ThrowIfNull(items);
        ArgumentNullException.ThrowIfNull(summary);
        ArgumentNullException.ThrowIfNull(spec);
        var sb = new StringBuilder();
        Head(sb, "Lumen batch report");
        sb.Append("<h1>Batch report</h1><p class=\"muted\">").Append(E(spec.Spec.Description)).Append("</p>");
        if (spec.TargetDescription is { } target) sb.Append("<p id=\"target\">").Append(E("Target: " + target)).Append("</p>");
        foreach (var c in spec.Cautions) sb.Append("<div class=\"warn\">").Append(E(c)).Append("</div>");
        Cautions(sb, true);
        sb.Append("<h2>Summary</h2><table id=\"summary\">");
        sb.Append(Inv, $"<tr><th>records read</th><td>{summary.RecordsRead}</td></tr><tr><th>results</th><td>{summary.Results}</td></tr><tr><th>errors</th><td>{summary.Errors}</td></tr>");
        sb.Append(Inv, $"<tr><th>pass</th><td class=\"pass\">{summary.Passed}</td></tr><tr><th>fail</th><td class=\"fail\">{summary.Failed}</td></tr><tr><th>pass rate</th><td>{F(summary.PassRate * 100, "0.0")} %</td></tr>");
        sb.Append(Inv, $"<tr><th>mean u′, v′</th><td>{F(summary.MeanUPrime, "0.00000")}, {F(summary.MeanVPrime, "0.00000")}</td></tr><tr><th>largest Δu′v′ between units</th><td>{F(summary.MaxPairwiseDeltaUPrimeVPrime, "0.00000")}</td></tr>");
        sb.Append(Inv, $"<tr><th>steps from batch mean (mean / 95th pct / max)</th><td>{F(summary.StepsFromMean.Mean, "0.00")} / {F(summary.StepsFromMeanP95, "0.00")} / {F(summary.StepsFromMean.Max, "0.00")}</td></tr>");
        sb.Append(Inv, $"<tr><th>steps from target (mean / 95th pct / max)</th><td>{F(summary.StepsFromTarget.Mean, "0.00")} / {F(summary.StepsFromTargetP95, "0.00")} / {F(summary.StepsFromTarget.Max, "0.00")}</td></tr></table>");
        sb.Append("<h3>Statistics</h3><table><tr><th>field</th><th>mean</th><th>SD</th><th>min</th><th>max</th></tr>");
        foreach (var (n, st) in summary.Statistics) sb.Append(Inv, $"<tr><td class=\"t\">{E(n)}</td><td>{F(st.Mean)}</td><td>{F(st.StandardDeviation)}</td><td>{F(st.Min)}</td><td>{F(st.Max)}</td></tr>");
        sb.Append("</table>");
        if (summary.Capabilities.Count > 0)
        {
            sb.Append("<h3>Process performance</h3><p>Ppk from the overall SD (not Cpk: no subgroups); 95 % interval after Bissell (1990), approximate.</p><table><tr><th>field</th><th>limits</th><th>n</th><th>mean</th><th>SD</th><th>Ppk</th><th>95 % interval</th></tr>");
            foreach (var c in summary.Capabilities) sb.Append(Inv, $"<tr><td class=\"t\">{E(c.Field)}</td><td class=\"t\">{F(c.Lower)} … {F(c.Upper)}</td><td>{c.Count}</td><td>{F(c.Mean)}</td><td>{F(c.StandardDeviation)}</td><td>{F(c.Ppk, "0.00")}</td><td>{F(c.PpkLower95, "0.00")} – {F(c.PpkUpper95, "0.00")}</td></tr>");
            sb.Append("</table>");
        }
        var ok = items.Where(i => i.Assessment is not null).ToList();
        sb.Append("<h2>Spread</h2>");
        var pts = ok.Select(i => new DiagramPoint(i.Record.Name, i.Assessment!.Chromaticity2Degree, i.Verdict?.Pass == false ? PointStatus.Fail : PointStatus.Pass)).ToList();
        sb.Append(InlineSvg(1200, 900, (cv, z) => ChromaticityDiagram.Draw(cv, z, new DiagramOptions(DiagramSpace.UPrimeVPrime, pts, spec, "Batch spread (CIE 1976 u′v′)")), "locus", "batch chromaticity spread"));
        sb.Append("<div class=\"grid\">");
        foreach (var (field, title, values, limits) in HistogramPanels(ok, spec))
            sb.Append(InlineSvg(800, 500, (cv, z) => Histogram.Draw(cv, z, values, title, limits), "hist-" + field.Replace('.', '-').Replace('_', '-'), "histogram of " + title));
        sb.Append("</div>");
        sb.Append("<h2>Outliers</h2>");
        if (summary.Outliers.Count == 0) sb.Append("<p>No chromaticity outliers (robust z > 3.5).</p>");
        else
        {
            sb.Append("<table id=\"outliers\"><tr><th>id</th><th>Δu′v′ from median</th><th>robust z</th></tr>");
            foreach (var o in summary.Outliers.Take(OutlierTableLimit)) sb.Append(Inv, $"<tr><td class=\"t\">{E(o.Id)}</td><td>{F(o.DeltaUPrimeVPrime, "0.00000")}</td><td>{F(o.RobustZ, "0.0")}</td></tr>");
            sb.Append("</table>");
            if (summary.Outliers.Count > OutlierTableLimit)
                sb.Append(Inv, $"<p class=\"muted\" id=\"outliers-more\">The {OutlierTableLimit} largest of {summary.Outliers.Count} outliers; {summary.Outliers.Count - OutlierTableLimit} more are listed in the JSON summary (<code>--summary NAME.json</code>).</p>");
        }
        sb.Append("<h2>Units</h2>");
        if (items.Count > TableLimit) sb.Append(Inv, $"<p class=\"muted\">The first {TableLimit} of {items.Count} records; the results file lists all.</p>");
        sb.Append("<table id=\"units\"><tr><th>id</th><th>location</th><th>status</th><th>CCT (K)</th><th>Duv</th><th>Ra</th><th>R9</th><th>Rf</th><th>Rg</th><th>steps</th><th>failed criteria / error</th></tr>");
        int k = 0;
        foreach (var it in items.Take(TableLimit))
        {
            k++;
            string id = k <= DetailLimit && it.Assessment is not null ? $"<a href=\"#unit-{k}\">{E(it.Record.Name)}</a>" : E(it.Record.Name);
            if (it.Assessment is { } a)
                sb.Append(Inv, $"<tr><td class=\"t\">{id}</td><td class=\"t\">{E(it.Record.Location)}</td><td class=\"t {it.Status}\">{it.Status}</td><td>{F(a.Cct.CctKelvin, "0")}</td><td>{F(a.Cct.Duv, "+0.0000;-0.0000;0")}</td><td>{F(a.Cri?.Ra, "0.0")}</td><td>{F(a.Cri?.R9, "0.0")}</td><td>{F(a.Fidelity?.Rf, "0.0")}</td><td>{F(a.Fidelity?.Rg, "0.0")}</td><td>{F(it.Verdict?.StepsFromTarget, "0.0")}</td><td class=\"t\">{E(string.Join(", ", (it.Verdict?.Criteria ?? []).Where(c => !c.Pass).Select(c => c.Criterion)))}</td></tr>");
            else
                sb.Append(Inv, $"<tr><td class=\"t\">{id}</td><td class=\"t\">{E(it.Record.Location)}</td><td class=\"t error\">error</td><td colspan=\"7\"></td><td class=\"t\">{E(it.Error?.ToString() ?? "")}</td></tr>");
        }
        sb.Append("</table><h2>Unit detail</h2>");
        k = 0;
        foreach (var it in items.Take(DetailLimit))
        {
            k++;
            if (it.Assessment is { } a) Detail(sb, a, it.Record, spec, k);
        }
        sb.Append("</main></body></html>");
        return sb.ToString();
    }

    /// <summary>
    /// A comparison report: each source against the reference — distance, correction, filters, object-colour shift and
    /// SSI — with the labelled chromaticity diagram, the equal-luminance spectrum overlay and the sample swatches.
    /// </summary>
    /// <param name="comparisons">One comparison per other source, in input order (all against the same reference).</param>
    /// <param name="reference">The reference spectrum.</param>
    /// <param name="others">The other spectra, in the order of <paramref name="comparisons"/>.</param>
    /// <param name="referenceFidelity">The reference's CIE 224 result (picks the swatch samples), or null.</param>
    /// <returns>HTML (self-contained, no scripts; every name escaped).</returns>
    public static string Comparison(IReadOnlyList<Lumen.Comparison.SourceComparison> comparisons, Spectrum reference, IReadOnlyList<Spectrum> others, FidelityResult? referenceFidelity)
    {
        ArgumentNullException.ThrowIfNull(comparisons);
        ArgumentNullException.ThrowIfNull(reference);
        ArgumentNullException.ThrowIfNull(others);
        var sb = new StringBuilder();
        Head(sb, "Lumen comparison report");
        sb.Append("<h1>Source comparison</h1><p class=\"muted\">Reference: ").Append(E(reference.Name)).Append(". Lumen: CIE 1976 u′v′, CCT and mired, CAT16 + CIEDE2000 on the CIE 224 samples, Academy Spectral Similarity Index.</p>");
        Cautions(sb, false);
        if (comparisons.Count > 0)
        {
            var r = comparisons[0].Reference;
            sb.Append(Inv, $"<p>Reference <b>{E(r.Name)}</b>: CCT {F(r.Cct.CctKelvin, "0")} K, Duv {F(r.Cct.Duv, "+0.0000;-0.0000;0.0000")}, u′v′ ({F(r.Chromaticity2Degree.UPrime, "0.0000")}, {F(r.Chromaticity2Degree.VPrime, "0.0000")}).</p>");
        }
        sb.Append("<h2>Summary</h2><table id=\"comparison\"><tr><th>source</th><th>CCT (K)</th><th>Duv</th><th>Δu′v′</th><th>correction (MK⁻¹)</th><th>tint (Duv)</th><th>ΔE00 mean</th><th>ΔE00 max</th><th>skin ΔE00 (TCS13)</th><th>SSI</th></tr>");
        foreach (var c in comparisons)
            sb.Append(Inv, $"<tr><td class=\"t\">{E(c.Source.Name)}</td><td>{F(c.Source.Cct.CctKelvin, "0")}</td><td>{F(c.Source.Cct.Duv, "+0.0000;-0.0000;0.0000")}</td><td>{F(c.DeltaUPrimeVPrime, "0.0000")}</td><td>{F(c.Correction.MiredShift, "+0;-0;0")}</td><td>{F(c.Correction.DuvShift, "+0.0000;-0.0000;0.0000")}</td><td>{F(c.SampleShift?.MeanDeltaE00, "0.00")}</td><td>{F(c.SampleShift?.MaxDeltaE00, "0.00")}</td><td>{F(c.SampleShift?.Tcs13DeltaE00, "0.00")}</td><td>{F(c.Ssi.Value, "0")}</td></tr>");
        sb.Append("</table><p class=\"muted\">Correction &gt; 0: warm the source; &lt; 0: cool it. Tint &gt; 0: add green; &lt; 0: add magenta. ΔE00: object colours after white balance on each source (CAT16 to D65). SSI: 100 = the reference's spectral shape.</p>");
        foreach (var c in comparisons)
        {
            sb.Append("<h3>").Append(E(c.Source.Name)).Append("</h3><p>").Append(E(c.Correction.Description)).Append(".</p>");
            foreach (var w in c.Warnings) sb.Append("<div class=\"warn\">").Append(E(w)).Append("</div>");
            if (c.Filters.Count > 0)
            {
                sb.Append("<table><tr><th>filter (or stack)</th><th>residual Δu′v′</th><th>CCT (K)</th><th>Duv</th><th>shift (MK⁻¹)</th><th>transmission</th></tr>");
                foreach (var f in c.Filters.Take(8))
                    sb.Append(Inv, $"<tr><td class=\"t\">{E(f.Name)}{(f.Percent ? " (read as %)" : "")}</td><td>{F(f.ResidualDeltaUPrimeVPrime, "0.0000")}</td><td>{F(f.CctKelvin, "0")}</td><td>{F(f.Duv, "+0.0000;-0.0000;0.0000")}</td><td>{F(f.MiredShift, "+0;-0;0")}</td><td>{F(f.Transmission * 100, "0")} %</td></tr>");
                sb.Append("</table>");
            }
            if (c.SampleShift is { } s2 && s2.Worst.Count > 0)
                sb.Append("<p class=\"muted\">Samples that shift most: ").Append(E(string.Join(", ", s2.Worst.Select(p => string.Create(Inv, $"CES{p.Sample} ({p.DeltaE00:0.0})"))))).Append("</p>");
        }
        var all = new[] { reference }.Concat(others).ToList();
        sb.Append("<h2>Chromaticity</h2>");
        var pts = new List<DiagramPoint> { new(reference.Name, comparisons.Count > 0 ? comparisons[0].Reference.Chromaticity2Degree : default, PointStatus.None) };
        pts.AddRange(comparisons.Select(c => new DiagramPoint(c.Source.Name, c.Source.Chromaticity2Degree, PointStatus.None)));
        var options = new DiagramOptions(DiagramSpace.UPrimeVPrime, pts, null, "Sources against the reference (CIE 1976 u′v′)")
        {
            DistinctSources = true,
            Arrows = comparisons.Select(c => (c.Source.Chromaticity2Degree, c.Reference.Chromaticity2Degree)).ToList(),
        };
        sb.Append(InlineSvg(1200, 900, (cv, z) => ChromaticityDiagram.Draw(cv, z, options), "locus", "chromaticity diagram of the sources"));
        sb.Append("<h2>Spectra</h2>");
        sb.Append(InlineSvg(1200, 800, (cv, z) => SpectrumPlot.DrawMany(cv, z, all), "spectra", "spectra at equal luminance"));
        sb.Append("<h2>Colour samples after white balance</h2>");
        sb.Append(InlineSvg(1200, Math.Clamp(260 + 80 * all.Count, 400, 2000), (cv, z) => SwatchPlot.DrawComparison(cv, z, reference, referenceFidelity, others), "swatches", "sample colours under each source"));
        sb.Append("</main></body></html>");
        return sb.ToString();
    }
}

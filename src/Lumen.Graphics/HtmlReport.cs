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
        #about th{width:11em} .verdict{font-size:18px;margin:10px 0;padding:8px 12px;background:#f0f2f5}
        pre{white-space:pre-wrap;word-break:break-all;font-size:12px;background:#f7f8fa;padding:8px;border:1px solid #e3e6ea}
        code.hash{font-size:11px;word-break:break-all}
        @media print{
          body{background:#fff} main{max-width:none;padding:0} svg{border:none} a{color:inherit;text-decoration:none}
          figure,tr,.caution,.warn,#about,.verdict{break-inside:avoid} h2,h3{break-after:avoid}
          table{font-size:11px} th,td{padding:2px 5px} figure svg{max-height:120mm}
        }
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

    private static void Head(StringBuilder sb, string title, ReportContext? context = null)
    {
        string page = (context?.Paper ?? PaperSize.A4) == PaperSize.Letter ? "letter" : "A4";
        sb.Append("<!DOCTYPE html><html lang=\"en\"><head><meta charset=\"utf-8\"><title>").Append(E(title)).Append("</title><style>").Append(Css)
          .Append("@page{size:").Append(page).Append(";margin:14mm 12mm}</style></head><body><main>");
    }

    /// <summary>The head of a report a client can accept: title, project, client, preparer, date, tool version, the
    /// specification in one line, and the overall verdict.</summary>
    private static void FrontMatter(StringBuilder sb, string heading, PreparedSpec? spec, ReportContext? context, string? verdict)
    {
        sb.Append("<header id=\"front\"><h1>").Append(E(heading)).Append("</h1><table id=\"about\">");
        void Row(string name, string? value)
        {
            if (value is null) return;
            sb.Append("<tr><th>").Append(name).Append("</th><td class=\"t\">").Append(E(value)).Append("</td></tr>");
        }
        Row("Project", spec?.Spec.Project);
        Row("Client", spec?.Spec.Client);
        Row("Prepared by", spec?.Spec.PreparedBy);
        if (context is not null)
        {
            Row("Date", context.Date.ToUniversalTime().ToString("yyyy-MM-dd HH:mm 'UTC'", Inv));
            Row("Made with", "Lumen " + context.Version);
            if (context.Inputs.Count > 0) Row("Inputs", context.Inputs.Count == 1 ? context.Inputs[0].Path : $"{context.Inputs.Count} files (listed with their SHA-256 at the end)");
        }
        Row("Specification", spec?.Spec.Description);
        if (spec is not null) Row("Decision rule", Lumen.Uncertainty.Decisions.Describe(Lumen.Uncertainty.DecisionRule.Simple));
        if (spec?.TargetDescription is { } target) Row("Target", target);
        sb.Append("</table>");
        if (verdict is not null) sb.Append("<p class=\"verdict\" id=\"verdict\">").Append(verdict).Append("</p>");
        sb.Append("</header>");
    }

    /// <summary>The closing record: every input with its size and SHA-256, and the specification as written.</summary>
    private static void Appendix(StringBuilder sb, ReportContext? context)
    {
        if (context is null) return;
        sb.Append("<h2 id=\"inputs\">Inputs and specification</h2><table><tr><th>input</th><th>bytes</th><th>SHA-256</th></tr>");
        foreach (var i in context.Inputs)
            sb.Append(Inv, $"<tr><td class=\"t\">{E(i.Path)}</td><td>{(i.Bytes >= 0 ? i.Bytes.ToString("N0", Inv) : "—")}</td><td class=\"t\"><code class=\"hash\">{(i.Sha256 is { } h ? E(h) : "not computed (standard input)")}</code></td></tr>");
        sb.Append("</table>");
        if (context.SpecText is { } text) sb.Append("<h3>Specification as written</h3><pre id=\"spec-text\">").Append(E(text)).Append("</pre>");
        sb.Append("<p class=\"muted\">Made with Lumen ").Append(E(context.Version)).Append(" on ").Append(context.Date.ToUniversalTime().ToString("yyyy-MM-dd HH:mm 'UTC'", Inv))
          .Append(". Methods and their sources are listed in each unit's provenance.</p>");
    }

    private static string SpaceTitle(DiagramSpace space, string what) =>
        space == DiagramSpace.Xy ? what + " (CIE 1931 x, y)" : what + " (CIE 1976 u′, v′)";

    /// <summary>Order for reading: failures first, then errors, then passes (input order within each).</summary>
    private static int Rank(RecordOutcome o) => o.Status switch { "fail" => 0, "error" => 1, _ => 2 };

    /// <summary>Human labels for the provenance keys.</summary>
    private static string ProvenanceLabel(string key) => key switch
    {
        "tristimulus" => "Tristimulus values",
        "cct" => "CCT and Duv",
        "planckianLocus" => "Planckian locus",
        "sampling" => "Spectral sampling",
        "cri" => "Colour rendering (CIE 13.3)",
        "fidelity" => "Colour fidelity and gamut (CIE 224, TM-30)",
        "photometry" => "Photometry",
        "nonVisual" => "Non-visual (α-opic) quantities",
        "dominantWavelength" => "Dominant wavelength",
        _ => char.ToUpperInvariant(key[0]) + System.Text.RegularExpressions.Regex.Replace(key[1..], "([A-Z])", m => " " + m.Value.ToLowerInvariant()),
    };

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
    /// <param name="context">Date, version, inputs and layout; null for a bare report.</param>
    /// <returns>HTML.</returns>
    public static string Single(IReadOnlyList<RecordOutcome> items, PreparedSpec? spec, ReportContext? context = null)
    {
        ArgumentNullException.ThrowIfNull(items);
        var sb = new StringBuilder();
        string heading = spec is not null ? "Light source report — " + spec.Spec.Name : "Light source report";
        Head(sb, heading, context);
        // Each item's verdict once: the one it carries, else evaluated here (callers may pass outcomes without one).
        var verdicts = items.Select(i => i.Verdict ?? (spec is not null && i.Assessment is { } a0 ? spec.Evaluate(a0) : null)).ToArray();
        string? verdict = null;
        if (spec is not null)
        {
            int fail = verdicts.Count(v => v is { Pass: false }), errors = items.Count(i => i.Assessment is null);
            int pass = items.Count - fail - errors;
            verdict = string.Create(Inv, $"{(fail + errors == 0 ? "<span class=\"pass\">All pass</span>" : "<span class=\"fail\">Not all pass</span>")}: {pass} pass, {fail} fail{(errors > 0 ? $", {errors} unreadable" : "")} of {items.Count}.");
        }
        FrontMatter(sb, heading, spec, context, verdict);
        Cautions(sb, spec is not null);
        sb.Append("<h2>Summary</h2><table id=\"summary\"><tr><th>name</th><th>source</th><th>CCT (K)</th><th>Duv</th><th>x</th><th>y</th><th>u′</th><th>v′</th><th>Ra</th><th>R9</th><th>Rf</th><th>Rg</th>");
        if (spec is not null) sb.Append("<th>verdict</th>");
        sb.Append("</tr>");
        var numbered = items.Select((item, i) => (Item: item, K: i + 1)).ToList();
        var shown = spec is null ? numbered : numbered.OrderBy(x => x.Item.Assessment is null ? 1 : verdicts[x.K - 1]!.Pass ? 2 : 0).ToList();
        foreach (var (item, k) in shown)
        {
            if (item.Assessment is not { } a)
            {
                sb.Append("<tr><td class=\"t\">").Append(E(item.Record.Name)).Append("</td><td class=\"t\" colspan=\"11\"><span class=\"error\">error</span> ").Append(E(item.Error?.ToString() ?? "")).Append("</td></tr>");
                continue;
            }
            var c = a.Chromaticity2Degree;
            string xy = Rounding.Value("chromaticity.x");
            sb.Append(Inv, $"<tr><td class=\"t\"><a href=\"#unit-{k}\">{E(a.Name)}</a></td><td class=\"t\">{E(a.Origin.ToString())}</td><td>{F(a.Cct.CctKelvin, Rounding.Value("cct.kelvin"))}</td><td>{F(a.Cct.Duv, Rounding.Value("cct.duv"))}</td><td>{F(c.SmallX, xy)}</td><td>{F(c.SmallY, xy)}</td><td>{F(c.UPrime, xy)}</td><td>{F(c.VPrime, xy)}</td><td>{F(a.Cri?.Ra, Rounding.Value("cri.ra"))}</td><td>{F(a.Cri?.R9, Rounding.Value("cri.r9"))}</td><td>{F(a.Fidelity?.Rf, Rounding.Value("fidelity.rf"))}</td><td>{F(a.Fidelity?.Rg, Rounding.Value("fidelity.rg"))}</td>");
            if (verdicts[k - 1] is { } v) sb.Append(v.Pass ? "<td class=\"t pass\">pass</td>" : "<td class=\"t fail\">fail</td>");
            sb.Append("</tr>");
        }
        sb.Append("</table>");
        var ok = items.Where(i => i.Assessment is not null).ToList();
        var space = context?.Space ?? DiagramSpace.UPrimeVPrime;
        if (ok.Count > 0)
        {
            sb.Append("<h2>Chromaticity</h2>");
            var pts = numbered.Where(x => x.Item.Assessment is not null)
                .Select(x => new DiagramPoint(x.Item.Record.Name, x.Item.Assessment!.Chromaticity2Degree, verdicts[x.K - 1] is not { } v ? PointStatus.None : v.Pass ? PointStatus.Pass : PointStatus.Fail)).ToList();
            sb.Append(InlineSvg(1200, 900, (cv, z) => ChromaticityDiagram.Draw(cv, z, new DiagramOptions(space, pts, spec, SpaceTitle(space, "Chromaticity"))), "locus", "chromaticity diagram"));
        }
        foreach (var (item, k) in shown)
            if (item.Assessment is { } a) Detail(sb, a, item.Record, verdicts[k - 1], k);
        Appendix(sb, context);
        sb.Append("</main></body></html>");
        return sb.ToString();
    }

    private static void Detail(StringBuilder sb, Assessment a, InputRecord record, Verdict? verdict, int k)
    {
        sb.Append(Inv, $"<section id=\"unit-{k}\"><h2>{E(a.Name)}</h2><p class=\"muted\">{E(a.Origin.ToString())}; unit {E(Lumen.Spectra.SpectralUnits.Symbol(a.Unit))}</p>");
        foreach (var w in a.Warnings) sb.Append("<div class=\"warn\">").Append(E(w)).Append("</div>");
        var c = a.Chromaticity2Degree;
        sb.Append("<table><tr><th>quantity</th><th>value</th></tr>");
        void Row(string n, string v) => sb.Append("<tr><td class=\"t\">").Append(n).Append("</td><td>").Append(v).Append("</td></tr>");
        string xy = Rounding.Value("chromaticity.x");
        Row("CCT (K), Duv", $"{F(a.Cct.CctKelvin, Rounding.Value("cct.kelvin"))}, {F(a.Cct.Duv, Rounding.Value("cct.duv"))}");
        Row("x, y (CIE 1931 2°)", $"{F(c.SmallX, xy)}, {F(c.SmallY, xy)}");
        Row("u′, v′ (CIE 1976)", $"{F(c.UPrime, xy)}, {F(c.VPrime, xy)}");
        Row("X, Y, Z (Y = 100)", $"{F(a.Tristimulus.X, "0.000")}, {F(a.Tristimulus.Y, "0.000")}, {F(a.Tristimulus.Z, "0.000")}");
        if (a.Cri is { } cri) Row("Ra (CIE 13.3), DC", $"{F(cri.Ra, Rounding.Value("cri.ra"))}, {F(cri.Dc, "0.0000")} ({E(cri.Reference.Description)})");
        if (a.Fidelity is { } fi) Row("Rf (CIE 224), Rg (TM-30)", $"{F(fi.Rf, Rounding.Value("fidelity.rf"))}, {F(fi.Rg, Rounding.Value("fidelity.rg"))} ({E(fi.Reference.Description)})");
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
            foreach (var r in cr.R) sb.Append("<td>").Append(F(r, Rounding.Value("cri.r1"))).Append("</td>");
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
        if (verdict is { } v)
        {
            sb.Append("<h3>Verdict: ").Append(v.Pass ? "<span class=\"pass\">pass</span>" : "<span class=\"fail\">fail</span>").Append("</h3><table><tr><th>criterion</th><th>measured</th><th>limit</th><th>margin</th><th>result</th></tr>");
            foreach (var cr2 in v.Criteria)
                sb.Append(Inv, $"<tr><td class=\"t\">{E(cr2.Criterion)}</td><td>{F(cr2.Measured, Rounding.Value(cr2.Criterion))}</td><td class=\"t\">{E(cr2.Limit)}</td><td>{F(cr2.Margin, Rounding.Spread(cr2.Criterion))}</td><td class=\"t {(cr2.Pass ? "pass" : "fail")}\">{(cr2.Pass ? "pass" : "fail")}</td></tr>");
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
        foreach (var (key, value) in a.Provenance.Methods) sb.Append("<tr><td class=\"t\">").Append(E(ProvenanceLabel(key))).Append("</td><td class=\"t\">").Append(E(value)).Append("</td></tr>");
        sb.Append("<tr><td class=\"t\">Standards</td><td class=\"t\">").Append(E(string.Join("; ", a.Provenance.Standards))).Append("</td></tr>");
        sb.Append(Inv, $"<tr><td class=\"t\">Second radiation constant c₂</td><td class=\"t\">{a.Provenance.C2MetreKelvin * 100:0.######} × 10⁻² m·K</td></tr>");
        sb.Append(Inv, $"<tr><td class=\"t\">Measured range</td><td class=\"t\">{a.Provenance.MeasuredFirstNm:0.###}–{a.Provenance.MeasuredLastNm:0.###} nm</td></tr></table></section>");
    }

    /// <summary>The batch's distribution panels: CCT, Duv, Ra, R9, Rf, the steps from the target, and every other limited
    /// field, each with its specification limits and one value per record in input order (NaN for none).</summary>
    private static List<(string Field, string Title, double[] Series, List<(string, double)> Limits)> Panels(IReadOnlyList<RecordOutcome> items, PreparedSpec spec)
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
            var series = items.Select(i => i.Assessment is { } a ? ResultFields.Get(a, f.Field) ?? double.NaN : double.NaN).ToArray();
            return (f.Field, f.Title, series, limits);
        }).ToList();
        if (spec.Centre is not null)
        {
            var steps = items.Select(i => i.Verdict?.StepsFromTarget ?? double.NaN).ToArray();
            var limits = spec.Spec.Tolerance.Kind == ToleranceKind.EllipseSteps ? new List<(string, double)> { (string.Create(Inv, $"max {spec.Spec.Tolerance.Value:G6} steps"), spec.Spec.Tolerance.Value) } : [];
            panels.Add(("steps_from_target", "Steps from target", steps, limits));
        }
        return panels;
    }

    /// <summary>Most rows of the report's outlier table (largest robust z first); the rest are counted.</summary>
    public const int OutlierTableLimit = 20;

    /// <summary>A batch report: verdict, summary, capability, groups, spread plot, histograms and run charts, outliers,
    /// the unit table and detail (failures first), inputs with SHA-256 and the specification as written.</summary>
    /// <param name="items">Judged records (in input order; the first <see cref="TableLimit"/> in failures-first order are tabled).</param>
    /// <param name="summary">The batch summary.</param>
    /// <param name="spec">The spec.</param>
    /// <param name="context">Date, version, inputs and layout; null for a bare report.</param>
    /// <returns>HTML.</returns>
    public static string Batch(IReadOnlyList<RecordOutcome> items, BatchSummary summary, PreparedSpec spec, ReportContext? context = null)
    {
        ArgumentNullException.ThrowIfNull(items);
        ArgumentNullException.ThrowIfNull(summary);
        ArgumentNullException.ThrowIfNull(spec);
        var sb = new StringBuilder();
        string heading = "Batch report — " + spec.Spec.Name;
        Head(sb, heading, context);
        string verdict = string.Create(Inv, $"{(summary.Failed + summary.Errors == 0 ? "<span class=\"pass\">All units pass</span>" : "<span class=\"fail\">Not all units pass</span>")}: {summary.Passed} pass, {summary.Failed} fail, {summary.Errors} unreadable of {summary.RecordsRead} records (pass rate {F(summary.PassRate * 100, "0.0")} %).");
        FrontMatter(sb, heading, spec, context, verdict);
        foreach (var c in spec.Cautions) sb.Append("<div class=\"warn\">").Append(E(c)).Append("</div>");
        Cautions(sb, true);

        // Failures first: the criteria that failed, with how many units failed each.
        var failing = items.Where(i => i.Verdict is { Pass: false }).SelectMany(i => i.Verdict!.Criteria.Where(c => !c.Pass).Select(c => c.Criterion))
            .GroupBy(c => c, StringComparer.Ordinal).OrderByDescending(g => g.Count()).ToList();
        if (failing.Count > 0 || summary.Errors > 0)
        {
            sb.Append("<h2 id=\"failures\">Failures</h2><table><tr><th>criterion</th><th>units failing</th></tr>");
            foreach (var g in failing) sb.Append(Inv, $"<tr><td class=\"t\">{E(g.Key)}</td><td>{g.Count()}</td></tr>");
            if (summary.Errors > 0) sb.Append(Inv, $"<tr><td class=\"t\">unreadable records (see the unit table)</td><td>{summary.Errors}</td></tr>");
            sb.Append("</table><p class=\"muted\">Every failing and unreadable unit heads the unit table below.</p>");
        }

        sb.Append("<h2>Summary</h2><table id=\"summary\">");
        sb.Append(Inv, $"<tr><th>records read</th><td>{summary.RecordsRead}</td></tr><tr><th>results</th><td>{summary.Results}</td></tr><tr><th>errors</th><td>{summary.Errors}</td></tr>");
        sb.Append(Inv, $"<tr><th>pass</th><td class=\"pass\">{summary.Passed}</td></tr><tr><th>fail</th><td class=\"fail\">{summary.Failed}</td></tr><tr><th>pass rate</th><td>{F(summary.PassRate * 100, "0.0")} %</td></tr>");
        string uv = Rounding.Value("chromaticity.uPrime"), st2 = Rounding.Value("steps_from_target");
        sb.Append(Inv, $"<tr><th>mean u′, v′</th><td>{F(summary.MeanUPrime, uv)}, {F(summary.MeanVPrime, uv)}</td></tr><tr><th>largest Δu′v′ between units</th><td>{F(summary.MaxPairwiseDeltaUPrimeVPrime, uv)}</td></tr>");
        sb.Append(Inv, $"<tr><th>steps from batch mean (mean / 95th pct / max)</th><td>{F(summary.StepsFromMean.Mean, st2)} / {F(summary.StepsFromMeanP95, st2)} / {F(summary.StepsFromMean.Max, st2)}</td></tr>");
        sb.Append(Inv, $"<tr><th>steps from target (mean / 95th pct / max)</th><td>{F(summary.StepsFromTarget.Mean, st2)} / {F(summary.StepsFromTargetP95, st2)} / {F(summary.StepsFromTarget.Max, st2)}</td></tr></table>");
        sb.Append("<h3>Statistics</h3><table><tr><th>field</th><th>mean</th><th>SD</th><th>min</th><th>max</th></tr>");
        foreach (var (n, st) in summary.Statistics) sb.Append(Inv, $"<tr><td class=\"t\">{E(n)}</td><td>{F(st.Mean, Rounding.Value(n))}</td><td>{F(st.StandardDeviation, Rounding.Spread(n))}</td><td>{F(st.Min, Rounding.Value(n))}</td><td>{F(st.Max, Rounding.Value(n))}</td></tr>");
        sb.Append("</table>");
        if (summary.Capabilities.Count > 0)
        {
            bool within = summary.SubgroupRule is not null;
            sb.Append("<h3>Process performance and capability</h3><p>Ppk from the overall SD")
              .Append(within ? "; Cpk from the pooled within-subgroup SD (" + E(summary.SubgroupRule!) + ")" : " (no Cpk: the batch has no subgroups)")
              .Append("; 95 % intervals after Bissell (1990), approximate.</p><table><tr><th>field</th><th>limits</th><th>n</th><th>mean</th><th>SD</th><th>Ppk</th><th>95 % interval</th>")
              .Append(within ? "<th>within SD</th><th>Cpk</th><th>95 % interval</th>" : "").Append("</tr>");
            foreach (var c in summary.Capabilities)
            {
                string v = Rounding.Value(c.Field), sp = Rounding.Spread(c.Field), k = Rounding.CapabilityIndex;
                sb.Append(Inv, $"<tr><td class=\"t\">{E(c.Field)}</td><td class=\"t\">{F(c.Lower, sp)} … {F(c.Upper, sp)}</td><td>{c.Count}</td><td>{F(c.Mean, v)}</td><td>{F(c.StandardDeviation, sp)}</td><td>{F(c.Ppk, k)}</td><td>{F(c.PpkLower95, k)} – {F(c.PpkUpper95, k)}</td>");
                if (within) sb.Append(Inv, $"<td>{F(c.Within?.StandardDeviation, sp)}</td><td>{F(c.Within?.Cpk, k)}</td><td>{F(c.Within?.CpkLower95, k)} – {F(c.Within?.CpkUpper95, k)}</td>");
                sb.Append("</tr>");
            }
            sb.Append("</table>");
        }
        if (summary.Groups.Count > 0)
        {
            sb.Append("<h3 id=\"groups\">By ").Append(E(summary.GroupedBy ?? "")).Append("</h3><table><tr><th>").Append(E(summary.GroupedBy ?? "")).Append("</th><th>records</th><th>errors</th><th>pass</th><th>fail</th><th>pass rate</th><th>outliers</th></tr>");
            foreach (var g in summary.Groups)
            {
                var x = g.Summary;
                sb.Append(Inv, $"<tr><td class=\"t\">{E(g.Value.Length == 0 ? "(none)" : g.Value)}</td><td>{x.RecordsRead}</td><td>{x.Errors}</td><td>{x.Passed}</td><td>{x.Failed}</td><td>{F(x.PassRate * 100, "0.0")} %</td><td>{x.Outliers.Count}</td></tr>");
            }
            sb.Append("</table>");
        }
        var ok = items.Where(i => i.Assessment is not null).ToList();
        var space = context?.Space ?? DiagramSpace.UPrimeVPrime;
        sb.Append("<h2>Spread</h2>");
        var pts = ok.Select(i => new DiagramPoint(i.Record.Name, i.Assessment!.Chromaticity2Degree, i.Verdict?.Pass == false ? PointStatus.Fail : PointStatus.Pass)).ToList();
        sb.Append(InlineSvg(1200, 900, (cv, z) => ChromaticityDiagram.Draw(cv, z, new DiagramOptions(space, pts, spec, SpaceTitle(space, "Batch spread"))), "locus", "batch chromaticity spread"));
        var panels = Panels(items, spec);
        sb.Append("<h3>Distributions</h3><div class=\"grid\">");
        foreach (var (field, title, series, limits) in panels)
        {
            var values = series.Where(double.IsFinite).ToArray();
            sb.Append(InlineSvg(800, 500, (cv, z) => Histogram.Draw(cv, z, values, title, limits), "hist-" + field.Replace('.', '-').Replace('_', '-'), "histogram of " + title));
        }
        sb.Append("</div><h3>Run charts (input order)</h3><div class=\"grid\">");
        foreach (var (field, title, series, limits) in panels)
            sb.Append(InlineSvg(800, 500, (cv, z) => RunChart.Draw(cv, z, series, title, limits, field == "cct.duv" ? "0.0000" : "G5"), "run-" + field.Replace('.', '-').Replace('_', '-'), "run chart of " + title));
        sb.Append("</div>");
        sb.Append("<h2>Outliers</h2>");
        if (summary.Outliers.Count == 0) sb.Append("<p>No chromaticity outliers (robust z > 3.5).</p>");
        else
        {
            sb.Append("<table id=\"outliers\"><tr><th>id</th><th>Δu′v′ from median</th><th>robust z</th></tr>");
            foreach (var o in summary.Outliers.Take(OutlierTableLimit)) sb.Append(Inv, $"<tr><td class=\"t\">{E(o.Id)}</td><td>{F(o.DeltaUPrimeVPrime, uv)}</td><td>{F(o.RobustZ, "0.0")}</td></tr>");
            sb.Append("</table>");
            if (summary.Outliers.Count > OutlierTableLimit)
                sb.Append(Inv, $"<p class=\"muted\" id=\"outliers-more\">The {OutlierTableLimit} largest of {summary.Outliers.Count} outliers; {summary.Outliers.Count - OutlierTableLimit} more are listed in the JSON summary (<code>--summary NAME.json</code>) and flagged in the results file's <code>outlier</code> column.</p>");
        }
        sb.Append("<h2>Units</h2>");
        var ordered = items.Select((item, i) => (Item: item, K: i + 1)).OrderBy(x => Rank(x.Item)).ToList();
        sb.Append(Inv, $"<p class=\"muted\">Failures first, then unreadable records, then passes (input order within each){(items.Count > TableLimit ? $"; the first {TableLimit} of {items.Count} records — the results file lists all" : "")}.</p>");
        sb.Append("<table id=\"units\"><tr><th>id</th><th>location</th><th>status</th><th>CCT (K)</th><th>Duv</th><th>Ra</th><th>R9</th><th>Rf</th><th>Rg</th><th>steps</th><th>failed criteria / error</th></tr>");
        var detailed = ordered.Where(x => x.Item.Assessment is not null).Take(DetailLimit).Select(x => x.K).ToHashSet();
        foreach (var (it, k) in ordered.Take(TableLimit))
        {
            string id = detailed.Contains(k) ? $"<a href=\"#unit-{k}\">{E(it.Record.Name)}</a>" : E(it.Record.Name);
            if (it.Assessment is { } a)
                sb.Append(Inv, $"<tr><td class=\"t\">{id}</td><td class=\"t\">{E(it.Record.Location)}</td><td class=\"t {it.Status}\">{it.Status}</td><td>{F(a.Cct.CctKelvin, Rounding.Value("cct.kelvin"))}</td><td>{F(a.Cct.Duv, Rounding.Value("cct.duv"))}</td><td>{F(a.Cri?.Ra, Rounding.Value("cri.ra"))}</td><td>{F(a.Cri?.R9, Rounding.Value("cri.r9"))}</td><td>{F(a.Fidelity?.Rf, Rounding.Value("fidelity.rf"))}</td><td>{F(a.Fidelity?.Rg, Rounding.Value("fidelity.rg"))}</td><td>{F(it.Verdict?.StepsFromTarget, st2)}</td><td class=\"t\">{E(string.Join(", ", (it.Verdict?.Criteria ?? []).Where(c => !c.Pass).Select(c => c.Criterion)))}</td></tr>");
            else
                sb.Append(Inv, $"<tr><td class=\"t\">{id}</td><td class=\"t\">{E(it.Record.Location)}</td><td class=\"t error\">error</td><td colspan=\"7\"></td><td class=\"t\">{E(it.Error?.ToString() ?? "")}</td></tr>");
        }
        sb.Append(Inv, $"</table><h2>Unit detail</h2><p class=\"muted\">The first {DetailLimit} units with results, failures first.</p>");
        foreach (var (it, k) in ordered.Where(x => detailed.Contains(x.K)))
            Detail(sb, it.Assessment!, it.Record, it.Verdict ?? spec.Evaluate(it.Assessment!), k);
        Appendix(sb, context);
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

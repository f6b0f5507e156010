using System.CommandLine;
using System.Globalization;
using Lumen.Assessment;
using Lumen.Conformance;
using Lumen.Formats;
using Lumen.Graphics;

namespace Lumen.Cli;

/// <summary><c>lumen plot KIND FILE... --out PATH</c>: images (PNG or SVG).</summary>
internal sealed class PlotCommand(TextReader stdin, TextWriter stdout, TextWriter stderr)
{
    public Argument<string> Kind { get; } = new("kind") { Description = "swatch, locus, spectrum or vector." };
    public Argument<string[]> Files { get; } = new("files") { Description = "Spectrum files or folders ('-' for standard input).", Arity = ArgumentArity.OneOrMore };
    public Option<string> Out { get; } = new("--out", "-o") { Description = "Image file: .png or .svg.", Required = true };
    public Option<string?> Size { get; } = new("--size") { Description = "Width×height in pixels, e.g. 1200x900." };
    public Option<string> Space { get; } = new("--space") { Description = "Diagram for locus: xy (CIE 1931) or uv (CIE 1976 u'v').", DefaultValueFactory = _ => "xy" };
    public Option<string?> Spec { get; } = new("--spec") { Description = "Tolerance spec: draws its quadrangle/ellipse/circle and marks points pass/fail." };
    public Option<string?> Name { get; } = new("--name") { Description = "Which spectrum to draw (swatch, spectrum, vector); default the first." };
    public Option<bool> Absolute { get; } = new("--absolute") { Description = "Spectrum plot in the file's absolute unit instead of normalised." };

    public Command Build()
    {
        Kind.AcceptOnlyFromAmong("swatch", "locus", "spectrum", "vector");
        Space.AcceptOnlyFromAmong("xy", "uv");
        var cmd = new Command("plot", "Draw a swatch, chromaticity diagram (locus), spectrum or TM-30 vector graphic as PNG or SVG.")
        {
            Kind, Files, Out, Size, Space, Spec, Name, Absolute,
        };
        cmd.SetAction(Execute);
        return cmd;
    }

    internal static bool TryParseSize(string? text, int defaultW, int defaultH, out int w, out int h)
    {
        w = defaultW; h = defaultH;
        if (text is null) return true;
        var parts = text.ToLowerInvariant().Split('x', '×');
        return parts.Length == 2 && int.TryParse(parts[0], NumberStyles.Integer, CultureInfo.InvariantCulture, out w) && int.TryParse(parts[1], NumberStyles.Integer, CultureInfo.InvariantCulture, out h)
            && w >= 200 && h >= 150 && w <= 8000 && h <= 8000;
    }

    private int Execute(ParseResult parse)
    {
        string kind = parse.GetValue(Kind)!, outPath = parse.GetValue(Out)!;
        if (!outPath.EndsWith(".png", StringComparison.OrdinalIgnoreCase) && !outPath.EndsWith(".svg", StringComparison.OrdinalIgnoreCase))
            return Fail($"--out '{outPath}' must end in .png or .svg.");
        int dw = 1200, dh = kind == "swatch" ? 520 : 900;
        if (!TryParseSize(parse.GetValue(Size), dw, dh, out int w, out int h)) return Fail("--size must be WIDTHxHEIGHT in pixels, 200x150 to 8000x8000 (e.g. 1200x900).");
        if (!SpecFile.TryLoad(parse.GetValue(Spec), stderr, out var spec)) return ExitCodes.UsageOrInputError;
        var items = new List<AnalysisItem>();
        foreach (var f in SpectrumFiles.Expand(parse.GetValue(Files) ?? []))
            foreach (var r in SpectrumFiles.Read(f, null, stdin))
            {
                if (r.Error is not null) stderr.WriteLine($"lumen: {r.Error}");
                items.Add(AnalysisItem.From(r, AssessmentOptions.Default));
            }
        var ok = items.Where(i => i.Result is not null).ToList();
        if (ok.Count == 0) return Fail("no readable spectrum to plot.");
        string? name = parse.GetValue(Name);
        var chosen = name is null ? ok[0] : ok.FirstOrDefault(i => i.Record.Name == name);
        if (chosen is null) return Fail($"no spectrum named '{name}'; names: {string.Join(", ", ok.Select(i => i.Record.Name).Take(20))}.");
        if (kind != "locus" && name is null && ok.Count > 1) stderr.WriteLine($"lumen: plotting '{chosen.Record.Name}', the first of {ok.Count} spectra (choose with --name).");
        var a = chosen.Result!;
        var spectrum = chosen.Record.Spectrum!;
        try
        {
            switch (kind)
            {
                case "locus":
                    var pts = ok.Select(i => new DiagramPoint(i.Record.Name, i.Result!.Chromaticity2Degree,
                        spec is null ? PointStatus.None : spec.Evaluate(i.Result.Chromaticity2Degree, p => AssessmentFields.Get(i.Result, p)).Pass ? PointStatus.Pass : PointStatus.Fail)).ToList();
                    var space = parse.GetValue(Space) == "uv" ? DiagramSpace.UPrimeVPrime : DiagramSpace.Xy;
                    Render.ToFile(outPath, w, h, (c, z) => ChromaticityDiagram.Draw(c, z, new DiagramOptions(space, pts, spec, space == DiagramSpace.Xy ? "CIE 1931 chromaticity" : "CIE 1976 u′v′ chromaticity")));
                    break;
                case "spectrum":
                    Render.ToFile(outPath, w, h, (c, z) => SpectrumPlot.Draw(c, z, spectrum, a.Cct.CctKelvin, !parse.GetValue(Absolute)));
                    break;
                case "swatch":
                    Render.ToFile(outPath, w, h, (c, z) => SwatchPlot.Draw(c, z, spectrum, a.Chromaticity2Degree, a.Cct.CctKelvin, a.Fidelity));
                    break;
                default:
                    if (a.Fidelity is null) return Fail($"'{a.Name}' has no CIE 224 / TM-30 result (CCT outside 1000–25000 K), so no vector graphic.");
                    Render.ToFile(outPath, w, h, (c, z) => VectorGraphic.Draw(c, z, a.Fidelity, a.Name));
                    break;
            }
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            return Fail($"cannot write '{outPath}': {ex.Message}");
        }
        stdout.WriteLine($"wrote {outPath}");
        return items.Any(i => i.Result is null) ? ExitCodes.UsageOrInputError : ExitCodes.Success;
    }

    private int Fail(string message)
    {
        stderr.WriteLine($"lumen plot: {message}");
        return ExitCodes.UsageOrInputError;
    }
}

/// <summary>Loads an optional spec file for a command, reporting its errors.</summary>
internal static class SpecFile
{
    /// <summary>Loads and prepares the spec at <paramref name="path"/> (none when null).</summary>
    /// <returns>False when the file has errors (already written to <paramref name="stderr"/>).</returns>
    public static bool TryLoad(string? path, TextWriter stderr, out PreparedSpec? spec)
    {
        spec = null;
        if (path is null) return true;
        var s = SpecReader.ReadFile(path, out var errors);
        if (s is null)
        {
            foreach (var e in errors) stderr.WriteLine($"lumen: {e}");
            return false;
        }
        spec = SpecEvaluator.Prepare(s);
        return true;
    }
}

/// <summary><c>lumen report INPUT... [--spec SPEC] --out report.html</c>: a self-contained HTML report.</summary>
internal sealed class ReportCommand(TextReader stdin, TextWriter stdout, TextWriter stderr)
{
    public Argument<string[]> Inputs { get; } = new("inputs") { Description = "Spectrum files or folders.", Arity = ArgumentArity.OneOrMore };
    public Option<string?> Spec { get; } = new("--spec") { Description = "Tolerance spec: verdicts, and the batch layout for more than one spectrum." };
    public Option<string> Out { get; } = new("--out", "-o") { Description = "HTML file.", Required = true };

    public Command Build()
    {
        var cmd = new Command("report", "Write one self-contained HTML report (inline SVG and CSS, no scripts) for a source or a batch.") { Inputs, Spec, Out };
        cmd.SetAction(Execute);
        return cmd;
    }

    private int Execute(ParseResult parse)
    {
        if (!SpecFile.TryLoad(parse.GetValue(Spec), stderr, out var spec)) return ExitCodes.UsageOrInputError;
        var files = SpectrumFiles.Expand(parse.GetValue(Inputs) ?? []);
        var records = files.SelectMany(f => SpectrumFiles.Read(f, null, stdin)).ToList();
        foreach (var r in records.Where(r => r.Error is not null)) stderr.WriteLine($"lumen: {r.Error}");
        string html;
        if (spec is not null && records.Count > 1)
        {
            var items = new BatchItem[records.Count];
            Parallel.For(0, records.Count, i => items[i] = BatchCommand.Judge(records[i], spec, new AssessmentOptions(Metrics: MetricGroups.All)));
            var builder = new Lumen.Quality.BatchSummaryBuilder(spec.Spec.Limits.Select(l => (l.Field, l.Min, l.Max)).ToArray(),
                spec.Ellipse is { } e ? (x1, y1, x2, y2) => e.MovedTo(x2, y2).Steps(x1, y1) : null);
            foreach (var it in items)
            {
                if (it.Result is { } a) builder.AddResult(it.Record.Name, a.Chromaticity2Degree, it.Verdict!.Pass, p => AssessmentFields.Get(a, p), it.Verdict.StepsFromTarget);
                else builder.AddError();
            }
            html = HtmlReport.Batch(items, builder.Build(), spec);
        }
        else
        {
            html = HtmlReport.Single(records.Select(r => AnalysisItem.From(r, AssessmentOptions.Default)).ToList(), spec);
        }
        string outPath = parse.GetValue(Out)!;
        try { File.WriteAllText(outPath, html); }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            stderr.WriteLine($"lumen report: cannot write '{outPath}': {ex.Message}");
            return ExitCodes.UsageOrInputError;
        }
        stdout.WriteLine($"wrote {outPath}");
        return records.Any(r => r.Error is not null) ? ExitCodes.UsageOrInputError : ExitCodes.Success;
    }
}

using System.CommandLine;
using System.Globalization;
using System.Text;
using Lumen.Analysis;
using Lumen.Graphics;

namespace Lumen.Cli;

/// <summary><c>lumen plot KIND INPUT... -o PATH</c>: images (PNG or SVG). Parse → assess → draw the calculators' results → write.</summary>
internal sealed class PlotCommand(TextReader stdin, TextWriter stdout, TextWriter stderr)
{
    private readonly InputOptions _inputs = new();
    public Argument<string> Kind { get; } = new("kind") { Description = "swatch, locus, spectrum or vector." };
    public Option<string?> Out { get; } = OutputTarget.Option("Image file: .png or .svg (with '-', SVG goes to standard output).", required: true);
    public Option<string?> Size { get; } = new("--size") { Description = "Width×height in pixels, e.g. 1200x900." };
    public Option<string> Space { get; } = new("--space") { Description = "Diagram for locus: xy (CIE 1931) or uv (CIE 1976 u'v').", DefaultValueFactory = _ => "xy" };
    public Option<string?> Spec { get; } = new("--spec") { Description = "Tolerance spec: draws its quadrangle/ellipse/circle and marks points pass/fail." };
    private readonly UncertaintyOptions _uncertainty = new();
    public Option<string?> Name { get; } = new("--name") { Description = "Which spectrum to draw (swatch, spectrum, vector); default the first." };
    public Option<bool> Absolute { get; } = new("--absolute") { Description = "Spectrum plot in the file's absolute unit instead of normalised." };
    public Option<bool> Compare { get; } = new("--compare") { Description = "Show all sources against a reference: locus with a marker, label and correction arrow per source; spectrum overlay at equal luminance; swatch rows per source after white balance." };
    public Option<string?> Reference { get; } = new("--reference", "-r") { Description = "With --compare: the reference spectrum's name (default: the first)." };

    public Command Build()
    {
        Kind.AcceptOnlyFromAmong("swatch", "locus", "spectrum", "vector");
        Space.AcceptOnlyFromAmong("xy", "uv");
        var cmd = new Command("plot", "Draw a swatch, chromaticity diagram (locus), spectrum or TM-30 vector graphic as PNG or SVG.") { Kind };
        _inputs.AddTo(cmd);
        _uncertainty.AddTo(cmd);
        cmd.Add(Out); cmd.Add(Size); cmd.Add(Space); cmd.Add(Spec); cmd.Add(Name); cmd.Add(Absolute); cmd.Add(Compare); cmd.Add(Reference);
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
        bool svg = OutputTarget.IsStdout(outPath) || outPath.EndsWith(".svg", StringComparison.OrdinalIgnoreCase);
        if (!svg && !outPath.EndsWith(".png", StringComparison.OrdinalIgnoreCase)) return Fail($"--out '{outPath}' must end in .png or .svg.");
        int dw = 1200, dh = kind == "swatch" ? 520 : 900;
        if (!TryParseSize(parse.GetValue(Size), dw, dh, out int w, out int h)) return Fail("--size must be WIDTHxHEIGHT in pixels, 200x150 to 8000x8000 (e.g. 1200x900).");
        if (!CommonOptions.TryLoadSpec(parse.GetValue(Spec), stderr, out var spec)) return ExitCodes.UsageError;
        if (!_inputs.TryResolve(parse, stderr, out var inputs, parse.GetValue(Out))) return ExitCodes.UsageError;
        if (OutputTarget.ConflictWithInputs(outPath, inputs.Files) is { } conflict) return Fail(conflict + ".");
        if (!_uncertainty.TryLoad(parse, spec, stderr, out var model, out var run, out var rule)) return ExitCodes.UsageError;
        var items = new List<RecordOutcome>();
        // With an uncertainty model, the locus draws each point's 95 % ellipse: colorimetry is all the draws need.
        var uncertaintyOptions = new AssessmentOptions(Metrics: Lumen.Analysis.MetricGroups.Colorimetry);
        foreach (var r in inputs.Records(stdin))
        {
            var o = RecordOutcome.Of(r, AssessmentOptions.Default, spec);
            if (model is not null && kind == "locus" && o.Assessment is not null && r is SpectrumRecord sr)
                o = o with { Uncertainty = Lumen.Uncertainty.MonteCarlo.Run(sr.Spectrum, Assessor.Assess(sr.Spectrum, uncertaintyOptions), uncertaintyOptions, model, run, spec), Rule = rule };
            CommonOptions.ReportError(stderr, o.Error);
            items.Add(o);
        }
        var ok = items.Where(i => i.Assessment is not null).ToList();
        if (ok.Count == 0) return Fail("no readable spectrum to plot.");
        if (parse.GetValue(Compare)) return ExecuteCompare(parse, kind, outPath, svg, w, h, ok, items.Any(i => i.Error is not null));
        string? name = parse.GetValue(Name);
        var chosen = name is null ? ok[0] : ok.FirstOrDefault(i => i.Record.Name == name);
        if (chosen is null) return Fail($"no spectrum named '{name}'; names: {string.Join(", ", ok.Select(i => i.Record.Name).Take(20))}.");
        if (kind != "locus" && name is null && ok.Count > 1) stderr.WriteLine($"lumen: plotting '{chosen.Record.Name}', the first of {ok.Count} spectra (choose with --name).");
        var a = chosen.Assessment!;
        var spectrum = ((SpectrumRecord)chosen.Record).Spectrum;
        Action<SkiaSharp.SKCanvas, SkiaSharp.SKSize> draw;
        switch (kind)
        {
            case "locus":
                var pts = ok.Select(i => new DiagramPoint(i.Record.Name, i.Assessment!.Chromaticity2Degree,
                    i.Verdict is null ? PointStatus.None : i.Status switch { "pass" => PointStatus.Pass, "fail" => PointStatus.Fail, _ => PointStatus.Inconclusive })
                    { UPrimeVPrimeCovariance = i.Uncertainty?.UPrimeVPrimeCovariance }).ToList();
                var space = parse.GetValue(Space) == "uv" ? DiagramSpace.UPrimeVPrime : DiagramSpace.Xy;
                draw = (c, z) => ChromaticityDiagram.Draw(c, z, new DiagramOptions(space, pts, spec, space == DiagramSpace.Xy ? "CIE 1931 chromaticity" : "CIE 1976 u′v′ chromaticity"));
                break;
            case "spectrum":
                draw = (c, z) => SpectrumPlot.Draw(c, z, spectrum, a.Fidelity?.Reference, !parse.GetValue(Absolute));
                break;
            case "swatch":
                draw = (c, z) => SwatchPlot.Draw(c, z, spectrum, a);
                break;
            default:
                if (a.Fidelity is not { } fidelity) return Fail($"'{a.Name}' has no CIE 224 / TM-30 result (CCT outside 1000–25000 K), so no vector graphic.");
                draw = (c, z) => VectorGraphic.Draw(c, z, fidelity, a.Name);
                break;
        }
        if (WriteImage(outPath, svg, w, h, draw) is { } failure) return CommonOptions.OutputFailed(stderr, failure);
        return items.Any(i => i.Error is not null) ? ExitCodes.InputErrors : ExitCodes.Success;
    }

    private int ExecuteCompare(ParseResult parse, string kind, string outPath, bool svg, int w, int h, List<RecordOutcome> ok, bool anyError)
    {
        if (ok.Count < 2) return Fail("--compare needs a reference and at least one other spectrum.");
        string? refName = parse.GetValue(Reference);
        var reference = refName is null ? ok[0] : ok.FirstOrDefault(i => i.Record.Name == refName);
        if (reference is null) return Fail($"no spectrum named '{refName}'; names: {string.Join(", ", ok.Select(i => i.Record.Name).Take(20))}.");
        var ordered = new[] { reference }.Concat(ok.Where(i => !ReferenceEquals(i, reference))).ToList();
        var spectra = ordered.Select(i => ((SpectrumRecord)i.Record).Spectrum).ToList();
        Action<SkiaSharp.SKCanvas, SkiaSharp.SKSize> draw;
        switch (kind)
        {
            case "locus":
                var space = parse.GetValue(Space) == "uv" ? DiagramSpace.UPrimeVPrime : DiagramSpace.Xy;
                var refC = reference.Assessment!.Chromaticity2Degree;
                var options = new DiagramOptions(space, ordered.Select(i => new DiagramPoint(i.Record.Name, i.Assessment!.Chromaticity2Degree, PointStatus.None)).ToList(), null,
                    $"Sources against {reference.Record.Name} ({(space == DiagramSpace.Xy ? "CIE 1931 xy" : "CIE 1976 u′v′")})")
                {
                    DistinctSources = true,
                    Arrows = ordered.Skip(1).Select(i => (i.Assessment!.Chromaticity2Degree, refC)).ToList(),
                };
                draw = (c, z) => ChromaticityDiagram.Draw(c, z, options);
                break;
            case "spectrum":
                draw = (c, z) => SpectrumPlot.DrawMany(c, z, spectra);
                break;
            case "swatch":
                if (parse.GetValue(Size) is null) h = Math.Clamp(260 + 80 * spectra.Count, 400, 8000);
                draw = (c, z) => SwatchPlot.DrawComparison(c, z, spectra[0], reference.Assessment!.Fidelity, spectra.Skip(1).ToList());
                break;
            default:
                return Fail("--compare draws locus, spectrum or swatch; the vector graphic shows one source at a time.");
        }
        if (WriteImage(outPath, svg, w, h, draw) is { } failure) return CommonOptions.OutputFailed(stderr, failure);
        return anyError ? ExitCodes.InputErrors : ExitCodes.Success;
    }

    /// <summary>Renders and writes the image (SVG on standard output for '-'); null on success, else the reason.</summary>
    private string? WriteImage(string outPath, bool svg, int w, int h, Action<SkiaSharp.SKCanvas, SkiaSharp.SKSize> draw)
    {
        string? failure = OutputTarget.IsStdout(outPath)
            ? OutputTarget.WriteText(outPath, stdout, t => t.Write(Render.Svg(w, h, draw)))
            : svg ? OutputTarget.WriteBytes(outPath, new UTF8Encoding(false).GetBytes(Render.Svg(w, h, draw)))
            : OutputTarget.WriteBytes(outPath, Render.Png(w, h, draw));
        if (failure is null && !OutputTarget.IsStdout(outPath)) stdout.WriteLine($"wrote {outPath}");
        return failure;
    }

    private int Fail(string message)
    {
        stderr.WriteLine($"lumen plot: {message}");
        return ExitCodes.UsageError;
    }
}

using System.CommandLine;
using System.Globalization;
using System.Text;
using Lumen.Analysis;
using Lumen.Colorimetry;
using Lumen.Formats;
using Lumen.Graphics;
using Lumen.Mixing;
using Lumen.Spectra;
using Lumen.Temperature;

namespace Lumen.Cli;

/// <summary>
/// <c>lumen mix CHANNELS --cct K [--duv d] | --xy x,y | --uv u′,v′ | --match FILE[:NAME] | --cct-range A:B:STEP</c>: the
/// channel levels of a multi-channel fixture that hit a target light. Parse → solve in Core → write.
/// </summary>
internal sealed class MixCommand(TextReader stdin, TextWriter stdout, TextWriter stderr)
{
    private readonly InputOptions _inputs = new();
    public Option<double?> Cct { get; } = new Option<double?>("--cct") { Description = "Target CCT, K (with --duv; default Duv 0)." }.Strict();
    public Option<double> Duv { get; } = new Option<double>("--duv") { Description = "Target Duv (with --cct or --cct-range), default 0.", DefaultValueFactory = _ => 0 }.Strict();
    public Option<string?> Xy { get; } = new("--xy") { Description = "Target CIE 1931 chromaticity 'x,y', e.g. 0.4369,0.4041." };
    public Option<string?> Uv { get; } = new("--uv") { Description = "Target CIE 1976 chromaticity 'u′,v′'." };
    public Option<string?> Match { get; } = new("--match") { Description = "A measured source to match: FILE or FILE:NAME (its chromaticity is the target; SSI is reported and can be the objective)." };
    public Option<string?> Range { get; } = new("--cct-range") { Description = "A sweep along the Planckian locus (or at --duv): FROM:TO:STEP in K, e.g. 2700:6500:100." };
    public Option<double> Tolerance { get; } = new Option<double>("--tolerance") { Description = "Largest Δu′v′ that counts as on target (default 0.0005).", DefaultValueFactory = _ => ChannelMixer.DefaultTolerance }.Strict();
    public Option<string?> Maximize { get; } = new("--maximize") { Description = "rf (default), ra, r9, ssi, output or melanopic-der." };
    public Option<string?> Minimize { get; } = new("--minimize") { Description = "melanopic-der." };
    public Option<double?> MaxTotal { get; } = new Option<double?>("--max-total") { Description = "Cap on the sum of the levels (each level is at most 1)." }.Strict();
    public Option<string> Format { get; } = CommonOptions.Format("text", "json", "csv");
    public Option<string?> Out { get; } = OutputTarget.Option("Write the result to this file instead of standard output.");
    public Option<string?> Export { get; } = new("--export") { Description = "Write the mixed spectrum (one target) to this file: IES TM-27 XML for .spdx, else CSV that 'lumen analyze' reads." };
    public Option<string?> Plot { get; } = new("--plot") { Description = "With --cct-range: also draw the levels and Rf/Rg against CCT to this .png or .svg." };

    public Command Build()
    {
        Maximize.AcceptOnlyFromAmong("rf", "ra", "r9", "ssi", "output", "melanopic-der");
        Minimize.AcceptOnlyFromAmong("melanopic-der");
        var cmd = new Command("mix", "Channel levels (0–1) of a multi-channel fixture that hit a target CCT/Duv, chromaticity or measured source, with the best Rf (or another objective); sweeps along the locus.");
        _inputs.AddTo(cmd);
        foreach (var o in new Option[] { Cct, Duv, Xy, Uv, Match, Range, Tolerance, Maximize, Minimize, MaxTotal, Format, Out, Plot, Export }) cmd.Add(o);
        cmd.SetAction(Execute);
        return cmd;
    }

    private int Fail(string message)
    {
        stderr.WriteLine($"lumen mix: {message}");
        return ExitCodes.UsageError;
    }

    private int Execute(ParseResult parse)
    {
        var outPath = parse.GetValue(Out);
        if (!_inputs.TryResolve(parse, stderr, out var inputs, outPath, parse.GetValue(Plot))) return ExitCodes.UsageError;
        if (OutputTarget.ConflictWithInputs(outPath, inputs.Files) is { } conflict) return Fail(conflict + ".");
        int targets = new object?[] { parse.GetValue(Cct), parse.GetValue(Xy), parse.GetValue(Uv), parse.GetValue(Match), parse.GetValue(Range) }.Count(o => o is not null);
        if (targets != 1) return Fail("give exactly one target: --cct K [--duv d], --xy x,y, --uv u',v', --match FILE[:NAME] or --cct-range FROM:TO:STEP.");
        var objective = parse.GetValue(Minimize) is not null ? MixObjective.MinimizeMelanopicDer : parse.GetValue(Maximize) switch
        {
            "ra" => MixObjective.MaximizeRa,
            "r9" => MixObjective.MaximizeR9,
            "ssi" => MixObjective.MaximizeSsi,
            "output" => MixObjective.MaximizeOutput,
            "melanopic-der" => MixObjective.MaximizeMelanopicDer,
            _ => MixObjective.MaximizeRf,
        };
        if (parse.GetValue(Minimize) is not null && parse.GetValue(Maximize) is not null) return Fail("give --maximize or --minimize, not both.");
        double tolerance = parse.GetValue(Tolerance);
        if (!(tolerance > 0)) return Fail("--tolerance must be a positive Δu'v'.");
        double? cap = parse.GetValue(MaxTotal);
        if (cap is { } c0 && !(c0 > 0)) return Fail("--max-total must be positive.");

        var channels = new List<Spectrum>();
        bool anyError = false;
        foreach (var r in inputs.Records(stdin))
        {
            if (r is SpectrumRecord s) channels.Add(s.Spectrum);
            else if (r is ErrorRecord e) { CommonOptions.ReportError(stderr, e.Error); anyError = true; }
        }
        if (channels.Count < 2) return anyError ? ExitCodes.InputErrors : Fail($"need at least two channel spectra; found {channels.Count}.");

        Spectrum? match = null;
        var targetsList = new List<Chromaticity>();
        double duv = parse.GetValue(Duv);
        if (parse.GetValue(Cct) is { } t)
        {
            if (!(t >= 1000 && t <= 100000)) return Fail("--cct must be within 1000–100000 K.");
            targetsList.Add(CctSolver.ToChromaticity(t, duv));
        }
        else if (parse.GetValue(Xy) is { } xy)
        {
            if (!TryPair(xy, out var a, out var b)) return Fail($"--xy '{xy}' is not 'x,y' (two numbers with '.' decimals).");
            targetsList.Add(Chromaticity.FromXy(a, b));
        }
        else if (parse.GetValue(Uv) is { } uv)
        {
            if (!TryPair(uv, out var a, out var b)) return Fail($"--uv '{uv}' is not 'u',v'' (two numbers with '.' decimals).");
            targetsList.Add(Chromaticity.FromUPrimeVPrime(a, b));
        }
        else if (parse.GetValue(Match) is { } m)
        {
            int colon = m.LastIndexOf(':');
            string file = colon > 0 && !File.Exists(m) ? m[..colon] : m, name = colon > 0 && !File.Exists(m) ? m[(colon + 1)..] : "";
            var read = SpectrumFiles.Read(file, null, stdin).OfType<SpectrumRecord>().ToList();
            var chosen = name.Length == 0 ? read.FirstOrDefault() : read.FirstOrDefault(r => r.Name == name);
            if (chosen is null) return Fail($"--match: no readable spectrum{(name.Length > 0 ? $" named '{name}'" : "")} in '{file}'.");
            match = chosen.Spectrum;
            targetsList.Add(Assessor.Assess(match, new AssessmentOptions(Metrics: MetricGroups.Colorimetry)).Chromaticity2Degree);
        }
        var range = parse.GetValue(Range);
        var sweepCcts = new List<double>();
        if (range is not null)
        {
            var parts = range.Split(':');
            if (parts.Length != 3 || !CommonOptions.TryParseNumber(parts[0], out var from) || !CommonOptions.TryParseNumber(parts[1], out var to) || !CommonOptions.TryParseNumber(parts[2], out var step)
                || !(from >= 1000 && to <= 100000 && to >= from && step > 0) || (to - from) / step > 1000)
                return Fail($"--cct-range '{range}' must be FROM:TO:STEP in K within 1000–100000, at most 1000 steps (e.g. 2700:6500:100).");
            for (double k = from; k <= to + 1e-9; k += step) { sweepCcts.Add(k); targetsList.Add(CctSolver.ToChromaticity(k, duv)); }
        }
        if (objective == MixObjective.MaximizeSsi && match is null) return Fail("--maximize ssi needs --match.");

        if (channels.Count(c => Assessor.Assess(c, new AssessmentOptions(Metrics: MetricGroups.Colorimetry)).Chromaticity2Degree.IsDefined) == 0)
            return Fail("no channel has visible power.");
        var results = targetsList.Select(target => ChannelMixer.Solve(channels, target, objective, tolerance, cap, match)).ToList();
        var format = CommonOptions.ToOutputFormat(parse.GetValue(Format));
        if (OutputTarget.WriteText(outPath, stdout, w => MixWriter.Write(results, format, w, sweep: range is not null)) is { } failure)
            return CommonOptions.OutputFailed(stderr, failure);
        if (parse.GetValue(Plot) is { } plotPath)
        {
            if (range is null) return Fail("--plot needs --cct-range.");
            bool svg = plotPath.EndsWith(".svg", StringComparison.OrdinalIgnoreCase);
            if (!svg && !plotPath.EndsWith(".png", StringComparison.OrdinalIgnoreCase)) return Fail("--plot must end in .png or .svg.");
            void Draw(SkiaSharp.SKCanvas cv, SkiaSharp.SKSize z) => MixSweepPlot.Draw(cv, z, results);
            var f = svg ? OutputTarget.WriteBytes(plotPath, new UTF8Encoding(false).GetBytes(Render.Svg(1200, 900, Draw))) : OutputTarget.WriteBytes(plotPath, Render.Png(1200, 900, Draw));
            if (f is not null) return CommonOptions.OutputFailed(stderr, f);
        }
        if (parse.GetValue(Export) is { } exportPath)
        {
            if (range is not null) return Fail("--export writes one mix: give a single target, not --cct-range.");
            var mixed = ChannelMixer.MixedSpectrum(channels, results[0].Levels, "mix " + string.Join(" ", results[0].Channels.Zip(results[0].Levels, (c, l) => FormattableString.Invariant($"{c}={l:0.###}"))));
            var f = OutputTarget.WriteText(exportPath, stdout, w =>
            {
                if (exportPath.EndsWith(".spdx", StringComparison.OrdinalIgnoreCase))
                    Tm27.Write(w, mixed, [new("Description", mixed.Name), new("DocumentCreator", "Lumen " + LumenApp.Version), new("Comments", "computed channel mix (channels assumed to add linearly), not a measurement")]);
                else SpectrumCsv.Write(w, mixed, "computed channel mix (channels assumed to add linearly), not a measurement");
            });
            if (f is not null) return CommonOptions.OutputFailed(stderr, f);
        }
        if (results.Any(r => !r.Reachable)) stderr.WriteLine($"lumen mix: {results.Count(r => !r.Reachable)} target(s) outside the channels' gamut; the nearest reachable mix is given.");
        return anyError ? ExitCodes.InputErrors : ExitCodes.Success;
    }

    private static bool TryPair(string text, out double a, out double b)
    {
        a = b = double.NaN;
        var p = text.Split(',');
        return p.Length == 2 && CommonOptions.TryParseNumber(p[0].Trim(), out a) && CommonOptions.TryParseNumber(p[1].Trim(), out b);
    }
}

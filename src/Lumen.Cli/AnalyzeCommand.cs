using System.CommandLine;
using Lumen.Analysis;
using Lumen.Blackbody;
using Lumen.Cie;
using Lumen.Formats;
using Lumen.Temperature;

namespace Lumen.Cli;

/// <summary><c>lumen analyze INPUT...</c>: every result for every spectrum. Parse options → assess each record → write.</summary>
internal sealed class AnalyzeCommand(TextReader stdin, TextWriter stdout, TextWriter stderr, CancellationToken interrupt = default)
{
    private readonly InputOptions _inputs = new();
    private readonly SpecOptions _spec = new(required: false);
    private readonly UncertaintyOptions _uncertainty = new();

    public Option<string> ObserverOption { get; } = new("--observer")
    {
        Description = "Observer for XYZ and chromaticity: 2 (CIE 1931) or 10 (CIE 1964). CCT/Duv always use 2°.",
        DefaultValueFactory = _ => "2",
    };

    public Option<string> FormatOption { get; } = CommonOptions.Format("text", "json", "jsonl", "csv");

    public Option<string?> OutputOption { get; } = OutputTarget.Option("Write results to this file instead of standard output.", false, "--output");

    public Option<bool> DetailOption { get; } = new("--detail")
    {
        Description = "With text output: every result of each spectrum after the table (R1–R14, hue bins, photometry, CIE S 026, descriptors).",
    };

    public Option<string> C2Option { get; } = new("--c2")
    {
        Description = "Second radiation constant for the Planckian locus: cie15 (1.4388e-2 m·K, default) or codata (CODATA 2018, CCT +16 ppm lower).",
        DefaultValueFactory = _ => "cie15",
    };

    public Option<int> ThreadsOption { get; } = CommonOptions.Threads();

    public Option<string> MetricsOption { get; } = new("--metrics")
    {
        Description = "Result groups, comma-separated: colorimetry, cri, fidelity (tm30), photometry, nonvisual, spectral, all. Default: all.",
        DefaultValueFactory = _ => "all",
    };

    /// <summary>Parses a --metrics value.</summary>
    internal static bool TryParseMetrics(string text, out MetricGroups groups, out string? bad)
    {
        groups = MetricGroups.Colorimetry;
        bad = null;
        foreach (var part in text.Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries))
        {
            switch (part.ToLowerInvariant())
            {
                case "all": groups |= MetricGroups.All; break;
                case "colorimetry": case "colourimetry": break;
                case "cri": groups |= MetricGroups.Cri; break;
                case "fidelity": case "tm30": case "cie224": groups |= MetricGroups.Fidelity; break;
                case "photometry": groups |= MetricGroups.Photometry; break;
                case "nonvisual": case "non-visual": case "s026": groups |= MetricGroups.NonVisual; break;
                case "spectral": groups |= MetricGroups.Spectral; break;
                default: bad = part; return false;
            }
        }
        return true;
    }

    public Command Build()
    {
        ObserverOption.AcceptOnlyFromAmong("2", "10");
        C2Option.AcceptOnlyFromAmong("cie15", "codata");
        var cmd = new Command("analyze", "Chromaticity (XYZ, xy, u'v'), CCT, Duv, colour rendition (Ra, R1–R14, Rf, Rg), photometry and CIE S 026 values of every spectrum in the inputs.");
        _inputs.AddTo(cmd);
        _spec.AddTo(cmd);
        _uncertainty.AddTo(cmd);
        cmd.Add(ObserverOption); cmd.Add(FormatOption); cmd.Add(OutputOption); cmd.Add(MetricsOption); cmd.Add(C2Option); cmd.Add(DetailOption); cmd.Add(ThreadsOption);
        cmd.SetAction(Execute);
        return cmd;
    }

    private int Execute(ParseResult parse)
    {
        if (!_spec.TryLoad(parse, stdout, stderr, out var spec, out bool printed)) return ExitCodes.UsageError;
        if (printed) return ExitCodes.Success;
        if (!_inputs.TryResolve(parse, stderr, out var inputs, parse.GetValue(OutputOption))) return ExitCodes.UsageError;
        if (!_uncertainty.TryLoad(parse, spec, stderr, out var model, out var run, out var rule)) return ExitCodes.UsageError;
        if (!TryParseMetrics(parse.GetValue(MetricsOption) ?? "all", out var metrics, out var badMetric))
        {
            stderr.WriteLine($"lumen: --metrics: '{badMetric}' is not a metric group; expected colorimetry, cri, fidelity, photometry, nonvisual, spectral or all.");
            return ExitCodes.UsageError;
        }
        var outPath = parse.GetValue(OutputOption);
        if (OutputTarget.ConflictWithInputs(outPath, inputs.Files) is { } conflict) { stderr.WriteLine($"lumen: {conflict}."); return ExitCodes.UsageError; }
        var observer = parse.GetValue(ObserverOption) == "10" ? Observer.Cie1964TenDegree : Observer.Cie1931TwoDegree;
        var c2 = parse.GetValue(C2Option) == "codata" ? C2Convention.Codata2018 : C2Convention.Cie15Its90;
        var options = new AssessmentOptions(observer, new CctOptions(C2: c2), spec is null ? metrics : metrics | spec.RequiredMetrics);

        var format = CommonOptions.ToOutputFormat(parse.GetValue(FormatOption));
        bool anyError = false, anyFail = false, anyInconclusive = false;
        // Records in parallel blocks (issue 16); with an uncertainty model, one record at a time and its draws on all cores.
        int threads = model is null ? Math.Max(1, parse.GetValue(ThreadsOption)) : 1;
        IEnumerable<RecordOutcome> Outcomes() => RecordBlocks.Stream(inputs.Deferred(stdin), options, spec, o => UncertaintyOptions.Propagate(o, options, spec, model, run, rule), threads, interrupt);
        RecordOutcome Next(RecordOutcome outcome)
        {
            CommonOptions.ReportError(stderr, outcome.Error);
            anyError |= outcome.Error is not null;
            anyFail |= outcome.Status == "fail";
            anyInconclusive |= outcome.Status == "inconclusive";
            return outcome;
        }
        // JSON and CSV stream record by record (flat memory); the text table is sized from all rows.
        // Ctrl+C / SIGTERM: no further record is read; what was computed is written (to FILE.partial for a file).
        long written = 0;
        RecordOutcome Counted(RecordOutcome o) { written++; return Next(o); }
        string? failure = format == OutputFormat.Text
            ? OutputTarget.WriteText(outPath, stdout, w => AnalysisWriter.Write(Outcomes().Select(Counted).ToList(), format, w, parse.GetValue(DetailOption)),
                partial: () => interrupt.IsCancellationRequested)
            : OutputTarget.WriteText(outPath, stdout, w =>
            {
                var writer = new AnalysisStreamWriter(w, format, withVerdict: spec is not null, spec: spec, withUncertainty: model is not null);
                foreach (var outcome in Outcomes()) writer.Write(Counted(outcome));
                writer.Complete();
            }, partial: () => interrupt.IsCancellationRequested);
        if (failure is not null) return CommonOptions.OutputFailed(stderr, failure);
        if (interrupt.IsCancellationRequested)
        {
            bool toStdout = OutputTarget.IsStdout(outPath);
            stderr.WriteLine($"lumen: interrupted: {written:N0} records were written to {(toStdout ? "standard output" : $"'{OutputTarget.PartialPath(outPath!)}'")}; "
                + (toStdout ? "" : $"'{outPath}' was not changed. ") + "Run the analysis again to get the complete results.");
            return ExitCodes.Interrupted;
        }
        if (spec is not null && format == OutputFormat.Text && OutputTarget.IsStdout(outPath))
        {
            if (spec.TargetDescription is { } target) stdout.WriteLine($"Specification: {spec.Spec.Description}. Target: {target}.");
            foreach (var c in spec.Cautions) stdout.WriteLine($"! {c}");
            stdout.WriteLine($"Decision rule: {Lumen.Uncertainty.Decisions.Describe(rule)}.");
        }
        return anyError ? ExitCodes.InputErrors : anyFail ? ExitCodes.SpecificationFailed : anyInconclusive ? ExitCodes.Inconclusive : ExitCodes.Success;
    }
}

using System.CommandLine;
using Lumen.Analysis;
using Lumen.BatchStatistics;
using Lumen.Graphics;

namespace Lumen.Cli;

/// <summary><c>lumen report INPUT... [--spec SPEC] -o report.html</c>: a self-contained HTML report. Parse → assess and judge → render → write.</summary>
internal sealed class ReportCommand(TextReader stdin, TextWriter stdout, TextWriter stderr)
{
    private readonly InputOptions _inputs = new();
    public Option<string?> Spec { get; } = new("--spec") { Description = "Tolerance spec: verdicts, and the batch layout for more than one spectrum." };
    public Option<string?> Out { get; } = OutputTarget.Option("HTML file.", required: true);

    public Command Build()
    {
        var cmd = new Command("report", "Write one self-contained HTML report (inline SVG and CSS, no scripts) for a source or a batch.");
        _inputs.AddTo(cmd);
        cmd.Add(Spec); cmd.Add(Out);
        cmd.SetAction(Execute);
        return cmd;
    }

    private int Execute(ParseResult parse)
    {
        if (!CommonOptions.TryLoadSpec(parse.GetValue(Spec), stderr, out var spec)) return ExitCodes.UsageError;
        if (!_inputs.TryResolve(parse, stderr, out var inputs, parse.GetValue(Out))) return ExitCodes.UsageError;
        string outPath = parse.GetValue(Out)!;
        if (OutputTarget.ConflictWithInputs(outPath, inputs.Files) is { } conflict) { stderr.WriteLine($"lumen report: {conflict}."); return ExitCodes.UsageError; }
        var records = inputs.Records(stdin).ToList();
        var items = new RecordOutcome[records.Count];
        Parallel.For(0, records.Count, i => items[i] = RecordOutcome.Of(records[i], AssessmentOptions.Default, spec));
        foreach (var it in items) CommonOptions.ReportError(stderr, it.Error);
        string html;
        if (spec is not null && records.Count > 1)
        {
            var builder = new BatchSummaryBuilder(spec);
            foreach (var it in items) builder.Add(it);
            html = HtmlReport.Batch(items, builder.Build(), spec);
        }
        else html = HtmlReport.Single(items, spec);
        if (OutputTarget.WriteText(outPath, stdout, w => w.Write(html)) is { } failure) return CommonOptions.OutputFailed(stderr, failure);
        if (!OutputTarget.IsStdout(outPath)) stdout.WriteLine($"wrote {outPath}");
        return items.Any(i => i.Error is not null) ? ExitCodes.InputErrors : ExitCodes.Success;
    }
}

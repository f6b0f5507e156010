using System.CommandLine;
using Lumen.Analysis;
using Lumen.Blackbody;
using Lumen.Formats;

namespace Lumen.Cli;

/// <summary><c>lumen fit INPUT...</c>: grey-body temperature of thermal sources by least squares. Parse → fit each record → write.</summary>
internal sealed class FitCommand(TextReader stdin, TextWriter stdout, TextWriter stderr)
{
    private readonly InputOptions _inputs = new();
    public Option<bool> Slope { get; } = new("--emissivity-slope") { Description = "Also fit a slowly varying (linear) emissivity." };
    public Option<string> Format { get; } = CommonOptions.Format("text", "json", "csv");
    public Option<string?> Out { get; } = OutputTarget.Option("Write the results to this file instead of standard output.");

    public Command Build()
    {
        var cmd = new Command("fit", "Fit a grey body (Planck × constant, optionally × a linear emissivity) to measured spectra and report the temperature with a 95 % interval.");
        _inputs.AddTo(cmd);
        cmd.Add(Slope); cmd.Add(Format); cmd.Add(Out);
        cmd.SetAction(Execute);
        return cmd;
    }

    private int Execute(ParseResult parse)
    {
        if (!_inputs.TryResolve(parse, stderr, out var inputs, parse.GetValue(Out))) return ExitCodes.UsageError;
        var outPath = parse.GetValue(Out);
        if (OutputTarget.ConflictWithInputs(outPath, inputs.Files) is { } conflict) { stderr.WriteLine($"lumen: {conflict}."); return ExitCodes.UsageError; }
        bool slope = parse.GetValue(Slope);
        var results = new List<ThermalWriters.FitOutcome>();
        foreach (var record in inputs.Records(stdin))
        {
            var outcome = record switch
            {
                SpectrumRecord s => new ThermalWriters.FitOutcome(record, GreyBodyFit.Fit(s.Spectrum, slope), null),
                ErrorRecord e => new ThermalWriters.FitOutcome(record, null, e.Error),
                _ => throw new InvalidOperationException("unknown record kind"),
            };
            CommonOptions.ReportError(stderr, outcome.Error);
            results.Add(outcome);
        }
        var format = CommonOptions.ToOutputFormat(parse.GetValue(Format));
        if (OutputTarget.WriteText(outPath, stdout, w => ThermalWriters.WriteFits(results, format, w)) is { } failure)
            return CommonOptions.OutputFailed(stderr, failure);
        return results.Any(r => r.Error is not null) ? ExitCodes.InputErrors : ExitCodes.Success;
    }
}

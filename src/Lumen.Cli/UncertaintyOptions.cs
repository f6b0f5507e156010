using System.CommandLine;
using Lumen.Analysis;
using Lumen.Conformance;
using Lumen.Formats;
using Lumen.Uncertainty;

namespace Lumen.Cli;

/// <summary>
/// The measurement-uncertainty options of analyze and batch: a model file, the Monte Carlo draws, seed and adaptive
/// procedure, and the decision rule of the verdicts.
/// </summary>
internal sealed class UncertaintyOptions
{
    public Option<string?> Model { get; } = new("--uncertainty") { Description = "Uncertainty model (JSON: relativeNoise, absoluteNoise, relativeScale, smoothRelative, wavelengthShiftNm): propagate it to every result by Monte Carlo (JCGM 101)." };
    public Option<int> Draws { get; } = new Option<int>("--draws") { Description = "Monte Carlo draws per spectrum (with --adaptive: per block). Default 10000.", DefaultValueFactory = _ => 10_000 }.Strict("10000");
    public Option<ulong> Seed { get; } = new Option<ulong>("--seed") { Description = "Seed of the draws: the same seed gives the same output on any number of threads. Default 1.", DefaultValueFactory = _ => 1UL }.Strict("42");
    public Option<bool> Adaptive { get; } = new("--adaptive") { Description = "Add blocks of draws until each standard uncertainty and interval is stable to two significant digits (JCGM 101 §7.9)." };
    public Option<string> Decision { get; } = new("--decision") { Description = "Decision rule of the verdicts: simple (default) or guarded (pass/fail only beyond the expanded uncertainty; otherwise inconclusive; needs --uncertainty).", DefaultValueFactory = _ => "simple" };

    public void AddTo(Command command)
    {
        Decision.AcceptOnlyFromAmong("simple", "guarded");
        foreach (var o in new Option[] { Model, Draws, Seed, Adaptive, Decision }) command.Add(o);
    }

    /// <summary>The settings, or false (with the message written) on a usage error.</summary>
    public bool TryLoad(ParseResult parse, PreparedSpec? spec, TextWriter stderr, out UncertaintyModel? model, out MonteCarloOptions run, out DecisionRule rule)
    {
        model = null;
        rule = parse.GetValue(Decision) == "guarded" ? DecisionRule.Guarded : DecisionRule.Simple;
        run = new MonteCarloOptions(parse.GetValue(Draws), parse.GetValue(Seed), parse.GetValue(Adaptive), Environment.ProcessorCount);
        if (run.Draws < 100 || run.Draws > 10_000_000) { stderr.WriteLine("lumen: --draws must be between 100 and 10000000 (JCGM 101 asks for many more draws than 1/(1 − 0.95) = 20)."); return false; }
        if (parse.GetValue(Model) is { } path)
        {
            model = UncertaintyModelReader.ReadFile(path, out var errors);
            if (model is null) { foreach (var e in errors) stderr.WriteLine($"lumen: {e}"); return false; }
        }
        if (rule == DecisionRule.Guarded && (model is null || spec is null))
        {
            stderr.WriteLine("lumen: --decision guarded needs an uncertainty model (--uncertainty MODEL.json) and a specification (--spec or its options).");
            return false;
        }
        return true;
    }

    /// <summary>An outcome with its uncertainty propagated (when a model is given) and its decision rule.</summary>
    public static RecordOutcome Propagate(RecordOutcome outcome, AssessmentOptions options, PreparedSpec? spec, UncertaintyModel? model, MonteCarloOptions run, DecisionRule rule)
    {
        if (model is null || outcome.Assessment is null || outcome.Record is not SpectrumRecord s) return outcome with { Rule = rule };
        return outcome with { Uncertainty = MonteCarlo.Run(s.Spectrum, outcome.Assessment, options, model, run, spec), Rule = rule };
    }
}

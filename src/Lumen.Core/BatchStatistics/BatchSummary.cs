namespace Lumen.BatchStatistics;

/// <summary>Summary of a batch.</summary>
/// <param name="RecordsRead">Records read (= results + errors).</param>
/// <param name="Results">Records with a result.</param>
/// <param name="Errors">Records that could not be read or computed.</param>
/// <param name="Passed">Results that passed the spec.</param>
/// <param name="Failed">Results that failed the spec (under guarded acceptance, <see cref="Inconclusive"/> ones are neither).</param>
/// <param name="Statistics">Mean/SD/min/max of key fields (cct.kelvin, cct.duv, cri.ra, cri.r9, fidelity.rf, fidelity.rg).</param>
/// <param name="MeanUPrime">Mean CIE 1976 u′ of the units with a defined chromaticity.</param>
/// <param name="MeanVPrime">Mean CIE 1976 v′ of the units with a defined chromaticity.</param>
/// <param name="MaxPairwiseDeltaUPrimeVPrime">Largest Δu′v′ between any two units (convex-hull diameter).</param>
/// <param name="StepsFromMean">Statistics of each unit's steps from the batch mean chromaticity.</param>
/// <param name="StepsFromMeanP95">95th percentile of steps from the batch mean.</param>
/// <param name="StepsFromTarget">Statistics of steps from the target (when the spec has one).</param>
/// <param name="StepsFromTargetP95">95th percentile of steps from the target.</param>
/// <param name="Outliers">Robust chromaticity outliers (median/MAD of Δu′v′ from the median, z &gt; 3.5).</param>
/// <param name="Capabilities">Ppk with its 95 % interval per limited field, and for the steps from the target under an ellipse tolerance.</param>
public sealed record BatchSummary(
    long RecordsRead, long Results, long Errors, long Passed, long Failed,
    IReadOnlyDictionary<string, RunningStatistics> Statistics,
    double MeanUPrime, double MeanVPrime, double MaxPairwiseDeltaUPrimeVPrime,
    RunningStatistics StepsFromMean, double StepsFromMeanP95,
    RunningStatistics StepsFromTarget, double StepsFromTargetP95,
    IReadOnlyList<Outlier> Outliers, IReadOnlyList<Capability> Capabilities)
{
    /// <summary>The screening caution printed with every verdict output.</summary>
    public const string Caution = "A pass here is a screening result on the data given, not a certification: accredited photometric testing, the applicable standards and local codes decide conformance.";

    /// <summary>Results too close to a limit to call under guarded acceptance (neither passed nor failed); 0 under simple acceptance.</summary>
    public long Inconclusive { get; init; }

    /// <summary>The decision rule the verdicts were read under.</summary>
    public Lumen.Uncertainty.DecisionRule Rule { get; init; } = Lumen.Uncertainty.DecisionRule.Simple;

    /// <summary>The metadata key the batch was grouped by, or null.</summary>
    public string? GroupedBy { get; init; }

    /// <summary>One summary per value of <see cref="GroupedBy"/>, in ordinal order of the value; empty without grouping.</summary>
    public IReadOnlyList<GroupSummary> Groups { get; init; } = [];

    /// <summary>How the batch was divided into subgroups for Cpk, in words, or null (Ppk only).</summary>
    public string? SubgroupRule { get; init; }

    /// <summary>Pass rate among results (NaN when none).</summary>
    public double PassRate => Results > 0 ? (double)Passed / Results : double.NaN;
}

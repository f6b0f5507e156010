using Lumen.Cie;
using Lumen.Temperature;

namespace Lumen.Analysis;

/// <summary>What to compute and how.</summary>
/// <param name="Observer">Observer for the reported tristimulus values and chromaticity (CCT always uses 2°).</param>
/// <param name="Cct">CCT method and c2 convention.</param>
/// <param name="Metrics">Which result groups to compute (default all).</param>
public sealed record AssessmentOptions(Observer Observer = Observer.Cie1931TwoDegree, CctOptions? Cct = null, MetricGroups Metrics = MetricGroups.All)
{
    /// <summary>The defaults: 2° observer, exact-locus CCT with CIE 15 c2.</summary>
    public static AssessmentOptions Default { get; } = new();

    /// <summary>The CCT options in force.</summary>
    public CctOptions CctOptions => Cct ?? CctOptions.Default;
}

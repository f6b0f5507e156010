namespace Lumen.BatchStatistics;

/// <summary>Process performance of one limited field over a batch (overall spread: Ppk), and its capability from the
/// within-subgroup spread (Cpk, <see cref="Within"/>) when the batch has subgroups.</summary>
/// <param name="Field">The field's name as in the results (<c>ResultFields</c> path such as <c>cri.ra</c>, or
/// <c>steps_from_target</c> for the chromaticity tolerance).</param>
/// <param name="Lower">Lower specification limit, or null.</param>
/// <param name="Upper">Upper specification limit, or null.</param>
/// <param name="Count">Number of finite values.</param>
/// <param name="Mean">Mean of the field over the batch, in the field's unit.</param>
/// <param name="StandardDeviation">Overall sample standard deviation (n − 1).</param>
/// <param name="Ppk">See <see cref="CapabilityIndex.Ppk"/>; NaN when it cannot be computed.</param>
/// <param name="PpkLower95">Lower end of the two-sided 95 % interval (<see cref="CapabilityIndex.BissellInterval(double, long, double)"/>).</param>
/// <param name="PpkUpper95">Upper end of the two-sided 95 % interval.</param>
public sealed record Capability(string Field, double? Lower, double? Upper, long Count, double Mean, double StandardDeviation, double Ppk, double PpkLower95, double PpkUpper95)
{
    /// <summary>Cpk from the pooled within-subgroup SD, or null when the batch has no subgroups.</summary>
    public WithinCapability? Within { get; init; }
}

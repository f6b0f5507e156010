namespace Lumen.BatchStatistics;

/// <summary>Process capability from the within-subgroup spread (Cpk), for batches divided into subgroups.</summary>
/// <param name="Subgroups">Number of subgroups.</param>
/// <param name="DegreesOfFreedom">Σ(nᵢ − 1) of the pooled SD.</param>
/// <param name="StandardDeviation">Pooled within-subgroup SD (<see cref="PooledVariance"/>).</param>
/// <param name="Cpk">min((USL − μ)/3s_p, (μ − LSL)/3s_p), μ the overall mean; NaN when it cannot be computed.</param>
/// <param name="CpkLower95">Lower end of the two-sided 95 % interval (<see cref="CapabilityIndex.BissellInterval(double, long, long, double)"/> with the pooled degrees of freedom).</param>
/// <param name="CpkUpper95">Upper end of the interval.</param>
public sealed record WithinCapability(long Subgroups, long DegreesOfFreedom, double StandardDeviation, double Cpk, double CpkLower95, double CpkUpper95);

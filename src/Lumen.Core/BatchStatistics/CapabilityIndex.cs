namespace Lumen.BatchStatistics;

/// <summary>Capability index arithmetic (docs/methods/conformance.md §5).</summary>
public static class CapabilityIndex
{
    /// <summary>z for a two-sided 95 % interval.</summary>
    public const double Z95 = 1.959963984540054;

    /// <summary>min((USL − μ)/3σ, (μ − LSL)/3σ) over the limits given; one-sided when only one limit exists
    /// (common practice). With σ the overall sample SD this is Ppk; with a within-subgroup σ it would be Cpk.</summary>
    /// <param name="mean">Mean μ.</param>
    /// <param name="sd">Standard deviation σ.</param>
    /// <param name="lower">Lower limit, or null.</param>
    /// <param name="upper">Upper limit, or null.</param>
    /// <returns>The index; NaN when σ is not positive or no limit is given.</returns>
    public static double Ppk(double mean, double sd, double? lower, double? upper)
    {
        if (!(sd > 0) || !double.IsFinite(mean) || (lower is null && upper is null)) return double.NaN;
        double k = double.PositiveInfinity;
        if (upper is { } hi) k = Math.Min(k, (hi - mean) / (3 * sd));
        if (lower is { } lo) k = Math.Min(k, (mean - lo) / (3 * sd));
        return k;
    }

    /// <summary>Approximate two-sided confidence interval for a Cpk/Ppk-type index from n normal values, after
    /// Bissell (1990): k̂ ± z·√(1/(9n) + k̂²/(2(n − 1))). An approximation, not the exact interval; it is good for
    /// n ≳ 25 and somewhat narrow below that (Bissell 1990; Montgomery, Introduction to Statistical Quality Control).</summary>
    /// <param name="index">The estimated index k̂.</param>
    /// <param name="n">Number of values.</param>
    /// <param name="z">Standard normal quantile (1.96 for 95 %).</param>
    /// <returns>(lower, upper); NaN for both when n &lt; 2 or the index is not finite.</returns>
    public static (double Lower, double Upper) BissellInterval(double index, long n, double z = Z95) =>
        BissellInterval(index, n, n - 1, z);

    /// <summary>Bissell's interval when σ is estimated with <paramref name="degreesOfFreedom"/> degrees of freedom other
    /// than n − 1 (a pooled within-subgroup SD has Σ(nᵢ − 1)): k̂ ± z·√(1/(9n) + k̂²/(2ν)). The first term is the mean's
    /// share of the variance (n values), the second the SD's (ν degrees of freedom); with ν = n − 1 it is Bissell's
    /// formula (docs/methods/conformance.md §5).</summary>
    /// <param name="index">The estimated index k̂.</param>
    /// <param name="n">Number of values behind the mean.</param>
    /// <param name="degreesOfFreedom">Degrees of freedom ν of the SD.</param>
    /// <param name="z">Standard normal quantile.</param>
    /// <returns>(lower, upper); NaN for both when n &lt; 2, ν &lt; 1 or the index is not finite.</returns>
    public static (double Lower, double Upper) BissellInterval(double index, long n, long degreesOfFreedom, double z = Z95)
    {
        if (n < 2 || degreesOfFreedom < 1 || !double.IsFinite(index)) return (double.NaN, double.NaN);
        double se = Math.Sqrt(1.0 / (9.0 * n) + index * index / (2.0 * degreesOfFreedom));
        return (index - z * se, index + z * se);
    }

    /// <summary>Builds a <see cref="Capability"/> from a field's running statistics and limits.</summary>
    /// <param name="field">Field name.</param>
    /// <param name="stats">The field's statistics over the batch.</param>
    /// <param name="lower">Lower limit, or null.</param>
    /// <param name="upper">Upper limit, or null.</param>
    /// <returns>The capability row.</returns>
    /// <param name="within">The field's pooled within-subgroup spread, or null when the batch has no subgroups.</param>
    public static Capability Of(string field, RunningStatistics stats, double? lower, double? upper, PooledVariance? within = null)
    {
        ArgumentNullException.ThrowIfNull(stats);
        double ppk = Ppk(stats.Mean, stats.StandardDeviation, lower, upper);
        var (l, u) = BissellInterval(ppk, stats.Count);
        WithinCapability? w = null;
        if (within is not null)
        {
            double cpk = Ppk(stats.Mean, within.StandardDeviation, lower, upper);
            var (cl, cu) = BissellInterval(cpk, stats.Count, within.DegreesOfFreedom);
            w = new WithinCapability(within.Subgroups, within.DegreesOfFreedom, within.StandardDeviation, cpk, cl, cu);
        }
        return new Capability(field, lower, upper, stats.Count, stats.Mean, stats.StandardDeviation, ppk, l, u) { Within = w };
    }
}

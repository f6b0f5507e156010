using Lumen.BatchStatistics;
using Lumen.Colorimetry;
using Lumen.Conformance;

namespace Lumen.Core.Tests;

/// <summary>Cpk from the pooled within-subgroup SD, groups, and per-record robust z (issue 13, lot statistics).</summary>
public class SubgroupCapabilityTests
{
    private static double Gauss(Random rng) => Math.Sqrt(-2 * Math.Log(1 - rng.NextDouble())) * Math.Cos(2 * Math.PI * rng.NextDouble());

    [Fact]
    public void Pooled_sd_is_the_root_of_the_df_weighted_subgroup_variances()
    {
        // By hand: subgroup a = {1, 2, 3} (s² = 1, ν = 2), b = {10, 14} (s² = 8, ν = 1):
        // s_p = √((2·1 + 1·8)/3) = √(10/3). A one-value subgroup adds no degrees of freedom.
        var p = new PooledVariance();
        foreach (var x in new[] { 1.0, 2, 3 }) p.Add("a", x);
        p.Add("b", 10); p.Add("b", 14);
        p.Add("c", 99);
        p.Close("a");
        p.CloseAll();
        Assert.Equal(Math.Sqrt(10.0 / 3), p.StandardDeviation, 12);
        Assert.Equal(3, p.DegreesOfFreedom);
        Assert.Equal(3, p.Subgroups);
        Assert.Equal(6, p.Count);
    }

    [Fact]
    public void Bissell_interval_with_n_minus_one_degrees_is_the_overall_interval()
    {
        Assert.Equal(CapabilityIndex.BissellInterval(1.33, 20), CapabilityIndex.BissellInterval(1.33, 20, 19));
        // Fewer degrees of freedom for the SD: a wider interval.
        var (lo, hi) = CapabilityIndex.BissellInterval(1.33, 20, 10);
        Assert.True(lo < 0.88 && hi > 1.78);
    }

    [Fact]
    public void Cpk_interval_covers_the_true_index_at_about_the_stated_rate()
    {
        // Simulation: 25 subgroups of 5 normal values (μ = 0, σ = 1), limits −4.5 … +3 → true Cpk = 1.0. The interval
        // uses n = 125 for the mean and ν = 100 for the pooled SD (approximate, after Bissell 1990): allow the Monte
        // Carlo error (±3 SE ≈ ±0.01) plus a small bias of the approximation.
        var rng = new Random(20261203);
        int covered = 0, batches = 3000;
        for (int b = 0; b < batches; b++)
        {
            var all = new RunningStatistics();
            var pooled = new PooledVariance();
            for (int g = 0; g < 25; g++)
            {
                string key = g.ToString(System.Globalization.CultureInfo.InvariantCulture);
                for (int i = 0; i < 5; i++) { double x = Gauss(rng); all.Add(x); pooled.Add(key, x); }
                pooled.Close(key);
            }
            var w = CapabilityIndex.Of("x", all, -4.5, 3, pooled).Within!;
            if (w.CpkLower95 <= 1.0 && 1.0 <= w.CpkUpper95) covered++;
        }
        Assert.InRange(covered / (double)batches, 0.925, 0.97);
    }

    [Fact]
    public void Cpk_sees_through_a_shift_between_subgroups_that_inflates_ppk_spread()
    {
        // Two lots 3σ apart: the overall SD includes the shift, the within-subgroup SD does not, so Cpk > Ppk.
        var spec = new PreparedSpec(new ToleranceSpec("s", null, new ChromaticityTolerance(ToleranceKind.None, 0), [new FieldLimit("cri.ra", 80, null, 1)]));
        var b = new BatchSummaryBuilder(spec, new BatchSummaryOptions(SubgroupSize: 10));
        var rng = new Random(9);
        var c = Chromaticity.FromUPrimeVPrime(0.25, 0.52);
        for (int i = 0; i < 200; i++)
        {
            double ra = 90 + (i < 100 ? 0 : 3) + Gauss(rng);
            b.AddResult($"U{i}", c, true, p => p == "cri.ra" ? ra : null, null);
        }
        var cap = Assert.Single(b.Build().Capabilities);
        var w = cap.Within!;
        Assert.Equal(20, w.Subgroups);
        Assert.Equal(180, w.DegreesOfFreedom);
        Assert.InRange(w.StandardDeviation, 0.85, 1.15);
        Assert.True(cap.StandardDeviation > 1.5);
        Assert.Equal((cap.Mean - 80) / (3 * w.StandardDeviation), w.Cpk, 9);
        Assert.True(w.Cpk > cap.Ppk);
    }

    [Fact]
    public void Robust_z_of_each_record_matches_the_outlier_list_and_errors_have_none()
    {
        var spec = new PreparedSpec(new ToleranceSpec("s", null, new ChromaticityTolerance(ToleranceKind.None, 0), []));
        var b = new BatchSummaryBuilder(spec);
        var rng = new Random(4);
        for (int i = 0; i < 50; i++)
        {
            if (i == 5) { b.AddError(); continue; }
            var c = Chromaticity.FromUPrimeVPrime(0.25 + (i == 20 ? 0.01 : 0.0005 * (rng.NextDouble() - 0.5)), 0.52);
            b.AddResult($"U{i}", c, true, _ => null, null);
        }
        var s = b.Build();
        var outlier = Assert.Single(s.Outliers);
        Assert.Equal("U20", outlier.Id);
        Assert.Equal(outlier.RobustZ, b.RobustZ(20), 4); // stored as float
        Assert.True(double.IsNaN(b.RobustZ(5)));
        Assert.True(b.RobustZ(19) < BatchSummaryBuilder.OutlierZ);
    }

    [Fact]
    public void Robust_z_is_found_by_ordinal_whether_errors_come_before_or_not()
    {
        // The same 40 points, once alone (every record at its own ordinal: the direct look-up) and once after an error and
        // with errors between (every look-up a search): each point keeps its robust z; errors and ordinals beyond the batch have none.
        var spec = new PreparedSpec(new ToleranceSpec("s", null, new ChromaticityTolerance(ToleranceKind.None, 0), []));
        var rng = new Random(9);
        var points = Enumerable.Range(0, 40).Select(_ => Chromaticity.FromUPrimeVPrime(0.25 + 0.001 * (rng.NextDouble() - 0.5), 0.52 + 0.001 * (rng.NextDouble() - 0.5))).ToArray();
        var alone = new BatchSummaryBuilder(spec);
        var mixed = new BatchSummaryBuilder(spec);
        var ordinal = new long[points.Length];
        long next = 0;
        mixed.AddError(); next++;
        for (int i = 0; i < points.Length; i++)
        {
            alone.AddResult($"U{i}", points[i], true, _ => null, null);
            if (i % 7 == 3) { mixed.AddError(); next++; }
            ordinal[i] = next++;
            mixed.AddResult($"U{i}", points[i], true, _ => null, null);
        }
        alone.Build();
        mixed.Build();
        for (int i = 0; i < points.Length; i++)
        {
            Assert.False(double.IsNaN(alone.RobustZ(i)));
            Assert.Equal(alone.RobustZ(i), mixed.RobustZ(ordinal[i]));
        }
        Assert.True(double.IsNaN(mixed.RobustZ(0)));
        Assert.True(double.IsNaN(mixed.RobustZ(4)));
        Assert.True(double.IsNaN(alone.RobustZ(-1)));
        Assert.True(double.IsNaN(alone.RobustZ(points.Length)));
        Assert.True(double.IsNaN(mixed.RobustZ(next + 3)));
    }
}

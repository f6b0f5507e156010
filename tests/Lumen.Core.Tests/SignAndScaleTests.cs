using Lumen.Analysis;
using Lumen.Spectra;

namespace Lumen.Core.Tests;

/// <summary>
/// The assessment's first look at a spectrum's values: the one-pass extremes, the warning for samples below zero and the
/// power-of-two scale for values far from 1 (issue 16 merged three passes over the values into one).
/// </summary>
public class SignAndScaleTests
{
    [Fact]
    public void The_one_pass_extremes_equal_a_plain_minimum_and_maximum()
    {
        // Every length around the vector widths, values of both signs and of every size (expected: LINQ's Min and Max).
        var rng = new Random(42);
        foreach (int n in Enumerable.Range(0, 41).Concat([63, 64, 65, 401]))
        {
            for (int trial = 0; trial < 20; trial++)
            {
                double size = Math.Pow(10, rng.Next(-320, 300));
                var v = Enumerable.Range(0, n).Select(_ => (rng.NextDouble() - 0.3) * size).ToArray();
                var (min, max) = Assessor.Extremes(v);
                Assert.Equal(n == 0 ? double.PositiveInfinity : v.Min(), min);
                Assert.Equal(n == 0 ? double.NegativeInfinity : v.Max(), max);
            }
        }
    }

    [Theory]
    [InlineData(-0.02, true)]  // 2 % of the peak below zero: more than noise
    [InlineData(-0.005, false)] // 0.5 %: noise after dark subtraction, counted but not a warning
    public void Samples_below_zero_warn_beyond_one_percent_of_the_peak(double dip, bool warns)
    {
        // The 1 % line is common practice (no published source); the values are kept in the sums either way.
        var w = Enumerable.Range(0, 81).Select(i => 380.0 + 5 * i).ToArray();
        var v = w.Select(x => Math.Exp(-Math.Pow((x - 560) / 60, 2))).ToArray();
        v[2] = dip;
        var a = Assessor.Assess(new Spectrum(w, v, SpectralUnit.Relative, "dip", new SpectrumOrigin("dip.csv", 2)));
        var warning = a.Warnings.FirstOrDefault(x => x.Contains("below zero", StringComparison.Ordinal));
        if (warns) Assert.Equal($"1 sample(s) below zero, down to {dip * 100 / v.Max():0.0} % of the peak: check the dark reference; values kept in the sums, not clipped.", warning);
        else Assert.Null(warning);
        Assert.Null(Assessor.NegativeValueWarning(0, (-0.5, 1))); // nothing below zero: nothing to say, whatever the extremes
    }

    [Theory]
    [InlineData(-1e-3, 1.0, 0)]        // ordinary values: no scale
    [InlineData(0.0, 0.0, 0)]          // a black spectrum: no scale
    [InlineData(0.0, 1e-310, -1030)]   // subnormal peak: scaled up by 2^1030 (ILogB(1e-310) = −1030)
    [InlineData(-1e20, 1e-3, 66)]      // the largest magnitude may be a negative value: 2^66 ≈ 7.4e19
    [InlineData(0.0, 1e18, 0)]         // at the edge of the ordinary range
    public void The_scale_is_the_power_of_two_of_the_largest_magnitude(double min, double max, int exponent) =>
        Assert.Equal(exponent, Assessor.ScaleExponentOf((min, max)));
}

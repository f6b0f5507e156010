using Lumen.Rendition;
using Lumen.Spectra;

namespace Lumen.Comparison;

/// <summary>
/// The Academy Spectral Similarity Index (SSI): how closely a test spectrum's shape follows a reference over
/// 375–675 nm, 0–100 (100 = the same shape).
/// </summary>
/// <remarks>docs/methods/compare.md §3 (steps of the Academy's 2016 definition). Checked against CIE C vs D65 = 94
/// (94.18 unrounded) and the D65 vs FL11 worked pair (26.18).</remarks>
public static class SpectralSimilarityIndex
{
    private const int Bins = 30;

    private static readonly double[] Weights = BuildWeights();

    /// <summary>The SSI of a test spectrum against a reference spectrum (both of any positive scale).</summary>
    /// <param name="test">The test spectrum.</param>
    /// <param name="reference">The reference spectrum.</param>
    /// <returns>The index: <c>Value</c> the published rounded integer, <c>Unrounded</c> before rounding (may be negative
    /// for very different spectra); NaN when either spectrum has no power in 375–675 nm.</returns>
    public static (int? Value, double Unrounded) Compute(Spectrum test, Spectrum reference)
    {
        ArgumentNullException.ThrowIfNull(test);
        ArgumentNullException.ThrowIfNull(reference);
        var t = Binned(test.ValueAt);
        var r = Binned(reference.ValueAt);
        if (t is null || r is null) return (null, double.NaN);
        var wd = new double[Bins];
        for (int j = 0; j < Bins; j++) wd[j] = Weights[j] * (t[j] - r[j]) / (r[j] + 1.0 / Bins);
        double sum = 0;
        for (int j = 0; j < Bins; j++)
        {
            double s = 0.56 * wd[j] + (j > 0 ? 0.22 * wd[j - 1] : 0) + (j < Bins - 1 ? 0.22 * wd[j + 1] : 0);
            sum += s * s;
        }
        double unrounded = 100 - 32 * Math.Sqrt(sum);
        return ((int)Math.Round(unrounded, MidpointRounding.AwayFromZero), unrounded);
    }

    /// <summary>The method's default reference at a CCT: a Planckian radiator below 4000 K, CIE daylight from 4000 K (from memory; docs/methods/compare.md §3).</summary>
    /// <param name="cctKelvin">The test source's CCT, K (1000–25 000 K).</param>
    /// <returns>The reference spectrum on 375–675 nm at 1 nm.</returns>
    public static Spectrum DefaultReference(double cctKelvin)
    {
        const int start = 375, count = 301;
        var values = cctKelvin < 4000 ? ReferenceIlluminants.Planckian(cctKelvin, start, 1, count) : ReferenceIlluminants.Daylight(cctKelvin, start, 1, count);
        return new Spectrum(WavelengthGrid.Regular(start, start + count - 1, 1), values, SpectralUnit.Relative,
            cctKelvin < 4000 ? $"Planckian {cctKelvin:0} K" : $"CIE daylight {cctKelvin:0} K", SpectrumOrigin.Generated("SSI default reference"));
    }

    private static double[]? Binned(Func<double, double> valueAt)
    {
        var bins = new double[Bins];
        double total = 0;
        for (int j = 0; j < Bins; j++)
        {
            double s = 0;
            for (int k = 0; k <= 10; k++)
            {
                double w = 375 + 10 * j + k;
                s += (k == 0 || k == 10 ? 0.5 : 1) * valueAt(w);
            }
            bins[j] = s;
            total += s;
        }
        if (!(total > 0) || !double.IsFinite(total)) return null;
        for (int j = 0; j < Bins; j++) bins[j] /= total;
        return bins;
    }

    private static double[] BuildWeights()
    {
        var w = Enumerable.Repeat(1.0, Bins).ToArray();
        double[] head = [4.0 / 15, 22.0 / 45, 32.0 / 45, 40.0 / 45, 44.0 / 45];
        head.CopyTo(w, 0);
        w[28] = 11.0 / 15;
        w[29] = 3.0 / 15;
        return w;
    }
}

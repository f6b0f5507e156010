using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Rendition;
using Lumen.Spectra;

namespace Lumen.Comparison;

/// <summary>Colour shift of reflecting samples between two white-balanced sources (docs/methods/compare.md §2).</summary>
public static class SampleShift
{
    /// <summary>The method in words.</summary>
    public const string Method = "CIE 224 CES and CIE 13.3 TCS13 under each source (CIE 1931 2°), CAT16 (D = 1) to CIE D65, CIELAB, CIEDE2000";

    private static readonly Lazy<Tristimulus> D65White = new(() => Colorimeter.Relative(CieTables.IlluminantD65.ToSpectrum("D65"), Observer.Cie1931TwoDegree));

    /// <summary>Compares the sample colours under two sources.</summary>
    /// <param name="reference">The reference source on a whole-nm grid (from <see cref="Resampler.ForCieSums"/>).</param>
    /// <param name="other">The other source, likewise.</param>
    /// <param name="worstCount">How many worst samples to list (≥ 0).</param>
    /// <returns>The shift; NaN values when a source has no visible power.</returns>
    public static SampleShiftResult Compute(RegularSamples reference, RegularSamples other, int worstCount = 5)
    {
        ArgumentNullException.ThrowIfNull(reference);
        ArgumentNullException.ThrowIfNull(other);
        var ces = DeltaE(reference, other, SampleSet.ColorEvaluationSamples);
        var tcs = DeltaE(reference, other, SampleSet.CieTestColorSamples);
        var worst = ces.Select((d, i) => (Sample: i + 1, DeltaE00: d)).Where(p => double.IsFinite(p.DeltaE00))
            .OrderByDescending(p => p.DeltaE00).Take(Math.Max(0, worstCount)).ToArray();
        double mean = ces.Average(), max = ces.Length > 0 ? ces.Max() : double.NaN;
        return new SampleShiftResult(Method, mean, max, worst, tcs.Length >= 13 ? tcs[12] : double.NaN, ces);
    }

    /// <summary>CIELAB (relative to D65, Y = 100) of every sample of a set under a source, after CAT16 to D65.</summary>
    /// <param name="light">The source.</param>
    /// <param name="set">The sample set.</param>
    /// <returns>One L*a*b* per sample, in table order.</returns>
    public static IReadOnlyList<Lab> AdaptedLab(RegularSamples light, SampleSet set)
    {
        var d65 = D65White.Value;
        return AdaptedXyz(light, set).Select(x => Cielab.FromXyz(x, d65)).ToArray();
    }

    /// <summary>XYZ of every sample of a set under a source, white-balanced by CAT16 (D = 1) to CIE D65 with Y = 100.</summary>
    /// <param name="light">The source.</param>
    /// <param name="set">The sample set.</param>
    /// <returns>One XYZ per sample, in table order (the D65 white is Y = 100).</returns>
    public static IReadOnlyList<Tristimulus> AdaptedXyz(RegularSamples light, SampleSet set)
    {
        ArgumentNullException.ThrowIfNull(light);
        var (white, samples) = SampleColors.Under(light, set, Observer.Cie1931TwoDegree);
        var w100 = new Tristimulus(100 * white.X, 100 * white.Y, 100 * white.Z);
        var d65 = D65White.Value;
        return samples.Select(s => Cat16.Adapt(new Tristimulus(100 * s.X, 100 * s.Y, 100 * s.Z), w100, d65)).ToArray();
    }

    private static double[] DeltaE(RegularSamples a, RegularSamples b, SampleSet set)
    {
        var la = AdaptedLab(a, set);
        var lb = AdaptedLab(b, set);
        var d = new double[la.Count];
        for (int i = 0; i < d.Length; i++) d[i] = Ciede2000.Difference(la[i], lb[i]);
        return d;
    }
}

using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Spectra;

namespace Lumen.Rendition;

/// <summary>Colours of reflecting samples under a light, for display (swatches, graphics).</summary>
public static class SampleColors
{
    /// <summary>
    /// Tristimulus values of every sample of a CIE sample table under a light, with the light's own white,
    /// normalised so that the white has Y = 1 (CIE 15: X = k ΣS·R·x̄ with k = 1/ΣS·ȳ).
    /// </summary>
    /// <param name="light">The light on a whole-nm grid.</param>
    /// <param name="set">Which samples: the 14 CIE 13.3 test colour samples or the 99 CIE 224 colour evaluation samples
    /// (the 1 nm or 5 nm table, as the light's step).</param>
    /// <param name="observer">The CIE 1931 2° or CIE 1964 10° observer for the sample sums.</param>
    /// <returns>The white (Y = 1) and the samples in table order (relative, white Y = 1).</returns>
    public static (Tristimulus White, IReadOnlyList<Tristimulus> Samples) Under(RegularSamples light, SampleSet set, Observer observer)
    {
        ArgumentNullException.ThrowIfNull(light);
        var table = set == SampleSet.CieTestColorSamples ? CieTables.CriTestSamples
            : light.StepNm == 5 ? CieTables.ColorEvaluationSamples5Nm : CieTables.ColorEvaluationSamples1Nm;
        if (light.StepNm == 1 && table.StepNm != 1) table = table.SpragueToOneNm();
        int n = light.Values.Length;
        var cmf = Colorimeter.CmfWeights(observer, light.StartNm, light.StepNm, n);
        var w = SpectralWeights.ForSamples(table, observer, light.StartNm, light.StepNm, n);
        var (white, _) = SpectralSum.Tristimulus2(cmf.Weights[0], cmf.Weights[1], cmf.Weights[2], light.Values, light.Values);
        double k = 1 / white.Y;
        var samples = new Tristimulus[table.ColumnNames.Count];
        for (int i = 0; i < samples.Length; i++)
        {
            var (t, _) = SpectralSum.Tristimulus2(w.Weights[3 * i], w.Weights[3 * i + 1], w.Weights[3 * i + 2], light.Values, light.Values);
            samples[i] = new Tristimulus(k * t.X, k * t.Y, k * t.Z);
        }
        return (new Tristimulus(k * white.X, 1, k * white.Z), samples);
    }
}

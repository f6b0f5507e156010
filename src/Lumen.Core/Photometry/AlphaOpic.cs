using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Spectra;

namespace Lumen.Photometry;

/// <summary>
/// CIE S 026:2018 α-opic metrology: α-opic quantities, efficacy of luminous radiation (ELR), equivalent
/// daylight (D65) illuminance (EDI) and daylight efficacy ratio (DER).
/// </summary>
/// <remarks>
/// docs/methods/photometry-nonvisual.md §4: E_α = ΣS·s_α·Δλ; K_α,v = E_α / (K_m·ΣS·V·Δλ); the D65 reference
/// K_α,v(D65) is computed once from the CIE D65 table (1 nm, 380–780 nm) with the same code rather than
/// hard-coded (tests check it rounds to the published values, e.g. melanopic 1.3262 mW/lm); DER = K_α,v/K_α,v(D65);
/// EDI = E_α / K_α,v(D65) = DER·E_v. Action spectra: the CIE S 026 dataset; blank cells are zero.
/// These are metrology quantities, not medical or health advice.
/// </remarks>
public static class AlphaOpic
{
    private static readonly string[] Columns = ["melanopic", "s_cone_opic", "m_cone_opic", "l_cone_opic", "rhodopic"];
    private static readonly Lazy<double[]> D65Efficacy = new(ComputeD65Efficacy);

    /// <summary>K_α,v of CIE D65 (mW/lm), in <see cref="AlphaOpicKind"/> order, computed from the CIE tables.</summary>
    public static IReadOnlyList<double> D65EfficacyMilliwattsPerLumen => D65Efficacy.Value;

    /// <summary>The action-spectrum column of a kind in data-cie.</summary>
    /// <param name="kind">One of the five CIE S 026 α-opic quantities.</param>
    /// <returns>Column name.</returns>
    internal static string ColumnOf(AlphaOpicKind kind) => Columns[(int)kind];

    /// <summary>Computes the five α-opic results.</summary>
    /// <param name="samples">Spectrum on its CIE grid.</param>
    /// <param name="unit">Unit of the values (absolute units give α-opic irradiance and EDI).</param>
    /// <returns>Five results, melanopic first.</returns>
    public static IReadOnlyList<AlphaOpicResult> Compute(RegularSamples samples, SpectralUnit unit)
    {
        ArgumentNullException.ThrowIfNull(samples);
        var (eAlpha, ev) = Sums(samples);
        var d65 = D65Efficacy.Value;
        var result = new AlphaOpicResult[5];
        for (int k = 0; k < 5; k++)
        {
            double efficacy = ev > 0 ? 1000 * eAlpha[k] / ev : double.NaN; // W/lm → mW/lm
            double der = efficacy / d65[k];
            result[k] = unit.IsAbsolute()
                ? new AlphaOpicResult((AlphaOpicKind)k, efficacy, der, eAlpha[k], eAlpha[k] / (d65[k] / 1000))
                : new AlphaOpicResult((AlphaOpicKind)k, efficacy, der, null, null);
        }
        return result;
    }

    private static (double[] EAlpha, double Ev) Sums(RegularSamples samples)
    {
        var table = CieTables.AlphaOpicActionSpectra;
        var w = SpectralWeights.For(table, Columns, samples.StartNm, samples.StepNm, samples.Values.Length);
        var e = new double[5];
        for (int k = 0; k < 5; k++) e[k] = SpectralSum.Dot(samples.Values, w.Weights[k]);
        double v = SpectralSum.Dot(samples.Values, SpectralWeights.For(CieTables.PhotopicLuminousEfficiency, ["V"], samples.StartNm, samples.StepNm, samples.Values.Length).Weights[0]);
        return (e, Photometer.KmLumensPerWatt * v);
    }

    private static double[] ComputeD65Efficacy()
    {
        var d65 = CieTables.IlluminantD65;
        var values = new double[401];
        for (int i = 0; i < 401; i++) values[i] = d65.At("D65", 380 + i);
        var (e, ev) = Sums(new RegularSamples(380, 1, values, "CIE D65, 380–780 nm at 1 nm"));
        return e.Select(x => 1000 * x / ev).ToArray();
    }
}

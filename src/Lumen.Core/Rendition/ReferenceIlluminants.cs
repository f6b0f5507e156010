using Lumen.Blackbody;
using Lumen.Cie;
using Lumen.Spectra;

namespace Lumen.Rendition;

/// <summary>
/// The one reference-illuminant generator shared by CIE 13.3 and CIE 224 / TM-30: Planckian radiators,
/// CIE daylight at any CCT, and the CIE 224 blend.
/// </summary>
/// <remarks>
/// CIE daylight (CIE 15:2004 §3.1, docs/methods/cri.md §2.1): x_D from the cubic in 1/T (4000–7000 K and
/// 7000–25000 K branches), y_D = −3x_D² + 2.870x_D − 0.275, M1, M2 rounded to three decimals as CIE 15 does
/// to reproduce the tabulated D illuminants, S = S0 + M1·S1 + M2·S2 with S0, S1, S2 linearly interpolated from
/// the CIE's 5 nm table. The CCT is used as given (no 1.4388/1.4380 factor; that only names D50…D75).
/// Planckian radiators use c2 = 1.4388e-2 m·K (CIE 15).
/// </remarks>
public static class ReferenceIlluminants
{
    /// <summary>The CIE daylight chromaticity (x_D, y_D) at a CCT.</summary>
    /// <param name="cctKelvin">CCT, 4000–25000 K (the formula's domain; values outside are extrapolated).</param>
    /// <returns>(x_D, y_D).</returns>
    public static (double X, double Y) DaylightChromaticity(double cctKelvin)
    {
        double t = cctKelvin;
        double x = t <= 7000
            ? -4.6070e9 / (t * t * t) + 2.9678e6 / (t * t) + 0.09911e3 / t + 0.244063
            : -2.0064e9 / (t * t * t) + 1.9018e6 / (t * t) + 0.24748e3 / t + 0.237040;
        double y = -3.000 * x * x + 2.870 * x - 0.275;
        return (x, y);
    }

    /// <summary>CIE daylight relative SPD on a whole-nm grid.</summary>
    /// <param name="cctKelvin">CCT of the reference, K (1000–25 000 K for rendition; daylight from 4000 K).</param>
    /// <param name="startNm">First wavelength.</param>
    /// <param name="stepNm">Grid step, whole nm (1 or 5 for the CIE tables).</param>
    /// <param name="count">Number of points.</param>
    /// <returns>The spectrum (S0 scale, ≈100 at 560 nm).</returns>
    public static double[] Daylight(double cctKelvin, int startNm, int stepNm, int count)
    {
        var (m1, m2) = DaylightFactors(cctKelvin);
        var (s0, s1, s2) = DaylightComponentsOn(startNm, stepNm, count);
        var result = new double[count];
        for (int k = 0; k < count; k++) result[k] = s0[k] + m1 * s1[k] + m2 * s2[k];
        return result;
    }

    /// <summary>The factors M1 and M2 of CIE daylight at a CCT, rounded to three decimals as CIE 15 does.</summary>
    /// <param name="cctKelvin">CCT, K.</param>
    /// <returns>(M1, M2).</returns>
    internal static (double M1, double M2) DaylightFactors(double cctKelvin)
    {
        var (x, y) = DaylightChromaticity(cctKelvin);
        double m = 0.0241 + 0.2562 * x - 0.7341 * y;
        double m1 = Math.Round((-1.3515 - 1.7703 * x + 5.9114 * y) / m, 3, MidpointRounding.AwayFromZero);
        double m2 = Math.Round((0.0300 - 31.4424 * x + 30.0717 * y) / m, 3, MidpointRounding.AwayFromZero);
        return (m1, m2);
    }

    private static readonly System.Collections.Concurrent.ConcurrentDictionary<(int, int, int), (double[], double[], double[])> ComponentCache = new();

    /// <summary>S0, S1, S2 linearly interpolated onto a grid (0 outside 300–830 nm), computed once per grid.</summary>
    internal static (double[] S0, double[] S1, double[] S2) DaylightComponentsOn(int startNm, int stepNm, int count) =>
        ComponentCache.GetOrAdd((startNm, stepNm, count), _ =>
        {
            var comp = CieTables.DaylightComponents;
            var c0 = comp.Column("S0"); var c1 = comp.Column("S1"); var c2 = comp.Column("S2");
            var s0 = new double[count]; var s1 = new double[count]; var s2 = new double[count];
            for (int k = 0; k < count; k++)
            {
                double w = startNm + k * stepNm;
                double pos = (w - comp.StartNm) / comp.StepNm;
                if (pos < 0 || pos > comp.Count - 1) continue;
                int i = Math.Min((int)pos, comp.Count - 2);
                double f = pos - i;
                s0[k] = c0[i] + f * (c0[i + 1] - c0[i]);
                s1[k] = c1[i] + f * (c1[i + 1] - c1[i]);
                s2[k] = c2[i] + f * (c2[i + 1] - c2[i]);
            }
            return (s0, s1, s2);
        });

    private static readonly System.Collections.Concurrent.ConcurrentDictionary<(int, int, int), (double[], double[])> PlanckCache = new();

    /// <summary>Per-grid Planck factors: c2/λ (m·K) and (560/λ)⁵, computed once per grid.</summary>
    private static (double[] C2OverLambda, double[] Pow5) PlanckFactors(int startNm, int stepNm, int count) =>
        PlanckCache.GetOrAdd((startNm, stepNm, count), _ =>
        {
            var a = new double[count]; var p = new double[count];
            for (int k = 0; k < count; k++)
            {
                double l = startNm + k * stepNm;
                a[k] = PlanckConstants.Cie15.C2 / (l * 1e-9);
                p[k] = Math.Pow(560.0 / l, 5);
            }
            return (a, p);
        });

    /// <summary>Planckian relative spectral radiance on a whole-nm grid (c2 = 1.4388e-2 m·K), 1 at 560 nm.</summary>
    /// <param name="temperatureKelvin">Temperature in K.</param>
    /// <param name="startNm">First wavelength.</param>
    /// <param name="stepNm">Grid step, whole nm (1 or 5 for the CIE tables).</param>
    /// <param name="count">Number of points.</param>
    /// <returns>The spectrum.</returns>
    public static double[] Planckian(double temperatureKelvin, int startNm, int stepNm, int count)
    {
        // Same law as Planck.SpectralRadianceNm, with the wavelength factors cached per grid for speed:
        // L(λ)/L(560) = (560/λ)⁵ · expm1(c2/(560 nm·T)) / expm1(c2/(λ·T)).
        if (!(temperatureKelvin > 0)) throw new ArgumentOutOfRangeException(nameof(temperatureKelvin));
        var (a, p5) = PlanckFactors(startNm, stepNm, count);
        double norm = Planck.Expm1(PlanckConstants.Cie15.C2 / (560e-9 * temperatureKelvin));
        double invT = 1.0 / temperatureKelvin;
        // exp(x) − 1 for the whole grid with the vectorised exponential; Planck.Expm1's series below |x| = 1e-5, and 0
        // where exp would overflow, exactly as Planck.Expm1 does point by point.
        var result = new double[count];
        System.Numerics.Tensors.TensorPrimitives.Multiply(a, invT, result);
        Span<double> e = count <= 1024 ? stackalloc double[count] : new double[count];
        System.Numerics.Tensors.TensorPrimitives.Exp(result, e);
        for (int k = 0; k < count; k++)
        {
            double x = result[k];
            result[k] = x > 700 ? 0 : p5[k] * norm / (x < 1e-5 ? Planck.Expm1(x) : e[k] - 1.0);
        }
        return result;
    }

    /// <summary>CIE 13.3 reference: Planckian below 5000 K, CIE daylight at and above.</summary>
    /// <param name="cctKelvin">CCT of the test source, K, 1000–25 000 K.</param>
    /// <param name="startNm">First wavelength of the grid, whole nm.</param>
    /// <param name="stepNm">Grid step, whole nm (1 or 5).</param>
    /// <param name="count">Number of wavelengths on the grid (≥ 1).</param>
    /// <returns>The reference.</returns>
    public static ReferenceIlluminant ForCie13_3(double cctKelvin, int startNm, int stepNm, int count) =>
        cctKelvin < 5000
            ? new ReferenceIlluminant(ReferenceKind.Planckian, cctKelvin, 0, () => new RegularSamples(startNm, stepNm, Planckian(cctKelvin, startNm, stepNm, count), "Planckian"))
            : new ReferenceIlluminant(ReferenceKind.CieDaylight, cctKelvin, 1, () => new RegularSamples(startNm, stepNm, Daylight(cctKelvin, startNm, stepNm, count), "CIE daylight"));

    /// <summary>
    /// CIE 224:2017 reference: Planckian below 4000 K, CIE daylight above 5000 K, and between them the blend
    /// (1 − m)·P/Y_P + m·D/Y_D with m = (T − 4000)/1000 and Y from the 1931 2° ȳ (docs/methods/cie224-tm30.md §2).
    /// </summary>
    /// <param name="cctKelvin">CCT of the test source, K, 1000–25 000 K.</param>
    /// <param name="startNm">First wavelength of the grid, whole nm.</param>
    /// <param name="stepNm">Grid step, whole nm (1 or 5).</param>
    /// <param name="count">Number of wavelengths on the grid (≥ 1).</param>
    /// <returns>The reference.</returns>
    public static ReferenceIlluminant ForCie224(double cctKelvin, int startNm, int stepNm, int count)
    {
        if (cctKelvin < 4000)
            return new ReferenceIlluminant(ReferenceKind.Planckian, cctKelvin, 0, () => new RegularSamples(startNm, stepNm, Planckian(cctKelvin, startNm, stepNm, count), "Planckian"));
        if (cctKelvin > 5000)
            return new ReferenceIlluminant(ReferenceKind.CieDaylight, cctKelvin, 1, () => new RegularSamples(startNm, stepNm, Daylight(cctKelvin, startNm, stepNm, count), "CIE daylight"));
        double m = (cctKelvin - 4000) / 1000;
        return new ReferenceIlluminant(ReferenceKind.Blend, cctKelvin, m, () => Blend(cctKelvin, m, startNm, stepNm, count));
    }

    private static RegularSamples Blend(double cctKelvin, double m, int startNm, int stepNm, int count)
    {
        var p = Planckian(cctKelvin, startNm, stepNm, count);
        var d = Daylight(cctKelvin, startNm, stepNm, count);
        var ybar = Lumen.Colorimetry.Colorimeter.CmfWeights(Observer.Cie1931TwoDegree, startNm, stepNm, count).Weights[1];
        double yp = Lumen.Colorimetry.SpectralSum.Dot(p, ybar), yd = Lumen.Colorimetry.SpectralSum.Dot(d, ybar);
        var mix = new double[count];
        for (int k = 0; k < count; k++) mix[k] = (1 - m) * p[k] / yp + m * d[k] / yd;
        return new RegularSamples(startNm, stepNm, mix, "CIE 224 blend");
    }
}

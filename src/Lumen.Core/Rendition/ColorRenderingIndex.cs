using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Spectra;

namespace Lumen.Rendition;

/// <summary>
/// CIE 13.3-1995 colour rendering index: Ra and the special indices R1–R14.
/// </summary>
/// <remarks>
/// Steps of docs/methods/cri.md §3 (CIE 13.3-1995, constants confirmed against the colour-science library):
/// test and reference normalised to Y = 100 with the CIE 1931 2° observer; reference Planckian below 5000 K,
/// CIE daylight from 5000 K; von Kries-type adaptive shift in CIE 1960 uv with
/// c = (4 − u − 10v)/v, d = (1.708v + 0.404 − 1.481u)/v; CIE 1964 U*V*W* with the reference white as origin;
/// Ri = 100 − 4.6·ΔEi; Ra = mean of R1–R8. Computed on the test spectrum's own grid: at 5 nm with the CIE's
/// 5 nm test-colour-sample table (this reproduces the CIE 15 tabulated Ra of FL1–FL12), at 1 nm with those
/// samples Sprague-interpolated to 1 nm. CCT comes from Lumen's exact-locus solver rather than CIE 13.3's
/// historical method (effect on Ra &lt; 0.05, cri.md §4).
/// </remarks>
public static class ColorRenderingIndex
{
    private static readonly Lazy<CieTable> Tcs5 = new(() => CieTables.CriTestSamples);
    private static readonly Lazy<CieTable> Tcs1 = new(() => Tcs5.Value.SpragueToOneNm());

    /// <summary>Computes Ra and R1–R14.</summary>
    /// <param name="test">Test spectrum on a whole-nm 1 nm or 5 nm grid (from <see cref="Resampler.ForCieSums"/>).</param>
    /// <param name="cctKelvin">The test source's CCT (2° observer), K.</param>
    /// <returns>The result.</returns>
    public static CriResult Compute(RegularSamples test, double cctKelvin)
    {
        ArgumentNullException.ThrowIfNull(test);
        int n = test.Values.Length;
        var reference = ReferenceIlluminants.ForCie13_3(cctKelvin, test.StartNm, test.StepNm, n);
        var tcs = test.StepNm == 1 ? Tcs1.Value : Tcs5.Value;
        var cmf = Colorimeter.CmfWeights(Observer.Cie1931TwoDegree, test.StartNm, test.StepNm, n);
        var samples = SpectralWeights.ForSamples(tcs, Observer.Cie1931TwoDegree, test.StartNm, test.StepNm, n);

        var (uk, vk, kk) = White(test.Values, cmf);
        var (ur, vr, kr) = White(reference.Samples.Values, cmf);
        double dc = Math.Sqrt((uk - ur) * (uk - ur) + (vk - vr) * (vk - vr));
        double ck = C(uk, vk), dk = D(uk, vk), cr = C(ur, vr), dr = D(ur, vr);

        var r = new double[14];
        for (int i = 0; i < 14; i++)
        {
            var (st, sr) = SpectralSum.Tristimulus2(samples.Weights[3 * i], samples.Weights[3 * i + 1], samples.Weights[3 * i + 2], test.Values, reference.Samples.Values);
            double xt = kk * st.X, yt = kk * st.Y, zt = kk * st.Z, xr = kr * sr.X, yr = kr * sr.Y, zr = kr * sr.Z;
            var (uki, vki) = Uv(xt, yt, zt);
            var (uri, vri) = Uv(xr, yr, zr);
            double cki = C(uki, vki), dki = D(uki, vki);
            double den = 16.518 + 1.481 * (cr / ck) * cki - (dr / dk) * dki;
            double uAdapted = (10.872 + 0.404 * (cr / ck) * cki - 4 * (dr / dk) * dki) / den;
            double vAdapted = 5.520 / den;
            double wt = 25 * Math.Cbrt(yt) - 17, wr = 25 * Math.Cbrt(yr) - 17;
            double ut = 13 * wt * (uAdapted - ur), vt = 13 * wt * (vAdapted - vr);
            double uRef = 13 * wr * (uri - ur), vRef = 13 * wr * (vri - vr);
            double de = Math.Sqrt((uRef - ut) * (uRef - ut) + (vRef - vt) * (vRef - vt) + (wr - wt) * (wr - wt));
            r[i] = 100 - 4.6 * de;
        }
        double ra = 0;
        for (int i = 0; i < 8; i++) ra += r[i];
        return new CriResult(ra / 8, r, reference, dc);
    }

    private static (double U, double V, double K) White(ReadOnlySpan<double> s, SpectralWeights cmf)
    {
        double x = SpectralSum.Dot(s, cmf.Weights[0]), y = SpectralSum.Dot(s, cmf.Weights[1]), z = SpectralSum.Dot(s, cmf.Weights[2]);
        var (u, v) = Uv(x, y, z);
        return (u, v, 100 / y);
    }

    private static (double U, double V) Uv(double x, double y, double z)
    {
        double d = x + 15 * y + 3 * z;
        return (4 * x / d, 6 * y / d);
    }

    private static double C(double u, double v) => (4 - u - 10 * v) / v;

    private static double D(double u, double v) => (1.708 * v + 0.404 - 1.481 * u) / v;
}

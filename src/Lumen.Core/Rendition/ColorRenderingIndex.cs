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
        return ComputeMany([test], [cctKelvin])[0];
    }

    /// <summary>
    /// Computes Ra and R1–R14 of many spectra at once: the same results as <see cref="Compute"/> on each, bit for bit,
    /// with the sample weights streamed once per four spectra and the reference sums from tables (<see cref="SampleSums"/>;
    /// within 1e-9 of a direct computation). Spectra on different grids are grouped by grid.
    /// </summary>
    /// <param name="tests">Test spectra, each on a whole-nm 1 nm or 5 nm grid.</param>
    /// <param name="cctsKelvin">The CCT (2° observer) of each, K.</param>
    /// <returns>One result per spectrum, in order.</returns>
    /// <exception cref="ArgumentException">The lists differ in length.</exception>
    public static CriResult[] ComputeMany(IReadOnlyList<RegularSamples> tests, IReadOnlyList<double> cctsKelvin)
    {
        ArgumentNullException.ThrowIfNull(tests);
        ArgumentNullException.ThrowIfNull(cctsKelvin);
        if (tests.Count != cctsKelvin.Count) throw new ArgumentException("One CCT per spectrum is needed.", nameof(cctsKelvin));
        var results = new CriResult[tests.Count];
        var groups = new Dictionary<(int Start, int Step, int Count), List<int>>();
        for (int i = 0; i < tests.Count; i++)
        {
            var key = (tests[i].StartNm, tests[i].StepNm, tests[i].Values.Length);
            if (!groups.TryGetValue(key, out var list)) groups[key] = list = [];
            list.Add(i);
        }
        foreach (var ((start, step, n), members) in groups)
        {
            var table = SampleSums.For(step == 1 ? Tcs1.Value : Tcs5.Value, Observer.Cie1931TwoDegree, start, step, n);
            var vectors = new double[members.Count][];
            var references = new ReferenceIlluminant[members.Count];
            for (int j = 0; j < members.Count; j++)
            {
                vectors[j] = tests[members[j]].Values;
                references[j] = ReferenceIlluminants.ForCie13_3(cctsKelvin[members[j]], start, step, n);
            }
            var group = table.Evaluate(vectors, references, (t, r, reference, _) => FromSums(t, r, reference));
            for (int j = 0; j < members.Count; j++) results[members[j]] = group[j];
        }
        return results;
    }

    /// <summary>Ra and R1–R14 from the white and sample sums (rows 0–2 the white, then 3 per sample).</summary>
    private static CriResult FromSums(ReadOnlySpan<double> test, ReadOnlySpan<double> reference, ReferenceIlluminant illuminant)
    {
        var (uk, vk) = Uv(test[0], test[1], test[2]);
        var (ur, vr) = Uv(reference[0], reference[1], reference[2]);
        double kk = 100 / test[1], kr = 100 / reference[1];
        double dc = Math.Sqrt((uk - ur) * (uk - ur) + (vk - vr) * (vk - vr));
        double ck = C(uk, vk), dk = D(uk, vk), cr = C(ur, vr), dr = D(ur, vr);

        var r = new double[14];
        for (int i = 0; i < 14; i++)
        {
            int o = 3 + 3 * i;
            double xt = kk * test[o], yt = kk * test[o + 1], zt = kk * test[o + 2];
            double xr = kr * reference[o], yr = kr * reference[o + 1], zr = kr * reference[o + 2];
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
        return new CriResult(ra / 8, r, illuminant, dc);
    }

    private static (double U, double V) Uv(double x, double y, double z)
    {
        double d = x + 15 * y + 3 * z;
        return (4 * x / d, 6 * y / d);
    }

    private static double C(double u, double v) => (4 - u - 10 * v) / v;

    private static double D(double u, double v) => (1.708 * v + 0.404 - 1.481 * u) / v;
}

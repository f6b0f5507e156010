using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Spectra;

namespace Lumen.Rendition;

/// <summary>
/// CIE 224:2017 colour fidelity index Rf with the IES TM-30-20 gamut index Rg and hue-bin values.
/// </summary>
/// <remarks>
/// docs/methods/cie224-tm30.md: 380–780 nm at the spectrum's own 1 nm or 5 nm step with the matching CES table
/// (zero outside the measured range), CIE 1964 10° observer for everything except the CCT (1931 2°), reference
/// Planckian below 4000 K, CIE daylight above 5000 K, blend between; CIECAM02 with L_A = 100 cd/m², Y_b = 20,
/// average surround, D = 1; CAM02-UCS; R(ΔE) = 10·ln(exp((100 − 6.73·ΔE)/10) + 1) with ΔE averaged before
/// conversion; TM-30 bins by the sample hue under the reference, Rg as the ratio of the bin-average polygon
/// areas, Rcs and Rhs projected on the bin-centre direction θ_j = (j − ½)·22.5°.
/// </remarks>
public static class FidelityIndex
{
    /// <summary>The CIE 224 / TM-30-18/-20 scaling factor c_f.</summary>
    public const double ScalingFactor = 6.73;

    private const int SampleCount = 99;
    private const int FirstNm = 380, LastNm = 780;

    /// <summary>Converts a colour difference to the 0–100 fidelity scale.</summary>
    /// <param name="deltaE">Mean CAM02-UCS colour difference.</param>
    /// <returns>10·ln(exp((100 − 6.73·ΔE)/10) + 1).</returns>
    internal static double ToScale(double deltaE) => 10 * Math.Log(Math.Exp((100 - ScalingFactor * deltaE) / 10) + 1);

    /// <summary>Computes Rf, Rg, Rf,i and the hue bins.</summary>
    /// <param name="test">Test spectrum on a whole-nm 1 nm or 5 nm grid.</param>
    /// <param name="cctKelvin">Test CCT (2° observer), K.</param>
    /// <returns>The result.</returns>
    public static FidelityResult Compute(RegularSamples test, double cctKelvin)
    {
        ArgumentNullException.ThrowIfNull(test);
        int step = test.StepNm == 5 ? 5 : 1;
        int n = (LastNm - FirstNm) / step + 1;
        var s = new double[n];
        for (int k = 0; k < n; k++)
        {
            int w = FirstNm + k * step;
            int offset = w - test.StartNm;
            if (offset >= 0 && offset % test.StepNm == 0 && offset / test.StepNm < test.Values.Length) s[k] = test.Values[offset / test.StepNm];
        }
        var reference = ReferenceIlluminants.ForCie224(cctKelvin, FirstNm, step, n);
        var ces = CieTables.Load(step == 5 ? "cfi_colour_evaluation_samples_5nm" : "cfi_colour_evaluation_samples_1nm");
        var cmf = Colorimeter.CmfWeights(Observer.Cie1964TenDegree, FirstNm, step, n);
        var weights = SpectralWeights.ForSamples(ces, Observer.Cie1964TenDegree, FirstNm, step, n);

        Span<double> tJ = stackalloc double[SampleCount], tA = stackalloc double[SampleCount], tB = stackalloc double[SampleCount];
        Span<double> rJ = stackalloc double[SampleCount], rA = stackalloc double[SampleCount], rB = stackalloc double[SampleCount];
        Span<double> rH = stackalloc double[SampleCount];
        Appearance(s, reference.Samples.Values, cmf, weights, tJ, tA, tB, rJ, rA, rB, rH);

        var rfCes = new double[SampleCount];
        var de = new double[SampleCount];
        double sum = 0;
        for (int i = 0; i < SampleCount; i++)
        {
            double dj = tJ[i] - rJ[i], da = tA[i] - rA[i], db = tB[i] - rB[i];
            de[i] = Math.Sqrt(dj * dj + da * da + db * db);
            rfCes[i] = ToScale(de[i]);
            sum += de[i];
        }
        double rf = ToScale(sum / SampleCount);

        var bins = new HueBin[16];
        Span<double> sumTa = stackalloc double[16], sumTb = stackalloc double[16], sumRa = stackalloc double[16], sumRb = stackalloc double[16], sumDe = stackalloc double[16];
        Span<int> count = stackalloc int[16];
        var cesBins = new int[SampleCount];
        for (int i = 0; i < SampleCount; i++)
        {
            int j = Math.Min(15, (int)Math.Floor(rH[i] / 22.5));
            cesBins[i] = j + 1;
            count[j]++; sumTa[j] += tA[i]; sumTb[j] += tB[i]; sumRa[j] += rA[i]; sumRb[j] += rB[i]; sumDe[j] += de[i];
        }
        double areaT = 0, areaR = 0;
        var ta = new double[16]; var tb = new double[16]; var ra = new double[16]; var rb = new double[16];
        for (int j = 0; j < 16; j++)
        {
            int c = Math.Max(count[j], 1);
            ta[j] = sumTa[j] / c; tb[j] = sumTb[j] / c; ra[j] = sumRa[j] / c; rb[j] = sumRb[j] / c;
        }
        for (int j = 0; j < 16; j++)
        {
            int nj = (j + 1) % 16;
            areaT += ta[j] * tb[nj] - ta[nj] * tb[j];
            areaR += ra[j] * rb[nj] - ra[nj] * rb[j];
        }
        double rg = 100 * areaT / areaR;
        for (int j = 0; j < 16; j++)
        {
            double theta = (j + 0.5) * 22.5 * Math.PI / 180;
            double dA = ta[j] - ra[j], dB = tb[j] - rb[j];
            double cr = Math.Sqrt(ra[j] * ra[j] + rb[j] * rb[j]);
            double rcs = count[j] == 0 ? double.NaN : (dA * Math.Cos(theta) + dB * Math.Sin(theta)) / cr;
            double rhs = count[j] == 0 ? double.NaN : (-dA * Math.Sin(theta) + dB * Math.Cos(theta)) / cr;
            double rfh = count[j] == 0 ? double.NaN : ToScale(sumDe[j] / count[j]);
            bins[j] = new HueBin(j + 1, count[j], rfh, rcs, rhs, ra[j], rb[j], ta[j], tb[j]);
        }
        return new FidelityResult(rf, rg, rfCes, bins, reference, cesBins);
    }

    private static void Appearance(ReadOnlySpan<double> test, ReadOnlySpan<double> reference, SpectralWeights cmf, SpectralWeights w,
        Span<double> tJ, Span<double> tA, Span<double> tB, Span<double> rJ, Span<double> rA, Span<double> rB, Span<double> rHue)
    {
        var (wt, wr) = SpectralSum.Tristimulus2(cmf.Weights[0], cmf.Weights[1], cmf.Weights[2], test, reference);
        double xt = wt.X, yt = wt.Y, zt = wt.Z, xr = wr.X, yr = wr.Y, zr = wr.Z;
        double kt = 100 / yt, kr = 100 / yr;
        var camT = new Ciecam02(kt * xt, 100, kt * zt, ViewingConditions.Cie224);
        var camR = new Ciecam02(kr * xr, 100, kr * zr, ViewingConditions.Cie224);
        Span<double> txs = stackalloc double[SampleCount], tys = stackalloc double[SampleCount], tzs = stackalloc double[SampleCount];
        Span<double> rxs = stackalloc double[SampleCount], rys = stackalloc double[SampleCount], rzs = stackalloc double[SampleCount];
        for (int i = 0; i < SampleCount; i++)
        {
            var (t, r) = SpectralSum.Tristimulus2(w.Weights[3 * i], w.Weights[3 * i + 1], w.Weights[3 * i + 2], test, reference);
            txs[i] = kt * t.X; tys[i] = kt * t.Y; tzs[i] = kt * t.Z;
            rxs[i] = kr * r.X; rys[i] = kr * r.Y; rzs[i] = kr * r.Z;
        }
        camT.ForwardUcs(txs, tys, tzs, tJ, tA, tB, default);
        camR.ForwardUcs(rxs, rys, rzs, rJ, rA, rB, rHue);
    }
}

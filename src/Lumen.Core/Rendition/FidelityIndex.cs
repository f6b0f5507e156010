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

    /// <summary><see cref="ToScale(double)"/> of many differences at once (vectorised exp and log).</summary>
    private static void ToScale(ReadOnlySpan<double> deltaE, Span<double> scale)
    {
        System.Numerics.Tensors.TensorPrimitives.Multiply(deltaE, -ScalingFactor / 10, scale);
        System.Numerics.Tensors.TensorPrimitives.Add(scale, 10.0, scale); // (100 − c_f·ΔE)/10
        System.Numerics.Tensors.TensorPrimitives.Exp(scale, scale);
        System.Numerics.Tensors.TensorPrimitives.Add(scale, 1.0, scale);
        System.Numerics.Tensors.TensorPrimitives.Log(scale, scale);
        System.Numerics.Tensors.TensorPrimitives.Multiply(scale, 10.0, scale);
    }

    /// <summary>Computes Rf, Rg, Rf,i and the hue bins.</summary>
    /// <param name="test">Test spectrum on a whole-nm 1 nm or 5 nm grid.</param>
    /// <param name="cctKelvin">Test CCT (2° observer), K.</param>
    /// <returns>The result.</returns>
    public static FidelityResult Compute(RegularSamples test, double cctKelvin)
    {
        ArgumentNullException.ThrowIfNull(test);
        return ComputeMany([test], [cctKelvin])[0];
    }

    /// <summary>
    /// Computes Rf, Rg, Rf,i and the hue bins of many spectra at once: the same results as <see cref="Compute"/> on each,
    /// bit for bit (a spectrum's sums do not depend on its block), faster per spectrum because the 99 samples' weights are
    /// streamed once per four spectra and daylight and Planckian reference sums come from tables (<see cref="SampleSums"/>;
    /// all outputs within 1e-9 of a direct one-spectrum computation, which the tests keep). Give blocks of 8–32 spectra.
    /// </summary>
    /// <param name="tests">Test spectra, each on a whole-nm 1 nm or 5 nm grid.</param>
    /// <param name="cctsKelvin">The CCT (2° observer) of each, K.</param>
    /// <returns>One result per spectrum, in order.</returns>
    /// <exception cref="ArgumentException">The lists differ in length.</exception>
    public static FidelityResult[] ComputeMany(IReadOnlyList<RegularSamples> tests, IReadOnlyList<double> cctsKelvin)
    {
        ArgumentNullException.ThrowIfNull(tests);
        ArgumentNullException.ThrowIfNull(cctsKelvin);
        if (tests.Count != cctsKelvin.Count) throw new ArgumentException("One CCT per spectrum is needed.", nameof(cctsKelvin));
        var results = new FidelityResult[tests.Count];
        foreach (int step in (ReadOnlySpan<int>)[1, 5])
        {
            var members = new List<int>();
            for (int i = 0; i < tests.Count; i++) if ((tests[i].StepNm == 5 ? 5 : 1) == step) members.Add(i);
            if (members.Count == 0) continue;
            int n = (LastNm - FirstNm) / step + 1;
            var table = SampleSums.For(CieTables.Load(step == 5 ? "cfi_colour_evaluation_samples_5nm" : "cfi_colour_evaluation_samples_1nm"), Observer.Cie1964TenDegree, FirstNm, step, n);
            var vectors = new double[members.Count][];
            var references = new ReferenceIlluminant[members.Count];
            for (int j = 0; j < members.Count; j++)
            {
                vectors[j] = OnGrid(tests[members[j]], step, n);
                references[j] = ReferenceIlluminants.ForCie224(cctsKelvin[members[j]], FirstNm, step, n);
            }
            // Under a Planckian or blend reference the samples' appearance is interpolated (its sums are then not needed),
            // into pooled arrays: it lives only until the spectrum's result is made.
            var pool = System.Buffers.ArrayPool<double>.Shared;
            var binPool = System.Buffers.ArrayPool<int>.Shared;
            double[] jab = pool.Rent(members.Count * 3 * SampleCount);
            int[] bins = binPool.Rent(members.Count * SampleCount);
            try
            {
                var interpolated = new bool[members.Count];
                for (int j = 0; j < members.Count; j++)
                    interpolated[j] = ReferenceAppearance.TryInterpolated(table, references[j], jab.AsSpan(j * 3 * SampleCount, 3 * SampleCount), bins.AsSpan(j * SampleCount, SampleCount));
                var group = table.Evaluate(vectors, references, (t, r, reference, j) => interpolated[j]
                    ? FromSums(t, jab.AsSpan(j * 3 * SampleCount, 3 * SampleCount), bins.AsSpan(j * SampleCount, SampleCount), reference)
                    : FromSums(t, r, reference, table), interpolated);
                for (int j = 0; j < members.Count; j++) results[members[j]] = group[j];
            }
            finally
            {
                pool.Return(jab);
                binPool.Return(bins);
            }
        }
        return results;
    }

    /// <summary>The samples' J′, a′, b′ under a Planckian or blend reference, interpolated and computed (tests compare
    /// them); null when no table serves it (a table that failed its check, a daylight reference).</summary>
    internal static (double[] Interpolated, double[] Computed)? InterpolatedReferenceAppearance(int step, double cctKelvin)
    {
        int n = (LastNm - FirstNm) / step + 1;
        var table = SampleSums.For(CieTables.Load(step == 5 ? "cfi_colour_evaluation_samples_5nm" : "cfi_colour_evaluation_samples_1nm"), Observer.Cie1964TenDegree, FirstNm, step, n);
        var reference = ReferenceIlluminants.ForCie224(cctKelvin, FirstNm, step, n);
        var interpolated = new double[3 * SampleCount];
        if (!ReferenceAppearance.TryInterpolated(table, reference, interpolated, new int[SampleCount])) return null;
        var sums = new double[table.RowCount];
        table.Compute([new double[n]], [reference], new double[table.RowCount], sums);
        var computed = ReferenceAppearance.Of(sums);
        return (interpolated, computed.Jab);
    }

    /// <summary>The test spectrum on the 380–780 nm grid of the CES table (zero where it was not measured): its own values
    /// when it is on that very grid (the usual case; read only, as <see cref="RegularSamples.Values"/> are), else a copy.</summary>
    private static double[] OnGrid(RegularSamples test, int step, int n)
    {
        if (test.StepNm == step && test.StartNm == FirstNm && test.Values.Length == n) return test.Values;
        var s = new double[n];
        if (test.StepNm == step && (FirstNm - test.StartNm) % step == 0)
        {
            // Same step, aligned grids (the usual case): one copy of the overlap.
            int first = Math.Max(0, (test.StartNm - FirstNm) / step), from = (FirstNm + first * step - test.StartNm) / step;
            int length = Math.Min(n - first, test.Values.Length - from);
            if (length > 0) test.Values.AsSpan(from, length).CopyTo(s.AsSpan(first, length));
            return s;
        }
        for (int k = 0; k < n; k++)
        {
            int w = FirstNm + k * step;
            int offset = w - test.StartNm;
            if (offset >= 0 && offset % test.StepNm == 0 && offset / test.StepNm < test.Values.Length) s[k] = test.Values[offset / test.StepNm];
        }
        return s;
    }

    /// <summary>Rf, Rg and the hue bins from the white and sample sums under the test and its reference, the samples'
    /// appearance under the reference computed from its sums (for CIE daylight the same for every CCT of one (M1, M2)
    /// pair, so kept).</summary>
    private static FidelityResult FromSums(ReadOnlySpan<double> testSums, ReadOnlySpan<double> refSums, ReferenceIlluminant reference, SampleSums table)
    {
        var under = reference.Kind == ReferenceKind.CieDaylight ? table.ForDaylight(reference, refSums, ReferenceAppearance.Of) : ReferenceAppearance.Of(refSums);
        return FromSums(testSums, under.Jab, under.Bin, reference);
    }

    /// <summary>Rf, Rg and the hue bins from the white and sample sums under the test and the samples' J′, a′, b′ (99 of
    /// each, in that order) and hue bin under the reference. Under a Planckian reference (below 4000 K) they are a smooth
    /// function of the temperature, interpolated; under a blend (4000–5000 K) too while the daylight part's (M1, M2) pair
    /// holds, interpolated per pair.</summary>
    private static FidelityResult FromSums(ReadOnlySpan<double> testSums, ReadOnlySpan<double> referenceJab, ReadOnlySpan<int> rBin, ReferenceIlluminant reference)
    {
        Span<double> tJ = stackalloc double[SampleCount], tA = stackalloc double[SampleCount], tB = stackalloc double[SampleCount];
        Appearance(testSums, tJ, tA, tB, default);
        ReadOnlySpan<double> rJ = referenceJab[..SampleCount], rA = referenceJab.Slice(SampleCount, SampleCount), rB = referenceJab.Slice(2 * SampleCount, SampleCount);

        var rfCes = new double[SampleCount];
        Span<double> de = stackalloc double[SampleCount];
        double sum = 0;
        for (int i = 0; i < SampleCount; i++)
        {
            double dj = tJ[i] - rJ[i], da = tA[i] - rA[i], db = tB[i] - rB[i];
            de[i] = Math.Sqrt(dj * dj + da * da + db * db);
            sum += de[i];
        }
        ToScale(de, rfCes);
        double rf = ToScale(sum / SampleCount);

        var bins = new HueBin[16];
        Span<double> sumTa = stackalloc double[16], sumTb = stackalloc double[16], sumRa = stackalloc double[16], sumRb = stackalloc double[16], sumDe = stackalloc double[16];
        Span<int> count = stackalloc int[16];
        var cesBins = new int[SampleCount];
        for (int i = 0; i < SampleCount; i++)
        {
            int j = rBin[i];
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

    /// <summary>
    /// The TM-30 hue bin (0–15) of a hue angle: ⌊h/22.5°⌋, the last bin closed at 360°.
    /// </summary>
    internal static int BinOf(double hueDegrees) => Math.Min(15, (int)Math.Floor(hueDegrees / 22.5));

    /// <summary>
    /// <see cref="BinOf(double)"/> of the hue of (a, b) as <see cref="Ciecam02.HueAngleDegrees"/> gives it, without the
    /// arctangent: the quadrant from the signs, then, with the point turned into the first quadrant, the bin from y
    /// against x·tan 22.5°, x and x·tan 67.5°
    /// (issue 16: 99 arctangents were 5 % of a unit). Within 1e-9 (relative) of an edge between bins the arctangent
    /// decides, so the bin is always the one the angle gives (the comparisons err by about 1e-16).
    /// </summary>
    internal static int BinOf(double a, double b)
    {
        // Turn the point into the first quadrant (x > 0, y ≥ 0), counting quarter turns.
        int quarter; double x, y;
        if (b >= 0) { if (a > 0) { quarter = 0; x = a; y = b; } else { quarter = 1; x = b; y = -a; } }
        else if (a < 0) { quarter = 2; x = -a; y = -b; }
        else { quarter = 3; x = -b; y = a; }
        double edge = EdgeBand * (x + y);
        double below = y - Tan225 * x, middle = y - x, above = y - Tan675 * x;
        if (!(edge > 0) || !double.IsFinite(edge) || x <= edge || y <= edge || Math.Abs(below) <= edge || Math.Abs(middle) <= edge || Math.Abs(above) <= edge)
            return BinOf(Ciecam02.HueAngleDegrees(a, b));
        return 4 * quarter + (below < 0 ? 0 : middle < 0 ? 1 : above < 0 ? 2 : 3);
    }

    private const double EdgeBand = 1e-9;
    private static readonly double Tan225 = Math.Sqrt(2) - 1, Tan675 = Math.Sqrt(2) + 1;

    /// <summary>The 99 samples' CAM02-UCS J′, a′, b′ and TM-30 hue bin under a reference.</summary>
    private sealed class ReferenceAppearance
    {
        /// <summary>J′, a′, b′ of the 99 samples: 99 of each, in that order.</summary>
        public double[] Jab { get; } = new double[3 * SampleCount];

        public int[] Bin { get; } = new int[SampleCount];

        public static ReferenceAppearance Of(double[] sums) => Of((ReadOnlySpan<double>)sums);

        /// <summary>Largest difference of an interpolated J′, a′ or b′ from the one computed (values up to about 100):
        /// far below what moves Rf in its ninth digit.</summary>
        public const double Tolerance = 1e-11;

        /// <summary>Under a Planckian reference of 1000–4000 K (the CIE 224 Planckian range): J′, a′, b′ interpolated in
        /// the mired from a table made once per grid, piece by piece as temperatures need them
        /// (<see cref="SampleSums.TryPlanckianDerived"/>); under a blend (4000–5000 K), from a table per (M1, M2) pair and
        /// cell (<see cref="SampleSums.TryBlendDerived"/>); the hue from a′ and b′ as <see cref="Ciecam02.ForwardUcs"/>
        /// gives it. False without a table (daylight, or none built).</summary>
        /// <param name="table">The sample sums' table.</param>
        /// <param name="reference">The reference.</param>
        /// <param name="jab">Output: J′, a′, b′ of the 99 samples (99 of each, in that order).</param>
        /// <param name="bins">Output: the hue bin (0–15) of each sample.</param>
        public static bool TryInterpolated(SampleSums table, ReferenceIlluminant reference, Span<double> jab, Span<int> bins)
        {
            bool found = reference.Kind switch
            {
                ReferenceKind.Planckian => table.TryPlanckianDerived(reference.CctKelvin, 4000, 3 * SampleCount, JabOf, Tolerance, jab),
                ReferenceKind.Blend => table.TryBlendDerived(reference, 3 * SampleCount, JabOf, Tolerance, jab),
                _ => false,
            };
            if (!found) return false;
            for (int i = 0; i < SampleCount; i++) bins[i] = BinOf(jab[SampleCount + i], jab[2 * SampleCount + i]);
            return true;
        }

        private static double[] JabOf(double[] sums) => Of(sums).Jab;

        public static ReferenceAppearance Of(ReadOnlySpan<double> sums)
        {
            var r = new ReferenceAppearance();
            Span<double> hue = stackalloc double[SampleCount];
            var jab = r.Jab.AsSpan();
            Appearance(sums, jab[..SampleCount], jab.Slice(SampleCount, SampleCount), jab.Slice(2 * SampleCount, SampleCount), hue);
            for (int i = 0; i < SampleCount; i++) r.Bin[i] = BinOf(hue[i]);
            return r;
        }
    }

    /// <summary>CAM02-UCS J′, a′, b′ (and hue) of the 99 samples from their sums and the white's (rows 0–2), Y_w = 100.</summary>
    private static void Appearance(ReadOnlySpan<double> sums, Span<double> j, Span<double> a, Span<double> b, Span<double> hue)
    {
        double k = 100 / sums[1];
        var cam = new Ciecam02(k * sums[0], 100, k * sums[2], ViewingConditions.Cie224);
        Span<double> xs = stackalloc double[SampleCount], ys = stackalloc double[SampleCount], zs = stackalloc double[SampleCount];
        for (int i = 0; i < SampleCount; i++)
        {
            xs[i] = k * sums[3 + 3 * i]; ys[i] = k * sums[4 + 3 * i]; zs[i] = k * sums[5 + 3 * i];
        }
        cam.ForwardUcs(xs, ys, zs, j, a, b, hue);
    }
}

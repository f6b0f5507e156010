using Lumen.Analysis;
using Lumen.Blackbody;
using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Rendition;
using Lumen.Spectra;
using Lumen.Temperature;
using Xunit;

namespace Lumen.Tests;

/// <summary>
/// Issue 16: the blocked rendition kernel (many spectra per pass over the sample weights, daylight references from
/// tabulated component sums, CIECAM02 four stimuli at a time) equals the unblocked computation, one spectrum at a
/// time with per-sample sums and the scalar CIECAM02, on every output within 1e-9. Regression checks of the fast
/// path against a plain one (both ours); the published anchors of Ra and Rf are in RenditionTests.
/// </summary>
public class BlockedRenditionTests
{
    /// <summary>Agreement asked by issue 16: 1e-9 on every output (absolute on the 0–100 scales, relative elsewhere).</summary>
    private const double Tolerance = 1e-9;

    private static void Close(double expected, double actual, string what)
    {
        if (double.IsNaN(expected)) { Assert.True(double.IsNaN(actual), $"{what}: expected NaN, got {actual}"); return; }
        Assert.True(Math.Abs(expected - actual) <= Tolerance * Math.Max(1, Math.Abs(expected)), $"{what}: {expected:R} vs {actual:R}");
    }

    /// <summary>
    /// Random smooth spectra around Planckian radiators from 1800 K to 16000 K (so every reference kind occurs:
    /// Planckian, the CIE 224 blend, CIE daylight), each modulated by random Gaussian bumps, on 1 nm or 5 nm grids,
    /// some starting above or ending below 380–780 nm.
    /// </summary>
    internal static List<(RegularSamples Samples, double Cct, Spectrum Spectrum)> RandomSpectra(int count, int seed)
    {
        var rng = new Random(seed);
        var list = new List<(RegularSamples, double, Spectrum)>();
        while (list.Count < count)
        {
            int step = rng.Next(2) == 0 ? 1 : 5;
            int start = rng.Next(4) == 0 ? 400 : 360, end = rng.Next(4) == 0 ? 760 : 830;
            var grid = Enumerable.Range(0, (end - start) / step + 1).Select(k => (double)(start + k * step)).ToArray();
            double t = 1800 * Math.Pow(16000 / 1800.0, rng.NextDouble());
            var bumps = Enumerable.Range(0, 4).Select(_ => (Centre: 400 + 350 * rng.NextDouble(), Width: 10 + 60 * rng.NextDouble(), Height: 0.6 * rng.NextDouble())).ToArray();
            var values = grid.Select(w => Planck.SpectralRadianceNm(w, t, PlanckConstants.Cie15) * (1 + bumps.Sum(b => b.Height * Math.Exp(-Math.Pow((w - b.Centre) / b.Width, 2))))).ToArray();
            var spectrum = new Spectrum(grid, values, SpectralUnit.Relative, $"random {list.Count}", SpectrumOrigin.Generated("test"));
            var samples = Resampler.ForCieSums(spectrum);
            double cct = CctSolver.Solve(Chromaticity.FromXyz(Colorimeter.RawSums(samples, Observer.Cie1931TwoDegree))).CctKelvin;
            if (cct is < 1000 or > 25000) continue;
            list.Add((samples, cct, spectrum));
        }
        return list;
    }

    [Theory]
    [InlineData(1)]
    [InlineData(3)]
    [InlineData(8)]
    [InlineData(13)]
    [InlineData(32)]
    public void Blocked_fidelity_equals_the_unblocked_computation_on_every_output(int blockSize)
    {
        var set = RandomSpectra(37, 1600 + blockSize); // 37 is divided by none of the block sizes above 1
        Assert.Contains(set, s => s.Cct < 4000);
        Assert.Contains(set, s => s.Cct > 5000);
        Assert.Contains(set, s => s.Cct is > 4000 and < 5000); // the blend
        for (int from = 0; from < set.Count; from += blockSize)
        {
            var block = set.Skip(from).Take(blockSize).ToList();
            var results = FidelityIndex.ComputeMany(block.Select(b => b.Samples).ToList(), block.Select(b => b.Cct).ToList());
            Assert.Equal(block.Count, results.Length);
            for (int i = 0; i < block.Count; i++)
            {
                var expected = UnblockedRendition.Fidelity(block[i].Samples, block[i].Cct);
                var actual = results[i];
                string id = $"spectrum {from + i} ({block[i].Cct:0} K, step {block[i].Samples.StepNm})";
                Close(expected.Rf, actual.Rf, id + " Rf");
                Close(expected.Rg, actual.Rg, id + " Rg");
                for (int k = 0; k < 99; k++) Close(expected.RfCes[k], actual.RfCes[k], $"{id} Rf,CES{k + 1}");
                Assert.Equal(expected.CesBins, actual.CesBins);
                for (int j = 0; j < 16; j++)
                {
                    var (e, a) = (expected.HueBins[j], actual.HueBins[j]);
                    Assert.Equal(e.SampleCount, a.SampleCount);
                    Close(e.Rf, a.Rf, $"{id} Rf,h{j + 1}");
                    Close(e.Rcs, a.Rcs, $"{id} Rcs,h{j + 1}");
                    Close(e.Rhs, a.Rhs, $"{id} Rhs,h{j + 1}");
                    Close(e.ReferenceA, a.ReferenceA, $"{id} a'ref,h{j + 1}");
                    Close(e.TestB, a.TestB, $"{id} b'test,h{j + 1}");
                }
                Assert.Equal(expected.Reference.Kind, actual.Reference.Kind);
            }
        }
    }

    [Theory]
    [InlineData(1)]
    [InlineData(5)]
    public void Appearance_under_a_Planckian_reference_is_interpolated_within_its_tolerance(int step)
    {
        // The table must exist on both CES grids (it checked itself) and agree with CIECAM02 on the reference's sums at
        // random temperatures of 1000–4000 K, not only where it checked.
        var rng = new Random(224 + step);
        foreach (double t in new[] { 1000.0, 3999.9 }.Concat(Enumerable.Range(0, 100).Select(_ => 1000 + 3000 * rng.NextDouble())))
            AssertInterpolatedAppearance(step, t);
    }

    [Theory]
    [InlineData(1)]
    [InlineData(5)]
    public void Appearance_under_a_blend_reference_is_interpolated_within_its_tolerance(int step)
    {
        // Per (M1, M2) pair and quarter-mired cell: at the ends of the blend, on both sides of pair changes (a dense run of
        // temperatures crosses several) and at random temperatures of 4000–5000 K.
        var rng = new Random(4500 + step);
        var temperatures = new[] { 4000.0, 4000.001, 4999.999, 5000.0 }
            .Concat(Enumerable.Range(0, 60).Select(i => 4490 + 0.3 * i))
            .Concat(Enumerable.Range(0, 60).Select(_ => 4000 + 1000 * rng.NextDouble()));
        foreach (double t in temperatures) AssertInterpolatedAppearance(step, t);
        Assert.Null(FidelityIndex.InterpolatedReferenceAppearance(step, 5000.5)); // CIE daylight: kept per pair, exact
    }

    private static void AssertInterpolatedAppearance(int step, double t)
    {
        var pair = FidelityIndex.InterpolatedReferenceAppearance(step, t);
        Assert.NotNull(pair);
        var (interpolated, computed) = pair.Value;
        for (int i = 0; i < computed.Length; i++)
            Assert.True(Math.Abs(interpolated[i] - computed[i]) <= 1e-11, $"{t:0.###} K, value {i}: {interpolated[i]:R} vs {computed[i]:R}");
    }

    [Fact]
    public void Hue_bins_without_the_arctangent_are_the_bins_of_the_angle()
    {
        // The comparison path must give ⌊h/22.5°⌋ of the arctangent's h for every point: random ones at every scale, points
        // on and within rounding of every bin edge and axis, zero, signed zeros, infinities and NaN.
        var rng = new Random(16);
        var points = new List<(double A, double B)> { (0, 0), (-0.0, 0), (0, -0.0), (-0.0, -0.0), (1, 0), (-1, 0), (0, 1), (0, -1),
            (double.PositiveInfinity, 1), (1, double.NegativeInfinity), (double.NaN, 1), (1e-300, 1e-300), (1e300, -1e300), (double.Epsilon, 0) };
        for (int k = 0; k < 16; k++)
        {
            double theta = k * 22.5 * Math.PI / 180;
            foreach (double r in new[] { 1e-8, 1.0, 37.5, 1e8 })
                foreach (double nudge in new[] { 0.0, 1e-15, -1e-15, 1e-10, -1e-10, 1e-8, -1e-8 })
                    points.Add((r * Math.Cos(theta + nudge), r * Math.Sin(theta + nudge)));
        }
        for (int i = 0; i < 100_000; i++)
        {
            double scale = Math.Pow(10, rng.Next(-6, 7));
            points.Add((scale * (2 * rng.NextDouble() - 1), scale * (2 * rng.NextDouble() - 1)));
        }
        foreach (var (a, b) in points)
            Assert.True(FidelityIndex.BinOf(Ciecam02.HueAngleDegrees(a, b)) == FidelityIndex.BinOf(a, b), $"({a:R}, {b:R})");
    }

    [Fact]
    public void Blend_references_give_the_direct_results_across_pairs_and_cells()
    {
        // The interpolated blend appearance must give the same results as the direct computation at every CCT, in either
        // order (a table depends only on its pair and cell, never on the units before it).
        var ccts = Enumerable.Range(0, 120).Select(i => 4180 + 0.29 * i).Concat([4000, 4000.2, 4999.8, 5000]).ToList();
        AssertKeptReferencesGiveTheDirectResults(4321, ccts, ReferenceKind.Blend);
    }

    [Fact]
    public void Daylight_references_kept_per_M1_M2_pair_give_the_direct_results()
    {
        // CIE 15 rounds M1 and M2 to three decimals, so nearby CCTs share one daylight reference (the premise of keeping
        // its appearance per pair); every result must still equal the direct computation at its own CCT.
        Assert.Equal(ReferenceIlluminants.DaylightFactors(6500), ReferenceIlluminants.DaylightFactors(6500.2));
        var ccts = Enumerable.Range(0, 120).Select(i => 6480 + 0.37 * i).Concat([5000.5, 9000, 9000.1, 24000]).ToList();
        AssertKeptReferencesGiveTheDirectResults(77, ccts, ReferenceKind.CieDaylight);
    }

    /// <summary>One random spectrum assessed at many CCTs in a block, forwards and backwards: Rf, Rg, every Rf,CES, the
    /// sample bins and every Rcs,hj equal the direct one-spectrum computation, and every reference is of the given kind.</summary>
    private static void AssertKeptReferencesGiveTheDirectResults(int seed, List<double> ccts, ReferenceKind kind)
    {
        var (samples, _, _) = RandomSpectra(1, seed)[0];
        foreach (var order in new[] { ccts, ccts.AsEnumerable().Reverse().ToList() })
        {
            var blocked = FidelityIndex.ComputeMany(order.Select(_ => samples).ToList(), order);
            for (int i = 0; i < order.Count; i++)
            {
                var expected = UnblockedRendition.Fidelity(samples, order[i]);
                string id = $"{order[i]:0.##} K";
                Assert.Equal(kind, blocked[i].Reference.Kind);
                Close(expected.Rf, blocked[i].Rf, id + " Rf");
                Close(expected.Rg, blocked[i].Rg, id + " Rg");
                Assert.Equal(expected.CesBins, blocked[i].CesBins);
                for (int j = 0; j < 16; j++) Close(expected.HueBins[j].Rcs, blocked[i].HueBins[j].Rcs, $"{id} Rcs,h{j + 1}");
                for (int k = 0; k < 99; k++) Close(expected.RfCes[k], blocked[i].RfCes[k], $"{id} Rf,CES{k + 1}");
            }
        }
    }

    [Theory]
    [InlineData(1)]
    [InlineData(5)]
    [InlineData(16)]
    public void Blocked_cri_equals_the_unblocked_computation_on_every_output(int blockSize)
    {
        var set = RandomSpectra(37, 1300 + blockSize);
        for (int from = 0; from < set.Count; from += blockSize)
        {
            var block = set.Skip(from).Take(blockSize).ToList();
            var results = ColorRenderingIndex.ComputeMany(block.Select(b => b.Samples).ToList(), block.Select(b => b.Cct).ToList());
            for (int i = 0; i < block.Count; i++)
            {
                var expected = UnblockedRendition.Cri(block[i].Samples, block[i].Cct);
                string id = $"spectrum {from + i} ({block[i].Cct:0} K)";
                Close(expected.Ra, results[i].Ra, id + " Ra");
                Close(expected.Dc, results[i].Dc, id + " DC");
                for (int k = 0; k < 14; k++) Close(expected.R[k], results[i].R[k], $"{id} R{k + 1}");
            }
        }
    }

    [Fact]
    public void A_spectrum_gives_the_same_bits_alone_and_in_a_block()
    {
        var set = RandomSpectra(9, 77);
        var many = FidelityIndex.ComputeMany(set.Select(s => s.Samples).ToList(), set.Select(s => s.Cct).ToList());
        var cri = ColorRenderingIndex.ComputeMany(set.Select(s => s.Samples).ToList(), set.Select(s => s.Cct).ToList());
        for (int i = 0; i < set.Count; i++)
        {
            // Bit for bit: a spectrum's sums do not depend on the other spectra of its block.
            var one = FidelityIndex.Compute(set[i].Samples, set[i].Cct);
            Assert.Equal(one.Rf, many[i].Rf);
            Assert.Equal(one.Rg, many[i].Rg);
            Assert.Equal(one.RfCes, many[i].RfCes);
            Assert.Equal(ColorRenderingIndex.Compute(set[i].Samples, set[i].Cct).R, cri[i].R);
        }
    }

    [Fact]
    public void Assessing_a_block_equals_assessing_each_spectrum_alone_on_every_result_field()
    {
        var set = RandomSpectra(21, 4242);
        var spectra = set.Select(s => s.Spectrum).ToList();
        var many = Assessor.AssessMany(spectra);
        for (int i = 0; i < spectra.Count; i++)
        {
            var one = Assessor.Assess(spectra[i]);
            Assert.Equal(one.Warnings, many[i].Warnings);
            foreach (var path in ResultFields.Paths)
            {
                var (e, a) = (ResultFields.Get(one, path), ResultFields.Get(many[i], path));
                Assert.Equal(e.HasValue, a.HasValue);
                Assert.Equal(e, a); // bit for bit
            }
        }
    }

    [Theory]
    [InlineData("ces", 1, 380, 401)]
    [InlineData("ces", 5, 380, 81)]
    [InlineData("tcs", 1, 360, 471)]
    [InlineData("tcs", 5, 380, 81)]
    public void Planckian_reference_sums_from_the_table_equal_direct_sums(string set, int step, int start, int count)
    {
        var samples = set == "ces" ? (step == 1 ? CieTables.ColorEvaluationSamples1Nm : CieTables.ColorEvaluationSamples5Nm)
            : step == 1 ? CieTables.CriTestSamples.SpragueToOneNm() : CieTables.CriTestSamples;
        var observer = set == "ces" ? Observer.Cie1964TenDegree : Observer.Cie1931TwoDegree;
        var rows = SampleSums.For(samples, observer, start, step, count).Rows;
        var table = PlanckianSums.Build(rows, start, step, count);
        Assert.NotNull(table); // it passed its own check; now probe it at random temperatures
        var rng = new Random(step * 1000 + count);
        var sums = new double[rows.Length];
        for (int n = 0; n < 200; n++)
        {
            double t = 1000 + 4000 * rng.NextDouble();
            Assert.True(table.TryEvaluate(t, sums));
            var direct = new double[rows.Length];
            SpectralSum.Many(rows, [ReferenceIlluminants.Planckian(t, start, step, count)], direct);
            for (int r = 0; r < rows.Length; r++)
                Assert.True(Math.Abs(sums[r] - direct[r]) <= 1e-12 * Math.Abs(direct[r]), $"{t:0.###} K, row {r}: {sums[r]:R} vs {direct[r]:R}");
        }
        Assert.False(table.TryEvaluate(999, sums));
        Assert.False(table.TryEvaluate(5001, sums));
    }

    [Theory]
    [InlineData(1, 380, 401)]
    [InlineData(5, 380, 81)]
    [InlineData(1, 360, 471)]
    public void Cie224_blend_reference_sums_from_tables_equal_direct_sums_of_the_blend(int step, int start, int count)
    {
        // The blend of 4000–5000 K (CIE 224:2017, docs/methods/cie224-tm30.md §2) built as a spectrum and summed directly
        // is the reference; the table path combines Planckian and daylight tables linearly.
        var table = SampleSums.For(step == 1 ? CieTables.ColorEvaluationSamples1Nm : CieTables.ColorEvaluationSamples5Nm, Observer.Cie1964TenDegree, start, step, count);
        int rows = table.RowCount;
        var rng = new Random(4000 + step);
        var test = new double[count];
        var testSums = new double[rows];
        var fromTables = new double[rows];
        foreach (double t in new[] { 4000.5, 4999.5 }.Concat(Enumerable.Range(0, 60).Select(_ => 4000 + 1000 * rng.NextDouble())))
        {
            var reference = ReferenceIlluminants.ForCie224(t, start, step, count);
            Assert.Equal(ReferenceKind.Blend, reference.Kind);
            table.Compute([test], [reference], testSums, fromTables);
            var direct = new double[rows];
            SpectralSum.Many(table.Rows, [reference.Samples.Values], direct);
            for (int r = 0; r < rows; r++)
                Assert.True(Math.Abs(fromTables[r] - direct[r]) <= 1e-12 * Math.Abs(direct[r]), $"{t:0.###} K, row {r}: {fromTables[r]:R} vs {direct[r]:R}");
        }
    }

    [Fact]
    public void Tables_for_many_grids_stay_bounded_and_results_stay_right()
    {
        var tcs = CieTables.CriTestSamples;
        for (int start = 300; start < 300 + SampleSums.CacheLimit + 40; start++) SampleSums.For(tcs, Observer.Cie1931TwoDegree, start, 5, 60);
        Assert.True(SampleSums.CachedGrids <= SampleSums.CacheLimit);
        foreach (var (samples, cct, _) in RandomSpectra(4, 99))
            Close(UnblockedRendition.Cri(samples, cct).Ra, ColorRenderingIndex.Compute(samples, cct).Ra, "Ra after the cache was refilled");
    }

    [Fact]
    public void Blocked_sums_equal_scalar_dot_products_for_any_count_and_length()
    {
        var rng = new Random(16);
        foreach (int n in new[] { 1, 3, 4, 5, 17, 81, 401 })
            foreach (int vectors in new[] { 1, 2, 3, 4, 5, 7, 9 })
            {
                double[] R() => Enumerable.Range(0, n).Select(_ => rng.NextDouble() - 0.2).ToArray();
                var weights = Enumerable.Range(0, 6).Select(_ => R()).ToArray();
                var spectra = Enumerable.Range(0, vectors).Select(_ => R()).ToArray();
                var result = new double[vectors * 6];
                SpectralSum.Many(weights, spectra, result);
                for (int v = 0; v < vectors; v++)
                    for (int r = 0; r < 6; r++)
                    {
                        double expected = SpectralSum.DotScalar(spectra[v], weights[r]);
                        Assert.True(Math.Abs(expected - result[v * 6 + r]) <= 1e-13 * Math.Max(1, Math.Abs(expected)), $"n {n}, vector {v}, row {r}");
                    }
            }
    }

    [Fact]
    public void Blocked_sums_in_512_bit_pairs_equal_the_256_bit_groups_bit_for_bit()
    {
        // Results must not depend on the processor's vector width (issue 16): where 512-bit vectors run, groups of eight
        // spectra must give the very bits of groups of four. (Without them both calls take the same path.)
        var rng = new Random(512);
        foreach (int n in new[] { 3, 4, 5, 7, 81, 401 })
            foreach (int vectors in new[] { 1, 7, 8, 9, 12, 15, 16, 17, 33 })
            {
                double[] R() => Enumerable.Range(0, n).Select(_ => rng.NextDouble() * 3 - 0.5).ToArray();
                var weights = Enumerable.Range(0, 9).Select(_ => R()).ToArray();
                var spectra = Enumerable.Range(0, vectors).Select(_ => R()).ToArray();
                var wide = new double[vectors * 9];
                var narrow = new double[vectors * 9];
                SpectralSum.Many(weights, spectra, wide, eightWide: true);
                SpectralSum.Many(weights, spectra, narrow, eightWide: false);
                for (int i = 0; i < wide.Length; i++)
                    Assert.True(BitConverter.DoubleToInt64Bits(wide[i]) == BitConverter.DoubleToInt64Bits(narrow[i]), $"n {n}, vectors {vectors}, sum {i}: {wide[i]:R} vs {narrow[i]:R}");
            }
    }

    [Fact]
    public void Blocked_sums_refuse_mismatched_shapes()
    {
        var w = new[] { new double[4], new double[4], new double[4] };
        Assert.Throws<ArgumentException>(() => SpectralSum.Many(w, [new double[5]], new double[3]));
        Assert.Throws<ArgumentException>(() => SpectralSum.Many(w[..2], [new double[4]], new double[3]));
        Assert.Throws<ArgumentException>(() => SpectralSum.Many(w, [new double[4], new double[4]], new double[5]));
        Assert.Throws<ArgumentException>(() => FidelityIndex.ComputeMany([], [3000.0]));
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    [InlineData(5)]
    [InlineData(8)]
    [InlineData(99)]
    public void Vectorised_cam02ucs_equals_the_scalar_model_for_any_count(int n)
    {
        var cam = new Ciecam02(101.2, 100, 64.3, ViewingConditions.Cie224);
        var rng = new Random(n);
        var x = Enumerable.Range(0, n).Select(_ => 0.5 + 90 * rng.NextDouble()).ToArray();
        var y = Enumerable.Range(0, n).Select(_ => 0.5 + 90 * rng.NextDouble()).ToArray();
        var z = Enumerable.Range(0, n).Select(_ => 0.5 + 90 * rng.NextDouble()).ToArray();
        double[] j = new double[n], a = new double[n], b = new double[n], h = new double[n];
        cam.ForwardUcs(x, y, z, j, a, b, h);
        for (int i = 0; i < n; i++)
        {
            var c = cam.Forward(x[i], y[i], z[i]);
            var (jj, aa, bb) = c.ToUcs();
            Close(jj, j[i], $"J' {i}");
            Close(aa, a[i], $"a' {i}");
            Close(bb, b[i], $"b' {i}");
            Close(c.HueDegrees, h[i], $"h {i}");
        }
    }
}

/// <summary>
/// The unblocked rendition computation kept as the reference for the blocked kernel (issue 16): one spectrum at a time,
/// each sample's tristimulus values by its own sums (<see cref="SpectralSum.Tristimulus2"/>), the reference spectrum
/// summed directly (no daylight tabulation) and the scalar CIECAM02 (<see cref="Ciecam02.Forward"/>, then
/// <see cref="Cam02.ToUcs"/>). The steps are those of docs/methods/cri.md and docs/methods/cie224-tm30.md.
/// </summary>
internal static class UnblockedRendition
{
    private const int FirstNm = 380, LastNm = 780, SampleCount = 99;

    public static FidelityResult Fidelity(RegularSamples test, double cct)
    {
        int step = test.StepNm == 5 ? 5 : 1;
        int n = (LastNm - FirstNm) / step + 1;
        var s = new double[n];
        for (int k = 0; k < n; k++)
        {
            int offset = FirstNm + k * step - test.StartNm;
            if (offset >= 0 && offset % test.StepNm == 0 && offset / test.StepNm < test.Values.Length) s[k] = test.Values[offset / test.StepNm];
        }
        var reference = ReferenceIlluminants.ForCie224(cct, FirstNm, step, n);
        var ces = step == 5 ? CieTables.ColorEvaluationSamples5Nm : CieTables.ColorEvaluationSamples1Nm;
        var cmf = Colorimeter.CmfWeights(Observer.Cie1964TenDegree, FirstNm, step, n);
        var w = SpectralWeights.ForSamples(ces, Observer.Cie1964TenDegree, FirstNm, step, n);
        var (wt, wr) = SpectralSum.Tristimulus2(cmf.Weights[0], cmf.Weights[1], cmf.Weights[2], s, reference.Samples.Values);
        double kt = 100 / wt.Y, kr = 100 / wr.Y;
        var camT = new Ciecam02(kt * wt.X, 100, kt * wt.Z, ViewingConditions.Cie224);
        var camR = new Ciecam02(kr * wr.X, 100, kr * wr.Z, ViewingConditions.Cie224);
        var t = new (double J, double A, double B)[SampleCount];
        var r = new (double J, double A, double B)[SampleCount];
        var hue = new double[SampleCount];
        for (int i = 0; i < SampleCount; i++)
        {
            var (st, sr) = SpectralSum.Tristimulus2(w.Weights[3 * i], w.Weights[3 * i + 1], w.Weights[3 * i + 2], s, reference.Samples.Values);
            t[i] = camT.Forward(kt * st.X, kt * st.Y, kt * st.Z).ToUcs();
            var cr = camR.Forward(kr * sr.X, kr * sr.Y, kr * sr.Z);
            r[i] = cr.ToUcs();
            hue[i] = cr.HueDegrees;
        }
        var rfCes = new double[SampleCount];
        var de = new double[SampleCount];
        double sum = 0;
        for (int i = 0; i < SampleCount; i++)
        {
            de[i] = Math.Sqrt(Math.Pow(t[i].J - r[i].J, 2) + Math.Pow(t[i].A - r[i].A, 2) + Math.Pow(t[i].B - r[i].B, 2));
            rfCes[i] = FidelityIndex.ToScale(de[i]);
            sum += de[i];
        }
        var count = new int[16]; var sta = new double[16]; var stb = new double[16]; var sra = new double[16]; var srb = new double[16]; var sde = new double[16];
        var cesBins = new int[SampleCount];
        for (int i = 0; i < SampleCount; i++)
        {
            int j = Math.Min(15, (int)Math.Floor(hue[i] / 22.5));
            cesBins[i] = j + 1;
            count[j]++; sta[j] += t[i].A; stb[j] += t[i].B; sra[j] += r[i].A; srb[j] += r[i].B; sde[j] += de[i];
        }
        double[] ta = new double[16], tb = new double[16], ra = new double[16], rb = new double[16];
        for (int j = 0; j < 16; j++)
        {
            int c = Math.Max(count[j], 1);
            ta[j] = sta[j] / c; tb[j] = stb[j] / c; ra[j] = sra[j] / c; rb[j] = srb[j] / c;
        }
        double areaT = 0, areaR = 0;
        for (int j = 0; j < 16; j++)
        {
            int nj = (j + 1) % 16;
            areaT += ta[j] * tb[nj] - ta[nj] * tb[j];
            areaR += ra[j] * rb[nj] - ra[nj] * rb[j];
        }
        var bins = new HueBin[16];
        for (int j = 0; j < 16; j++)
        {
            double theta = (j + 0.5) * 22.5 * Math.PI / 180;
            double dA = ta[j] - ra[j], dB = tb[j] - rb[j], chroma = Math.Sqrt(ra[j] * ra[j] + rb[j] * rb[j]);
            bool empty = count[j] == 0;
            bins[j] = new HueBin(j + 1, count[j], empty ? double.NaN : FidelityIndex.ToScale(sde[j] / count[j]),
                empty ? double.NaN : (dA * Math.Cos(theta) + dB * Math.Sin(theta)) / chroma,
                empty ? double.NaN : (-dA * Math.Sin(theta) + dB * Math.Cos(theta)) / chroma, ra[j], rb[j], ta[j], tb[j]);
        }
        return new FidelityResult(FidelityIndex.ToScale(sum / SampleCount), 100 * areaT / areaR, rfCes, bins, reference, cesBins);
    }

    public static CriResult Cri(RegularSamples test, double cct)
    {
        int n = test.Values.Length;
        var reference = ReferenceIlluminants.ForCie13_3(cct, test.StartNm, test.StepNm, n);
        var tcs5 = CieTables.CriTestSamples;
        var tcs = test.StepNm == 1 ? tcs5.SpragueToOneNm() : tcs5;
        var cmf = Colorimeter.CmfWeights(Observer.Cie1931TwoDegree, test.StartNm, test.StepNm, n);
        var w = SpectralWeights.ForSamples(tcs, Observer.Cie1931TwoDegree, test.StartNm, test.StepNm, n);
        (double U, double V) Uv(double x, double y, double z) { double d = x + 15 * y + 3 * z; return (4 * x / d, 6 * y / d); }
        double C(double u, double v) => (4 - u - 10 * v) / v;
        double D(double u, double v) => (1.708 * v + 0.404 - 1.481 * u) / v;
        var (wk, wr) = SpectralSum.Tristimulus2(cmf.Weights[0], cmf.Weights[1], cmf.Weights[2], test.Values, reference.Samples.Values);
        var (uk, vk) = Uv(wk.X, wk.Y, wk.Z);
        var (ur, vr) = Uv(wr.X, wr.Y, wr.Z);
        double kk = 100 / wk.Y, kr = 100 / wr.Y;
        double ck = C(uk, vk), dk = D(uk, vk), cr = C(ur, vr), dr = D(ur, vr);
        var ri = new double[14];
        for (int i = 0; i < 14; i++)
        {
            var (st, sr) = SpectralSum.Tristimulus2(w.Weights[3 * i], w.Weights[3 * i + 1], w.Weights[3 * i + 2], test.Values, reference.Samples.Values);
            var (uki, vki) = Uv(kk * st.X, kk * st.Y, kk * st.Z);
            var (uri, vri) = Uv(kr * sr.X, kr * sr.Y, kr * sr.Z);
            double cki = C(uki, vki), dki = D(uki, vki);
            double den = 16.518 + 1.481 * (cr / ck) * cki - (dr / dk) * dki;
            double uA = (10.872 + 0.404 * (cr / ck) * cki - 4 * (dr / dk) * dki) / den, vA = 5.520 / den;
            double wt = 25 * Math.Cbrt(kk * st.Y) - 17, wre = 25 * Math.Cbrt(kr * sr.Y) - 17;
            double ut = 13 * wt * (uA - ur), vt = 13 * wt * (vA - vr), uRef = 13 * wre * (uri - ur), vRef = 13 * wre * (vri - vr);
            ri[i] = 100 - 4.6 * Math.Sqrt((uRef - ut) * (uRef - ut) + (vRef - vt) * (vRef - vt) + (wre - wt) * (wre - wt));
        }
        return new CriResult(ri.Take(8).Average(), ri, reference, Math.Sqrt((uk - ur) * (uk - ur) + (vk - vr) * (vk - vr)));
    }
}

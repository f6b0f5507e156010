using System.Collections.Concurrent;
using Lumen.Cie;
using Lumen.Colorimetry;

namespace Lumen.Rendition;

/// <summary>
/// The tristimulus sums a rendition index needs, for many spectra in one pass: the white (the observer's x̄, ȳ, z̄)
/// and each sample's (reflectance × x̄, ȳ, z̄), under each test spectrum and under its reference.
/// </summary>
/// <remarks>
/// Weight rows: 3 for the white, then 3 per sample, all × Δλ (<see cref="SpectralWeights"/>); the sums run through
/// <see cref="SpectralSum.Many"/>. A CIE daylight reference is S0 + M1·S1 + M2·S2, so its sums are
/// Σw·S0 + M1·Σw·S1 + M2·Σw·S2 with the three component sums computed once per grid: the same value as summing the
/// daylight spectrum, in another order (rounding of order 1e-15 relative). Planckian references of 1000–5000 K come from
/// <see cref="PlanckianSums"/> (interpolated, checked to 1e-12 relative); CIE 224 blends of 4000–5000 K combine the two
/// (<see cref="TryBlend(PlanckianSums, ReferenceIlluminant, Span{double})"/>). Only a reference a table cannot give
/// (should a table fail its check) is summed like the test spectra, in the same pass.
/// </remarks>
internal sealed class SampleSums
{
    private static readonly ConcurrentDictionary<(string, Observer, int, int, int), SampleSums> Cache = new();
    private readonly double[] _daylight; // rows × 3: sums of S0, S1, S2
    private readonly Lazy<PlanckianSums> _planckian;
    private readonly Lazy<(PlanckianSums Planckian, double[] Daylight)> _blendY; // the CIE 224 blend's normalising Y

    private SampleSums(double[][] rows, int startNm, int stepNm, int count)
    {
        Rows = rows;
        var (s0, s1, s2) = ReferenceIlluminants.DaylightComponentsOn(startNm, stepNm, count);
        _daylight = new double[3 * rows.Length];
        SpectralSum.Many(rows, [s0, s1, s2], _daylight);
        _planckian = new(() => PlanckianSums.Build(rows, startNm, stepNm, count));
        _blendY = new(() =>
        {
            // Y of the parts of a blend, as ReferenceIlluminants.ForCie224 normalises them: Σ ȳ(2°)·S.
            double[][] cmf2 = Colorimeter.CmfWeights(Observer.Cie1931TwoDegree, startNm, stepNm, count).Weights;
            var daylight = new double[9];
            SpectralSum.Many(cmf2, [s0, s1, s2], daylight);
            return (PlanckianSums.Build(cmf2, startNm, stepNm, count), [daylight[1], daylight[4], daylight[7]]);
        });
    }

    /// <summary>Weight rows: x̄, ȳ, z̄ of the white, then x̄, ȳ, z̄ of each sample, each × Δλ.</summary>
    public double[][] Rows { get; }

    /// <summary>Number of rows (3 + 3 × samples).</summary>
    public int RowCount => Rows.Length;

    /// <summary>Gets (or builds and caches) the rows for a sample table and observer on a grid.</summary>
    /// <param name="samples">Spectral radiance factors of the samples.</param>
    /// <param name="observer">Observer.</param>
    /// <param name="startNm">Grid start, whole nm.</param>
    /// <param name="stepNm">Grid step, whole nm.</param>
    /// <param name="count">Grid size.</param>
    /// <returns>The cached sums table.</returns>
    public static SampleSums For(CieTable samples, Observer observer, int startNm, int stepNm, int count)
    {
        var key = (samples.Name, observer, startNm, stepNm, count);
        if (Cache.TryGetValue(key, out var cached)) return cached;
        // Grids are few in practice (one per instrument setting). Should a run meet more than CacheLimit of them, the
        // tables are dropped and rebuilt as needed: memory stays bounded, and every result still comes from a table.
        if (Cache.Count >= CacheLimit) Cache.Clear();
        return Cache.GetOrAdd(key, _ =>
        {
            var cmf = Colorimeter.CmfWeights(observer, startNm, stepNm, count);
            var w = SpectralWeights.ForSamples(samples, observer, startNm, stepNm, count);
            var rows = new double[3 + w.Weights.Length][];
            rows[0] = cmf.Weights[0]; rows[1] = cmf.Weights[1]; rows[2] = cmf.Weights[2];
            for (int i = 0; i < w.Weights.Length; i++) rows[3 + i] = w.Weights[i];
            return new SampleSums(rows, startNm, stepNm, count);
        });
    }

    /// <summary>
    /// What an index derives from a CIE daylight reference's sums alone (e.g. the samples' appearance under it), kept per
    /// (M1, M2). CIE 15 rounds M1 and M2 to three decimals, so every daylight CCT that rounds to the same pair has the very
    /// same reference spectrum and sums (<see cref="Compute"/> combines the component sums in a fixed order): the kept
    /// value is exact, not an approximation, and units of similar CCT share it (issue 16).
    /// </summary>
    /// <typeparam name="T">What is kept (one type per table: each index has its own table).</typeparam>
    /// <param name="reference">A CIE daylight reference.</param>
    /// <param name="referenceSums">Its sums on this table.</param>
    /// <param name="derive">Derives the value from the sums (pure).</param>
    /// <returns>The value.</returns>
    public T ForDaylight<T>(ReferenceIlluminant reference, ReadOnlySpan<double> referenceSums, Func<double[], T> derive) where T : class
    {
        var key = ReferenceIlluminants.DaylightFactors(reference.CctKelvin);
        if (_daylightDerived.TryGetValue(key, out var kept) && kept is T value) return value;
        value = derive(referenceSums.ToArray());
        if (_daylightDerived.Count >= DaylightDerivedLimit) _daylightDerived.Clear(); // bounded; rebuilt as needed
        _daylightDerived[key] = value;
        return value;
    }

    private readonly ConcurrentDictionary<(double M1, double M2), object> _daylightDerived = new();

    /// <summary>
    /// What an index derives from a Planckian reference's sums (e.g. the samples' appearance under it), interpolated in
    /// the mired over 1000 K to <paramref name="upToKelvin"/> from the values derived at the interpolation nodes
    /// (<see cref="MiredChebyshev"/>; a piece of the table is used only if it agrees with the derivation within
    /// <paramref name="tolerance"/> everywhere it checks). Made once per table on first use, from that call's
    /// arguments: a table serves one derivation (each index has its own table of sample sums); each piece is fitted on
    /// its first use.
    /// </summary>
    /// <param name="temperatureKelvin">The reference's temperature, K.</param>
    /// <param name="upToKelvin">Highest temperature tabulated (at most 5000 K, the Planckian sums' range).</param>
    /// <param name="width">Values derived.</param>
    /// <param name="derive">Derives the values from the sums (pure, smooth in the temperature).</param>
    /// <param name="tolerance">Largest absolute difference accepted.</param>
    /// <param name="output">The values.</param>
    /// <returns>False outside the range or where the table's piece failed its check (derive from the sums then).</returns>
    public bool TryPlanckianDerived(double temperatureKelvin, double upToKelvin, int width, Func<double[], double[]> derive, double tolerance, Span<double> output)
    {
        if (!(temperatureKelvin >= 1000 && temperatureKelvin <= upToKelvin)) return false;
        // Two threads may both make the (empty) table; one is kept, and pieces are fitted only in the kept one.
        var table = LazyInitializer.EnsureInitialized(ref _planckianDerived, () => BuildPlanckianDerived(upToKelvin, width, derive, tolerance));
        return table.TryEvaluate(temperatureKelvin, output);
    }

    private MiredChebyshev? _planckianDerived;

    private MiredChebyshev BuildPlanckianDerived(double upToKelvin, int width, Func<double[], double[]> derive, double tolerance)
    {
        var planckian = _planckian.Value;
        double[] At(double[] mireds)
        {
            var sums = new double[RowCount];
            var values = new double[mireds.Length * width];
            for (int i = 0; i < mireds.Length; i++)
            {
                if (!planckian.TryEvaluate(1e6 / mireds[i], sums)) values.AsSpan(i * width, width).Fill(double.NaN); // not tabulated
                else derive(sums).CopyTo(values, i * width);
            }
            return values;
        }
        // 32 pieces of degree 11 rather than the sums' 16 of degree 15: a unit reads 12 coefficient rows, not 16 (a mixed
        // set of LEDs ran 5–12 % faster); 10 nodes a piece no longer passed the 1e-11 check, 12 do (rounding in CIECAM02
        // keeps either grid above 1e-12).
        return MiredChebyshev.Build(1e6 / upToKelvin, 1000, width, logarithmic: false, At, (t, d) => Math.Abs(t - d) <= tolerance, pieces: 32, nodesPerPiece: 12);
    }

    /// <summary>Most (M1, M2) pairs kept per table (all of 4000–25 000 K is about 2,000).</summary>
    internal const int DaylightDerivedLimit = 4096;

    /// <summary>Most grids whose tables are kept at once.</summary>
    internal const int CacheLimit = 256;

    /// <summary>Number of grids whose tables are kept now.</summary>
    internal static int CachedGrids => Cache.Count;

    /// <summary>A rendition index from the sums of one test spectrum and of its reference (the <paramref name="index"/>-th).</summary>
    /// <typeparam name="T">The result type.</typeparam>
    public delegate T FromSums<T>(ReadOnlySpan<double> testSums, ReadOnlySpan<double> referenceSums, ReferenceIlluminant reference, int index);

    /// <summary>The sums of each test spectrum and its reference (<see cref="Compute"/>), then each one's result.</summary>
    /// <typeparam name="T">The result type.</typeparam>
    /// <param name="tests">Test spectra on this table's grid.</param>
    /// <param name="references">The reference of each.</param>
    /// <param name="result">Turns one spectrum's sums into its result.</param>
    /// <param name="referenceSumsUnused">Per spectrum, true when its result does not read its reference's sums (they are
    /// then not computed and read as NaN); null when every result reads them.</param>
    /// <returns>One result per test spectrum, in order.</returns>
    public T[] Evaluate<T>(IReadOnlyList<double[]> tests, IReadOnlyList<ReferenceIlluminant> references, FromSums<T> result, IReadOnlyList<bool>? referenceSumsUnused = null)
    {
        ArgumentNullException.ThrowIfNull(result);
        int rows = RowCount, length = tests.Count * rows;
        // Pooled: the sums live only until each result is made (a block of 16 needs two arrays of 38 KB, whose zeroing on
        // every block showed in profiles).
        var pool = System.Buffers.ArrayPool<double>.Shared;
        double[] testSums = pool.Rent(length), referenceSums = pool.Rent(length);
        try
        {
            Compute(tests, references, testSums.AsSpan(0, length), referenceSums.AsSpan(0, length), referenceSumsUnused);
            var results = new T[tests.Count];
            for (int j = 0; j < results.Length; j++)
                results[j] = result(testSums.AsSpan(j * rows, rows), referenceSums.AsSpan(j * rows, rows), references[j], j);
            return results;
        }
        finally
        {
            pool.Return(testSums);
            pool.Return(referenceSums);
        }
    }

    /// <summary>
    /// The sums of each test spectrum and of its reference (all on this table's grid), in one pass over the weights.
    /// </summary>
    /// <param name="tests">Test spectra.</param>
    /// <param name="references">The reference of each test spectrum.</param>
    /// <param name="testSums">Output, tests × <see cref="RowCount"/>.</param>
    /// <param name="referenceSums">Output, tests × <see cref="RowCount"/>.</param>
    /// <param name="referenceSumsUnused">Per spectrum, true to skip its reference's sums (written as NaN); null for none.</param>
    public void Compute(IReadOnlyList<double[]> tests, IReadOnlyList<ReferenceIlluminant> references, Span<double> testSums, Span<double> referenceSums, IReadOnlyList<bool>? referenceSumsUnused = null)
    {
        ArgumentNullException.ThrowIfNull(tests);
        ArgumentNullException.ThrowIfNull(references);
        if (references.Count != tests.Count) throw new ArgumentException("One reference per test spectrum is needed.", nameof(references));
        int rows = RowCount;
        var vectors = new List<double[]>(2 * tests.Count);
        vectors.AddRange(tests);
        var planckian = _planckian.Value;
        var tabulated = new bool[references.Count];
        for (int i = 0; i < references.Count; i++)
        {
            var r = references[i];
            if (referenceSumsUnused is not null && referenceSumsUnused[i]) { referenceSums.Slice(i * rows, rows).Fill(double.NaN); tabulated[i] = true; continue; }
            if (r.Kind == ReferenceKind.CieDaylight) continue;
            if (r.Kind == ReferenceKind.Planckian && planckian.TryEvaluate(r.CctKelvin, referenceSums.Slice(i * rows, rows))) { tabulated[i] = true; continue; }
            if (r.Kind == ReferenceKind.Blend && TryBlend(planckian, r, referenceSums.Slice(i * rows, rows))) { tabulated[i] = true; continue; }
            vectors.Add(r.Samples.Values);
        }
        var rented = System.Buffers.ArrayPool<double>.Shared.Rent(vectors.Count * rows);
        try { Split(rented.AsSpan(0, vectors.Count * rows), tests.Count, vectors, references, tabulated, testSums, referenceSums); }
        finally { System.Buffers.ArrayPool<double>.Shared.Return(rented); }
    }

    /// <summary>
    /// The sums of a CIE 224 blend (1 − m)·P/Y_P + m·D/Y_D from tables: (1 − m)/Y_P·ΣwP + m/Y_D·ΣwD, with ΣwP and Y_P
    /// from Planckian tables and ΣwD and Y_D from the daylight components (linear, so equal to summing the blend up to
    /// rounding). False when the temperature is outside a table or its piece failed its check (the blend is then summed
    /// directly).
    /// </summary>
    private bool TryBlend(PlanckianSums planckian, ReferenceIlluminant r, Span<double> target) =>
        TryBlend(planckian, r.CctKelvin, r.DaylightFraction, ReferenceIlluminants.DaylightFactors(r.CctKelvin), target);

    /// <summary>The blend's sums at a temperature and daylight fraction with the daylight part's (M1, M2) given.</summary>
    private bool TryBlend(PlanckianSums planckian, double cctKelvin, double m, (double M1, double M2) daylight, Span<double> target)
    {
        var (yTable, yDaylight) = _blendY.Value;
        Span<double> y = stackalloc double[3];
        if (!yTable.TryEvaluate(cctKelvin, y) || !planckian.TryEvaluate(cctKelvin, target)) return false;
        var (m1, m2) = daylight;
        double a = (1 - m) / y[1], b = m / (yDaylight[0] + m1 * yDaylight[1] + m2 * yDaylight[2]);
        int rows = RowCount;
        for (int row = 0; row < rows; row++)
            target[row] = a * target[row] + b * (_daylight[row] + m1 * _daylight[rows + row] + m2 * _daylight[2 * rows + row]);
        return true;
    }

    /// <summary>
    /// What an index derives from a CIE 224 blend reference's sums (e.g. the samples' appearance under it), interpolated
    /// (issue 16). The blend's daylight part has M1 and M2 rounded to three decimals, a step function of the temperature,
    /// so the derived values are smooth only while the pair holds: they are tabulated per (M1, M2) pair and per cell of
    /// <see cref="BlendCellMired"/> mired, as a function of the temperature with the pair held fixed (one Chebyshev piece
    /// of <see cref="BlendNodes"/> nodes, checked against the derivation within <paramref name="tolerance"/> when built).
    /// A cell's table is built on its first use (17 derivations, about 0.15 ms) and depends only on its pair and cell, so
    /// a result never depends on which units came before it; units of one production lot share few cells.
    /// </summary>
    /// <param name="reference">A CIE 224 blend reference.</param>
    /// <param name="width">Values derived.</param>
    /// <param name="derive">Derives the values from the sums (pure, smooth in the temperature for a fixed pair).</param>
    /// <param name="tolerance">Largest absolute difference accepted.</param>
    /// <param name="output">The values.</param>
    /// <returns>False when not a blend or where the cell's table failed its check (derive from the sums then).</returns>
    public bool TryBlendDerived(ReferenceIlluminant reference, int width, Func<double[], double[]> derive, double tolerance, Span<double> output)
    {
        double t = reference.CctKelvin;
        if (reference.Kind != ReferenceKind.Blend || !(t >= BlendLowKelvin && t <= BlendHighKelvin)) return false;
        var planckian = _planckian.Value;
        var pair = ReferenceIlluminants.DaylightFactors(t);
        int cell = Math.Clamp((int)((1e6 / t - 1e6 / BlendHighKelvin) / BlendCellMired), 0, BlendCells - 1);
        if (!_blendDerived.TryGetValue((pair, cell), out var table))
        {
            // Counting a concurrent dictionary takes all its locks: only on a miss, never on the per-unit path.
            if (_blendDerived.Count >= BlendDerivedLimit) _blendDerived.Clear(); // bounded; rebuilt as needed
            // Two threads may both make the (empty) table; one is kept, and it is fitted only there.
            table = _blendDerived.GetOrAdd((pair, cell), _ => BlendTable(planckian, pair, cell, width, derive, tolerance));
        }
        return table.TryEvaluate(t, output);
    }

    /// <summary>The blend cell's table of derived values (fitted on its first use).</summary>
    private MiredChebyshev BlendTable(PlanckianSums planckian, (double M1, double M2) pair, int cell, int width, Func<double[], double[]> derive, double tolerance)
    {
        double low = 1e6 / BlendHighKelvin + cell * BlendCellMired;
        double[] At(double[] mireds)
        {
            var sums = new double[RowCount];
            var values = new double[mireds.Length * width];
            for (int i = 0; i < mireds.Length; i++)
            {
                double k = 1e6 / mireds[i];
                if (!TryBlend(planckian, k, (k - BlendLowKelvin) / (BlendHighKelvin - BlendLowKelvin), pair, sums)) values.AsSpan(i * width, width).Fill(double.NaN);
                else derive(sums).CopyTo(values, i * width);
            }
            return values;
        }
        return MiredChebyshev.Build(low, low + BlendCellMired, width, logarithmic: false, At, (a, d) => Math.Abs(a - d) <= tolerance, pieces: 1, nodesPerPiece: BlendNodes);
    }

    private readonly ConcurrentDictionary<((double M1, double M2) Pair, int Cell), MiredChebyshev> _blendDerived = new();

    /// <summary>The CIE 224 blend's range, K (m = (T − 4000)/1000).</summary>
    private const double BlendLowKelvin = 4000, BlendHighKelvin = 5000;

    /// <summary>Width of a blend cell, mired (4000–5000 K is 50 mired: 200 cells of 4–6 K).</summary>
    internal const double BlendCellMired = 0.25;

    private const int BlendCells = 200;

    /// <summary>Chebyshev nodes per blend cell (degree 7 over a quarter mired).</summary>
    internal const int BlendNodes = 8;

    /// <summary>Most blend cells kept per table (4000–5000 K meets a few hundred).</summary>
    internal const int BlendDerivedLimit = 1024;

    /// <summary>Sums every vector (tests first, then the non-daylight references) and hands each out.</summary>
    private void Split(Span<double> all, int count, List<double[]> vectors, IReadOnlyList<ReferenceIlluminant> references, bool[] tabulated, Span<double> testSums, Span<double> referenceSums)
    {
        int rows = RowCount;
        SpectralSum.Many(Rows, vectors, all);
        all[..(count * rows)].CopyTo(testSums);
        int next = count;
        for (int i = 0; i < count; i++)
        {
            if (tabulated[i]) continue; // already written from the Planckian table
            var target = referenceSums.Slice(i * rows, rows);
            if (references[i].Kind != ReferenceKind.CieDaylight) { all.Slice(next++ * rows, rows).CopyTo(target); continue; }
            var (m1, m2) = ReferenceIlluminants.DaylightFactors(references[i].CctKelvin);
            for (int r = 0; r < rows; r++) target[r] = _daylight[r] + m1 * _daylight[rows + r] + m2 * _daylight[2 * rows + r];
        }
    }
}

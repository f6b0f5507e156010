using System.Collections.Concurrent;
using System.Numerics.Tensors;
using Lumen.Cie;
using Lumen.Spectra;

namespace Lumen.Colorimetry;

/// <summary>
/// Precomputed weighting functions (a CIE function times Δλ) on one regular grid, so that each spectral
/// sum is a single dot product.
/// </summary>
/// <remarks>Built once per (table, columns, grid) and cached; thread-safe. Outside the CIE table's range
/// the weight is 0, i.e. the summation runs over the overlap of the spectrum and the table (CIE 15
/// summation, methods note colorimetry.md §1.1).</remarks>
public sealed class SpectralWeights
{
    private static readonly ConcurrentDictionary<(string Table, string Columns, int Start, int Step, int Count), SpectralWeights> Cache = new();
    private static readonly string[] ObserverKeys = ["×cmf2", "×cmf10"];

    private SpectralWeights(double[][] weights) => Weights = weights;

    /// <summary>One weight array per column, each the grid's length.</summary>
    public double[][] Weights { get; }


    /// <summary>Gets (or builds and caches) weights for <paramref name="columns"/> of <paramref name="table"/> on a grid.</summary>
    /// <param name="table">The CIE table (1 nm tables serve any whole-nm grid).</param>
    /// <param name="columns">Column names.</param>
    /// <param name="startNm">First wavelength of the grid, nm.</param>
    /// <param name="stepNm">Grid step, nm.</param>
    /// <param name="count">Number of grid points.</param>
    /// <returns>The cached weights.</returns>
    public static SpectralWeights For(CieTable table, IReadOnlyList<string> columns, int startNm, int stepNm, int count)
    {
        ArgumentNullException.ThrowIfNull(table);
        ArgumentNullException.ThrowIfNull(columns);
        var key = (table.Name, string.Join(',', columns), startNm, stepNm, count);
        return Cache.GetOrAdd(key, _ =>
        {
            var w = new double[columns.Count][];
            for (int c = 0; c < columns.Count; c++)
            {
                w[c] = new double[count];
                for (int k = 0; k < count; k++) w[c][k] = table.At(columns[c], startNm + k * stepNm) * stepNm;
            }
            return new SpectralWeights(w);
        });
    }

    /// <summary>
    /// Products of reflectance samples and colour-matching functions (R_i·x̄·Δλ, R_i·ȳ·Δλ, R_i·z̄·Δλ for each sample
    /// i, in that order) on a grid, so that a sample's tristimulus values under a source are three dot products.
    /// </summary>
    /// <param name="samples">Table of spectral radiance factors on a grid that contains the requested one.</param>
    /// <param name="observer">Observer.</param>
    /// <param name="startNm">Grid start.</param>
    /// <param name="stepNm">Grid step.</param>
    /// <param name="count">Grid size.</param>
    /// <returns>3 × (number of samples) weight arrays, cached.</returns>
    public static SpectralWeights ForSamples(CieTable samples, Observer observer, int startNm, int stepNm, int count)
    {
        ArgumentNullException.ThrowIfNull(samples);
        var key = (samples.Name, ObserverKeys[observer == Observer.Cie1931TwoDegree ? 0 : 1], startNm, stepNm, count);
        if (Cache.TryGetValue(key, out var cached)) return cached;
        return Cache.GetOrAdd(key, _ =>
        {
            var cmf = CieTables.ColourMatchingFunctions(observer);
            var (cx, cy, cz) = CieTables.CmfColumns(observer);
            var w = new double[samples.ColumnNames.Count * 3][];
            for (int i = 0; i < samples.ColumnNames.Count; i++)
            {
                var name = samples.ColumnNames[i];
                w[3 * i] = new double[count]; w[3 * i + 1] = new double[count]; w[3 * i + 2] = new double[count];
                for (int k = 0; k < count; k++)
                {
                    int wl = startNm + k * stepNm;
                    double r = samples.At(name, wl) * stepNm;
                    w[3 * i][k] = r * cmf.At(cx, wl);
                    w[3 * i + 1][k] = r * cmf.At(cy, wl);
                    w[3 * i + 2][k] = r * cmf.At(cz, wl);
                }
            }
            return new SpectralWeights(w);
        });
    }

    /// <summary>Weights on the grid of <paramref name="samples"/>.</summary>
    /// <param name="table">The CIE table.</param>
    /// <param name="columns">Column names.</param>
    /// <param name="samples">The grid.</param>
    /// <returns>The cached weights.</returns>
    public static SpectralWeights For(CieTable table, IReadOnlyList<string> columns, RegularSamples samples) =>
        For(table, columns, samples.StartNm, samples.StepNm, samples.Values.Length);
}

/// <summary>The one integrator: Σ S(λ)·w(λ) over a regular grid.</summary>
public static class SpectralSum
{
    /// <summary>Σ values·weights, vectorised (System.Numerics.Tensors).</summary>
    /// <param name="values">Spectral values.</param>
    /// <param name="weights">Weights of the same length (function × Δλ).</param>
    /// <returns>The sum.</returns>
    public static double Dot(ReadOnlySpan<double> values, ReadOnlySpan<double> weights) => TensorPrimitives.Dot(values, weights);

    /// <summary>
    /// Tristimulus-style sums of two spectra against three weight rows in one pass: (Σa·wx, Σa·wy, Σa·wz) and
    /// (Σb·wx, Σb·wy, Σb·wz). Each spectrum value is loaded once for three rows and six independent accumulators
    /// keep the floating-point units busy; this is the hot loop of CIE 224 (99 samples × test and reference).
    /// </summary>
    /// <param name="wx">x̄-type weights.</param>
    /// <param name="wy">ȳ-type weights.</param>
    /// <param name="wz">z̄-type weights.</param>
    /// <param name="a">First spectrum.</param>
    /// <param name="b">Second spectrum.</param>
    /// <returns>The six sums.</returns>
    public static (Colorimetry.Tristimulus A, Colorimetry.Tristimulus B) Tristimulus2(
        ReadOnlySpan<double> wx, ReadOnlySpan<double> wy, ReadOnlySpan<double> wz, ReadOnlySpan<double> a, ReadOnlySpan<double> b)
    {
        int n = a.Length;
        if (b.Length != n || wx.Length != n || wy.Length != n || wz.Length != n) throw new ArgumentException("Lengths differ.", nameof(a));
        int i = 0, width = System.Numerics.Vector<double>.Count;
        double ax = 0, ay = 0, az = 0, bx = 0, by = 0, bz = 0;
        if (System.Runtime.Intrinsics.Vector512.IsHardwareAccelerated && n >= 8)
        {
            ref double rx = ref System.Runtime.InteropServices.MemoryMarshal.GetReference(wx);
            ref double ry = ref System.Runtime.InteropServices.MemoryMarshal.GetReference(wy);
            ref double rz = ref System.Runtime.InteropServices.MemoryMarshal.GetReference(wz);
            ref double ra = ref System.Runtime.InteropServices.MemoryMarshal.GetReference(a);
            ref double rb = ref System.Runtime.InteropServices.MemoryMarshal.GetReference(b);
            var vax = System.Runtime.Intrinsics.Vector512<double>.Zero; var vay = vax; var vaz = vax; var vbx = vax; var vby = vax; var vbz = vax;
            for (; i <= n - 8; i += 8)
            {
                var va = System.Runtime.Intrinsics.Vector512.LoadUnsafe(ref ra, (nuint)i);
                var vb = System.Runtime.Intrinsics.Vector512.LoadUnsafe(ref rb, (nuint)i);
                var x = System.Runtime.Intrinsics.Vector512.LoadUnsafe(ref rx, (nuint)i);
                var y = System.Runtime.Intrinsics.Vector512.LoadUnsafe(ref ry, (nuint)i);
                var z = System.Runtime.Intrinsics.Vector512.LoadUnsafe(ref rz, (nuint)i);
                vax = System.Runtime.Intrinsics.Vector512.FusedMultiplyAdd(x, va, vax);
                vay = System.Runtime.Intrinsics.Vector512.FusedMultiplyAdd(y, va, vay);
                vaz = System.Runtime.Intrinsics.Vector512.FusedMultiplyAdd(z, va, vaz);
                vbx = System.Runtime.Intrinsics.Vector512.FusedMultiplyAdd(x, vb, vbx);
                vby = System.Runtime.Intrinsics.Vector512.FusedMultiplyAdd(y, vb, vby);
                vbz = System.Runtime.Intrinsics.Vector512.FusedMultiplyAdd(z, vb, vbz);
            }
            ax = System.Runtime.Intrinsics.Vector512.Sum(vax); ay = System.Runtime.Intrinsics.Vector512.Sum(vay); az = System.Runtime.Intrinsics.Vector512.Sum(vaz);
            bx = System.Runtime.Intrinsics.Vector512.Sum(vbx); by = System.Runtime.Intrinsics.Vector512.Sum(vby); bz = System.Runtime.Intrinsics.Vector512.Sum(vbz);
        }
        else if (System.Numerics.Vector.IsHardwareAccelerated && n >= width)
        {
            ref double rx = ref System.Runtime.InteropServices.MemoryMarshal.GetReference(wx);
            ref double ry = ref System.Runtime.InteropServices.MemoryMarshal.GetReference(wy);
            ref double rz = ref System.Runtime.InteropServices.MemoryMarshal.GetReference(wz);
            ref double ra = ref System.Runtime.InteropServices.MemoryMarshal.GetReference(a);
            ref double rb = ref System.Runtime.InteropServices.MemoryMarshal.GetReference(b);
            var vax = System.Numerics.Vector<double>.Zero; var vay = vax; var vaz = vax; var vbx = vax; var vby = vax; var vbz = vax;
            for (; i <= n - width; i += width)
            {
                var va = System.Numerics.Vector.LoadUnsafe(ref ra, (nuint)i);
                var vb = System.Numerics.Vector.LoadUnsafe(ref rb, (nuint)i);
                var x = System.Numerics.Vector.LoadUnsafe(ref rx, (nuint)i);
                var y = System.Numerics.Vector.LoadUnsafe(ref ry, (nuint)i);
                var z = System.Numerics.Vector.LoadUnsafe(ref rz, (nuint)i);
                vax = System.Numerics.Vector.FusedMultiplyAdd(x, va, vax);
                vay = System.Numerics.Vector.FusedMultiplyAdd(y, va, vay);
                vaz = System.Numerics.Vector.FusedMultiplyAdd(z, va, vaz);
                vbx = System.Numerics.Vector.FusedMultiplyAdd(x, vb, vbx);
                vby = System.Numerics.Vector.FusedMultiplyAdd(y, vb, vby);
                vbz = System.Numerics.Vector.FusedMultiplyAdd(z, vb, vbz);
            }
            ax = System.Numerics.Vector.Sum(vax); ay = System.Numerics.Vector.Sum(vay); az = System.Numerics.Vector.Sum(vaz);
            bx = System.Numerics.Vector.Sum(vbx); by = System.Numerics.Vector.Sum(vby); bz = System.Numerics.Vector.Sum(vbz);
        }
        for (; i < n; i++)
        {
            ax += a[i] * wx[i]; ay += a[i] * wy[i]; az += a[i] * wz[i];
            bx += b[i] * wx[i]; by += b[i] * wy[i]; bz += b[i] * wz[i];
        }
        return (new Colorimetry.Tristimulus(ax, ay, az), new Colorimetry.Tristimulus(bx, by, bz));
    }

    /// <summary>Scalar reference of <see cref="Dot"/>, kept to test the vector path against.</summary>
    /// <param name="values">Spectral values.</param>
    /// <param name="weights">Weights.</param>
    /// <returns>The sum.</returns>
    public static double DotScalar(ReadOnlySpan<double> values, ReadOnlySpan<double> weights)
    {
        if (values.Length != weights.Length) throw new ArgumentException("Lengths differ.", nameof(weights));
        double s = 0;
        for (int i = 0; i < values.Length; i++) s += values[i] * weights[i];
        return s;
    }
}

/// <summary>CIE tristimulus integration (CIE 15 summation).</summary>
public static class Colorimeter
{
    /// <summary>Maximum luminous efficacy for photopic vision, K_m = 683.002 lm/W (CIE ILV 17-730; methods note colorimetry.md §1.2).</summary>
    public const double KmLumensPerWatt = 683.002;

    /// <summary>Raw sums Σ S·x̄·Δλ, Σ S·ȳ·Δλ, Σ S·z̄·Δλ (k = 1) of samples on a regular grid.</summary>
    /// <param name="samples">Spectrum on a regular whole-nm grid.</param>
    /// <param name="observer">The observer.</param>
    /// <returns>The unnormalised tristimulus values.</returns>
    public static Tristimulus RawSums(RegularSamples samples, Observer observer)
    {
        ArgumentNullException.ThrowIfNull(samples);
        var w = CmfWeights(observer, samples.StartNm, samples.StepNm, samples.Values.Length);
        return new Tristimulus(
            SpectralSum.Dot(samples.Values, w.Weights[0]),
            SpectralSum.Dot(samples.Values, w.Weights[1]),
            SpectralSum.Dot(samples.Values, w.Weights[2]));
    }

    private static readonly ConcurrentDictionary<(Observer, int, int, int), SpectralWeights> CmfCache = new();

    /// <summary>Colour-matching-function weights (x̄Δλ, ȳΔλ, z̄Δλ) of an observer on a grid, cached without allocation per call.</summary>
    /// <param name="observer">The observer.</param>
    /// <param name="startNm">First wavelength of the grid.</param>
    /// <param name="stepNm">Step.</param>
    /// <param name="count">Number of points.</param>
    /// <returns>Three weight arrays.</returns>
    public static SpectralWeights CmfWeights(Observer observer, int startNm, int stepNm, int count)
    {
        if (CmfCache.TryGetValue((observer, startNm, stepNm, count), out var w)) return w;
        var (x, y, z) = CieTables.CmfColumns(observer);
        w = SpectralWeights.For(CieTables.ColourMatchingFunctions(observer), [x, y, z], startNm, stepNm, count);
        CmfCache[(observer, startNm, stepNm, count)] = w;
        return w;
    }

    /// <summary>Relative tristimulus values, normalised so that Y = 100 (CIE 15, k = 100/ΣSȳΔλ).</summary>
    /// <param name="samples">Spectrum on a regular whole-nm grid.</param>
    /// <param name="observer">The observer.</param>
    /// <returns>X, Y = 100, Z; NaN components for a spectrum with ΣSȳ = 0.</returns>
    public static Tristimulus Relative(RegularSamples samples, Observer observer)
    {
        var raw = RawSums(samples, observer);
        return raw.Y == 0 ? new Tristimulus(double.NaN, double.NaN, double.NaN) : raw.NormalisedToY(100);
    }

    /// <summary>Relative tristimulus values (Y = 100) of any spectrum, resampled by the project's one policy.</summary>
    /// <param name="spectrum">The spectrum.</param>
    /// <param name="observer">The observer.</param>
    /// <returns>X, Y = 100, Z.</returns>
    public static Tristimulus Relative(Spectrum spectrum, Observer observer) => Relative(Resampler.ForCieSums(spectrum), observer);
}

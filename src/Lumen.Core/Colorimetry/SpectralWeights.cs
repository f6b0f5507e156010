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

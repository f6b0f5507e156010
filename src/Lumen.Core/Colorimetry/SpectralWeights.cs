using System.Collections.Concurrent;
using Lumen.Cie;
using Lumen.Spectra;

namespace Lumen.Colorimetry;

/// <summary>
/// Precomputed weighting functions (a CIE function times Δλ) on one regular grid, so that each spectral
/// sum is a single dot product.
/// </summary>
/// <remarks>Built once per (table, columns, grid) and cached; thread-safe. Outside the CIE table's range
/// the weight is 0, i.e. the summation runs over the overlap of the spectrum and the table (CIE 15
/// summation, docs/methods/colorimetry.md §1.1).</remarks>
internal sealed class SpectralWeights
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
                var values = table.Column(columns[c]);
                for (int k = 0; k < count; k++) w[c][k] = table.At(values, startNm + k * stepNm) * stepNm;
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
            var cmf = CieTables.ColorMatchingFunctions(observer);
            var (cx, cy, cz) = CieTables.CmfColumns(observer);
            ReadOnlySpan<double> xs = cmf.Column(cx), ys = cmf.Column(cy), zs = cmf.Column(cz);
            var w = new double[samples.ColumnNames.Count * 3][];
            for (int i = 0; i < samples.ColumnNames.Count; i++)
            {
                var reflectance = samples.Column(samples.ColumnNames[i]);
                w[3 * i] = new double[count]; w[3 * i + 1] = new double[count]; w[3 * i + 2] = new double[count];
                for (int k = 0; k < count; k++)
                {
                    int wl = startNm + k * stepNm;
                    double r = samples.At(reflectance, wl) * stepNm;
                    w[3 * i][k] = r * cmf.At(xs, wl);
                    w[3 * i + 1][k] = r * cmf.At(ys, wl);
                    w[3 * i + 2][k] = r * cmf.At(zs, wl);
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

using Lumen.Spectra;

namespace Lumen.Comparison;

/// <summary>Applying a filter's spectral transmittance to a source (docs/methods/compare.md §1).</summary>
public static class Filter
{
    /// <summary>A transmittance whose largest value exceeds this is taken as percent (0–100) rather than a fraction (0–1).</summary>
    public const double PercentThreshold = 1.5;

    /// <summary>The source seen through the filter: S′(λ) = τ(λ)·S(λ) on the source's grid, τ interpolated linearly and 0 outside its range.</summary>
    /// <param name="source">The source spectrum.</param>
    /// <param name="transmittance">The filter's spectral transmittance, as a fraction (0–1) or in percent (detected).</param>
    /// <returns>The filtered source (named "source + filter") and whether the transmittance was read as percent.</returns>
    public static (Spectrum Filtered, bool Percent) Apply(Spectrum source, Spectrum transmittance)
    {
        ArgumentNullException.ThrowIfNull(source);
        ArgumentNullException.ThrowIfNull(transmittance);
        double max = 0;
        foreach (var v in transmittance.Values) max = Math.Max(max, v);
        bool percent = max > PercentThreshold;
        double k = percent ? 0.01 : 1;
        var w = source.WavelengthsNm;
        var v2 = new double[w.Length];
        for (int i = 0; i < v2.Length; i++) v2[i] = source.Values[i] * k * transmittance.ValueAt(w[i]);
        return (new Spectrum(w, v2, source.Unit, $"{source.Name} + {transmittance.Name}", source.Origin), percent);
    }
}

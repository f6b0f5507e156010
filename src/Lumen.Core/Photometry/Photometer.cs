using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Spectra;

namespace Lumen.Photometry;

/// <summary>Photopic and scotopic photometry, LER and S/P ratio (CIE 018:2019, docs/methods/photometry-nonvisual.md).</summary>
/// <remarks>
/// Q_v = K_m·ΣS·V·Δλ with K_m = 683.002 lm/W and V(λ) the CIE photopic luminous efficiency (360–830 nm);
/// Q′_v = K′_m·ΣS·V′·Δλ with K′_m = 1700.06 lm/W and V′(λ) the CIE scotopic function (380–780 nm), both
/// [W&amp;S pp. 256–259]. LER's denominator ΣS·Δλ runs over the spectrum's whole measured band (reported):
/// for thermal sources the band decides the figure (a 2856 K radiator is ≈ 154 lm/W over 380–780 nm but
/// only ≈ 16 lm/W over all wavelengths).
/// </remarks>
public static class Photometer
{
    /// <summary>K_m, lm/W (CIE; docs/methods/colorimetry.md §1.2).</summary>
    public const double KmLumensPerWatt = Colorimeter.KmLumensPerWatt;

    /// <summary>K′_m, lm/W (scotopic; W&amp;S).</summary>
    public const double KmPrimeLumensPerWatt = 1700.06;

    /// <summary>Computes the photometric results.</summary>
    /// <param name="samples">Spectrum on its CIE grid (from <see cref="Resampler.ForCieSums"/>).</param>
    /// <param name="unit">Unit of the values.</param>
    /// <returns>The result.</returns>
    public static PhotometricResult Compute(RegularSamples samples, SpectralUnit unit)
    {
        ArgumentNullException.ThrowIfNull(samples);
        int n = samples.Values.Length;
        double v = SpectralSum.Dot(samples.Values, SpectralWeights.For(CieTables.PhotopicLuminousEfficiency, ["V"], samples.StartNm, samples.StepNm, n).Weights[0]);
        double vs = SpectralSum.Dot(samples.Values, SpectralWeights.For(CieTables.ScotopicLuminousEfficiency, ["V_prime"], samples.StartNm, samples.StepNm, n).Weights[0]);
        double total = 0;
        foreach (var x in samples.Values) total += x;
        total *= samples.StepNm;
        double ler = total != 0 ? KmLumensPerWatt * v / total : double.NaN;
        double sp = v != 0 ? KmPrimeLumensPerWatt * vs / (KmLumensPerWatt * v) : double.NaN;
        if (!unit.IsAbsolute())
            return new PhotometricResult(ler, sp, samples.StartNm, samples.EndNm, null, null, null, null);
        var q = QuantityOf(unit);
        return new PhotometricResult(ler, sp, samples.StartNm, samples.EndNm, KmLumensPerWatt * v, KmPrimeLumensPerWatt * vs, total, q);
    }

    /// <summary>The photometric quantity of an absolute unit.</summary>
    /// <param name="unit">An absolute unit.</param>
    /// <returns>The quantity.</returns>
    /// <exception cref="ArgumentOutOfRangeException">For <see cref="SpectralUnit.Relative"/>.</exception>
    public static PhotometricQuantity QuantityOf(SpectralUnit unit) => unit switch
    {
        SpectralUnit.IrradianceWattsPerSquareMetreNm => PhotometricQuantity.IlluminanceLux,
        SpectralUnit.RadianceWattsPerSteradianSquareMetreNm => PhotometricQuantity.LuminanceCandelaPerSquareMetre,
        SpectralUnit.IntensityWattsPerSteradianNm => PhotometricQuantity.IntensityCandela,
        SpectralUnit.FluxWattsPerNm => PhotometricQuantity.FluxLumen,
        _ => throw new ArgumentOutOfRangeException(nameof(unit), "A relative spectrum has no photometric scale."),
    };

    /// <summary>The photometric unit symbol of a quantity (lx, cd/m², cd, lm).</summary>
    /// <param name="q">The photometric quantity (illuminance, luminance, intensity or flux).</param>
    /// <returns>The symbol.</returns>
    public static string UnitSymbol(PhotometricQuantity q) => q switch
    {
        PhotometricQuantity.IlluminanceLux => "lx",
        PhotometricQuantity.LuminanceCandelaPerSquareMetre => "cd/m2",
        PhotometricQuantity.IntensityCandela => "cd",
        _ => "lm",
    };

    /// <summary>The radiometric unit symbol that goes with a quantity (W/m², W/(sr·m²), W/sr, W).</summary>
    /// <param name="q">The photometric quantity (illuminance, luminance, intensity or flux).</param>
    /// <returns>The symbol.</returns>
    public static string RadiometricUnitSymbol(PhotometricQuantity q) => q switch
    {
        PhotometricQuantity.IlluminanceLux => "W/m2",
        PhotometricQuantity.LuminanceCandelaPerSquareMetre => "W/sr/m2",
        PhotometricQuantity.IntensityCandela => "W/sr",
        _ => "W",
    };
}

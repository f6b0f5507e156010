namespace Lumen.Spectra;

/// <summary>The quantity and unit of a spectrum's values.</summary>
public enum SpectralUnit
{
    /// <summary>Relative spectral power (arbitrary scale); only ratios and chromaticity are meaningful.</summary>
    Relative,

    /// <summary>Spectral irradiance, W·m⁻²·nm⁻¹; photometric result: illuminance in lux.</summary>
    IrradianceWattsPerSquareMetreNm,

    /// <summary>Spectral radiance, W·sr⁻¹·m⁻²·nm⁻¹; photometric result: luminance in cd/m².</summary>
    RadianceWattsPerSteradianSquareMetreNm,

    /// <summary>Spectral radiant intensity, W·sr⁻¹·nm⁻¹; photometric result: luminous intensity in cd.</summary>
    IntensityWattsPerSteradianNm,

    /// <summary>Spectral radiant flux, W·nm⁻¹; photometric result: luminous flux in lm.</summary>
    FluxWattsPerNm,
}

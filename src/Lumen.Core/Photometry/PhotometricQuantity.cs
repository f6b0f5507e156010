namespace Lumen.Photometry;

/// <summary>The photometric quantity that an absolute spectral unit yields.</summary>
public enum PhotometricQuantity
{
    /// <summary>Illuminance, lx (from irradiance).</summary>
    IlluminanceLux,

    /// <summary>Luminance, cd/m² (from radiance).</summary>
    LuminanceCandelaPerSquareMetre,

    /// <summary>Luminous intensity, cd (from radiant intensity).</summary>
    IntensityCandela,

    /// <summary>Luminous flux, lm (from radiant flux).</summary>
    FluxLumen,
}

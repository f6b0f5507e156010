namespace Lumen.Spectra;

/// <summary>Names and parsing of <see cref="SpectralUnit"/> values as users write them.</summary>
public static class SpectralUnits
{
    /// <summary>True when the unit is absolute (radiometric), so that photometric quantities have a scale.</summary>
    /// <param name="unit">The unit of a spectrum's values.</param>
    /// <returns>True for every unit except <see cref="SpectralUnit.Relative"/>.</returns>
    public static bool IsAbsolute(this SpectralUnit unit) => unit != SpectralUnit.Relative;

    /// <summary>The short text form used in files and on the command line.</summary>
    /// <param name="unit">The unit of a spectrum's values.</param>
    /// <returns>For example <c>W/m2/nm</c>.</returns>
    public static string Symbol(this SpectralUnit unit) => unit switch
    {
        SpectralUnit.Relative => "relative",
        SpectralUnit.IrradianceWattsPerSquareMetreNm => "W/m2/nm",
        SpectralUnit.RadianceWattsPerSteradianSquareMetreNm => "W/sr/m2/nm",
        SpectralUnit.IntensityWattsPerSteradianNm => "W/sr/nm",
        SpectralUnit.FluxWattsPerNm => "W/nm",
        _ => throw new ArgumentOutOfRangeException(nameof(unit)),
    };

    /// <summary>Parses a unit as written in a file header or on the command line.</summary>
    /// <param name="text">Text such as <c>relative</c>, <c>W/m2/nm</c>, <c>W·m⁻²·nm⁻¹</c>, <c>irradiance</c>.</param>
    /// <param name="unit">The unit, when recognised.</param>
    /// <returns>True when the text names a unit.</returns>
    public static bool TryParse(string? text, out SpectralUnit unit)
    {
        unit = SpectralUnit.Relative;
        if (string.IsNullOrWhiteSpace(text)) return false;
        var t = text.Trim().ToLowerInvariant()
            .Replace(" ", "", StringComparison.Ordinal).Replace("·", "/", StringComparison.Ordinal)
            .Replace("⁻¹", "", StringComparison.Ordinal).Replace("⁻²", "2", StringComparison.Ordinal)
            .Replace("^-1", "", StringComparison.Ordinal).Replace("^-2", "2", StringComparison.Ordinal)
            .Replace("m²", "m2", StringComparison.Ordinal).Replace("*", "/", StringComparison.Ordinal)
            .Replace("w/nm/", "w/", StringComparison.Ordinal);
        switch (t)
        {
            case "relative": case "rel": case "a.u.": case "au": case "arbitrary":
                unit = SpectralUnit.Relative; return true;
            case "irradiance": case "w/m2/nm": case "w/m2nm": case "w/(m2nm)": case "w/(m2/nm)":
                unit = SpectralUnit.IrradianceWattsPerSquareMetreNm; return true;
            case "radiance": case "w/sr/m2/nm": case "w/m2/sr/nm": case "w/(srm2nm)": case "w/sr/m2nm":
                unit = SpectralUnit.RadianceWattsPerSteradianSquareMetreNm; return true;
            case "intensity": case "w/sr/nm": case "w/srnm": case "w/(srnm)":
                unit = SpectralUnit.IntensityWattsPerSteradianNm; return true;
            case "flux": case "w/nm": case "radiantflux":
                unit = SpectralUnit.FluxWattsPerNm; return true;
            default:
                return false;
        }
    }
}

using Lumen.Spectra;

namespace Lumen.Blackbody;

/// <summary>
/// Blackbody and grey-body quantities: Wien peak, Stefan–Boltzmann exitance, net radiated power, spectral
/// radiance over a band, and the classical approximations.
/// </summary>
/// <remarks>docs/methods/planck.md §§1–3, 5: constants from the exact SI h, c, k (CODATA 2018) for absolute
/// work; M = εσT⁴; net exchange with large black surroundings P = σ·A·ε·(T⁴ − T0⁴); Wien peak λ_max = b/T.</remarks>
public static class Radiator
{
    /// <summary>Wavelength of maximum spectral radiance (per unit wavelength), λ_max = b/T.</summary>
    /// <param name="temperatureKelvin">Temperature, K (positive).</param>
    /// <returns>λ_max in nm.</returns>
    public static double WienPeakNm(double temperatureKelvin)
    {
        if (!(temperatureKelvin > 0)) throw new ArgumentOutOfRangeException(nameof(temperatureKelvin));
        return RadiationConstants.WienMetreKelvin / temperatureKelvin * 1e9;
    }

    /// <summary>Total radiant exitance of a blackbody, σT⁴, W/m².</summary>
    /// <param name="temperatureKelvin">Temperature, K (non-negative).</param>
    /// <returns>W/m².</returns>
    public static double ExitanceWattsPerSquareMetre(double temperatureKelvin)
    {
        if (!(temperatureKelvin >= 0)) throw new ArgumentOutOfRangeException(nameof(temperatureKelvin));
        double t2 = temperatureKelvin * temperatureKelvin;
        return RadiationConstants.StefanBoltzmann * t2 * t2;
    }

    /// <summary>Net radiated power of a small grey body in large black surroundings, P = σ·A·ε·(T⁴ − T0⁴).</summary>
    /// <param name="temperatureKelvin">Surface temperature T, K.</param>
    /// <param name="ambientKelvin">Surroundings temperature T0, K.</param>
    /// <param name="areaSquareMetres">Radiating area A, m² (non-negative).</param>
    /// <param name="emissivity">Emissivity ε in (0, 1].</param>
    /// <returns>Net power, W (positive = net loss).</returns>
    public static double NetPowerWatts(double temperatureKelvin, double ambientKelvin, double areaSquareMetres, double emissivity)
    {
        if (!(areaSquareMetres >= 0)) throw new ArgumentOutOfRangeException(nameof(areaSquareMetres));
        if (!(emissivity > 0 && emissivity <= 1)) throw new ArgumentOutOfRangeException(nameof(emissivity), "Emissivity must be in (0, 1].");
        return areaSquareMetres * emissivity * (ExitanceWattsPerSquareMetre(temperatureKelvin) - ExitanceWattsPerSquareMetre(ambientKelvin));
    }

    /// <summary>Spectral radiance of an approximation, W·sr⁻¹·m⁻²·nm⁻¹ (CODATA constants).</summary>
    /// <param name="wavelengthNm">Wavelength, nm.</param>
    /// <param name="temperatureKelvin">Temperature, K.</param>
    /// <param name="approximation">Planck's law itself, or the Wien or Rayleigh–Jeans approximation.</param>
    /// <returns>The radiance.</returns>
    public static double RadianceNm(double wavelengthNm, double temperatureKelvin, PlanckApproximation approximation)
    {
        var c = PlanckConstants.For(C2Convention.Codata2018);
        double l = wavelengthNm * 1e-9;
        double c1l = c.C1 / Math.PI;
        return approximation switch
        {
            PlanckApproximation.Wien => c1l / Math.Pow(l, 5) * Math.Exp(-c.C2 / (l * temperatureKelvin)) * 1e-9,
            PlanckApproximation.RayleighJeans => c1l * temperatureKelvin / (c.C2 * Math.Pow(l, 4)) * 1e-9,
            _ => Planck.SpectralRadianceNm(wavelengthNm, temperatureKelvin, c),
        };
    }

    /// <summary>A grey body's spectral radiance ε·L(λ, T) over a band, as a spectrum in W·sr⁻¹·m⁻²·nm⁻¹.</summary>
    /// <param name="temperatureKelvin">Temperature, K.</param>
    /// <param name="emissivity">Emissivity in (0, 1].</param>
    /// <param name="fromNm">First wavelength.</param>
    /// <param name="toNm">Last wavelength.</param>
    /// <param name="stepNm">Wavelength step, nm (positive).</param>
    /// <returns>The spectrum.</returns>
    public static Spectrum RadianceSpectrum(double temperatureKelvin, double emissivity, double fromNm, double toNm, double stepNm)
    {
        if (!(temperatureKelvin > 0)) throw new ArgumentOutOfRangeException(nameof(temperatureKelvin));
        if (!(emissivity > 0 && emissivity <= 1)) throw new ArgumentOutOfRangeException(nameof(emissivity));
        if (!(fromNm > 0 && toNm > fromNm && stepNm > 0)) throw new ArgumentOutOfRangeException(nameof(stepNm), "Need 0 < from < to and a positive step.");
        var w = WavelengthGrid.Regular(fromNm, toNm, stepNm);
        var v = w.Select(x => emissivity * RadianceNm(x, temperatureKelvin, PlanckApproximation.None)).ToArray();
        return new Spectrum(w, v, SpectralUnit.RadianceWattsPerSteradianSquareMetreNm, $"blackbody-{temperatureKelvin:0.###}K",
            SpectrumOrigin.Generated($"Planck's law, {temperatureKelvin} K, emissivity {emissivity}"));
    }

    /// <summary>Plain words for the colour of light at a CCT (for people, not a standard classification).</summary>
    /// <param name="cctKelvin">Colour temperature, K (positive).</param>
    /// <returns>For example "warm white".</returns>
    public static string ColorName(double cctKelvin) => cctKelvin switch
    {
        < 800 => "barely visible deep red (below about 800 K a hot body hardly glows)",
        < 1600 => "deep orange-red, like embers",
        < 2200 => "orange, like a candle flame",
        < 2800 => "very warm white",
        < 3500 => "warm white",
        < 4500 => "neutral white",
        < 5500 => "cool white",
        < 7500 => "daylight white",
        _ => "bluish white",
    };
}

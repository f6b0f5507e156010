namespace Lumen.Blackbody;

/// <summary>Planck's law for a blackbody (Planckian radiator).</summary>
public static class Planck
{
    /// <summary>
    /// Spectral radiance L_e,λ = c1 / (π·n²·λ⁵·(exp(c2/(n·λ·T)) − 1)) in W·sr⁻¹·m⁻² per metre of wavelength.
    /// </summary>
    /// <param name="wavelengthMetres">Wavelength λ in metres (positive).</param>
    /// <param name="temperatureKelvin">Thermodynamic temperature T in K (positive).</param>
    /// <param name="constants">The radiation constants c1L (W·m²/sr), c2 (m·K) and the refractive index n (1 for colorimetry).</param>
    /// <returns>Spectral radiance, W·sr⁻¹·m⁻³; 0 where exp overflows (x &gt; 700).</returns>
    /// <exception cref="ArgumentOutOfRangeException">Non-positive wavelength or temperature.</exception>
    /// <remarks>docs/methods/planck.md §1 (CIE 15:2004 App. E form); uses expm1 for precision at small x.
    /// Check value: L(500 nm, 5500 K) = 2.047 270 19e13 W·sr⁻¹·m⁻³ with c1 = 3.741771e-16, c2 = 1.4388e-2.</remarks>
    internal static double SpectralRadiancePerMetre(double wavelengthMetres, double temperatureKelvin, PlanckConstants constants)
    {
        if (!(wavelengthMetres > 0)) throw new ArgumentOutOfRangeException(nameof(wavelengthMetres), "Wavelength must be positive.");
        if (!(temperatureKelvin > 0)) throw new ArgumentOutOfRangeException(nameof(temperatureKelvin), "Temperature must be positive.");
        double n = constants.RefractiveIndex;
        double x = constants.C2 / (n * wavelengthMetres * temperatureKelvin);
        if (x > 700) return 0;
        double l5 = Math.Pow(wavelengthMetres, 5);
        return constants.C1 / (Math.PI * n * n * l5 * Expm1(x));
    }

    /// <summary>Spectral radiance in W·sr⁻¹·m⁻²·nm⁻¹.</summary>
    /// <param name="wavelengthNm">Wavelength in nm (positive).</param>
    /// <param name="temperatureKelvin">Temperature in K (positive).</param>
    /// <param name="constants">The radiation constants c1L (W·m²/sr), c2 (m·K) and the refractive index n (1 for colorimetry).</param>
    /// <returns>Spectral radiance per nm of wavelength.</returns>
    public static double SpectralRadianceNm(double wavelengthNm, double temperatureKelvin, PlanckConstants constants) =>
        SpectralRadiancePerMetre(wavelengthNm * 1e-9, temperatureKelvin, constants) * 1e-9;

    /// <summary>Spectral radiant exitance M = π·L in W·m⁻²·nm⁻¹.</summary>
    /// <param name="wavelengthNm">Wavelength in nm.</param>
    /// <param name="temperatureKelvin">Temperature in K.</param>
    /// <param name="constants">The radiation constants c1L (W·m²/sr), c2 (m·K) and the refractive index n (1 for colorimetry).</param>
    /// <returns>Spectral exitance per nm.</returns>
    public static double SpectralExitanceNm(double wavelengthNm, double temperatureKelvin, PlanckConstants constants) =>
        Math.PI * SpectralRadianceNm(wavelengthNm, temperatureKelvin, constants);

    /// <summary>exp(x) − 1 without cancellation for small x.</summary>
    /// <param name="x">Any finite real number.</param>
    /// <returns>e^x − 1.</returns>
    internal static double Expm1(double x)
    {
        if (Math.Abs(x) < 1e-5) return x + 0.5 * x * x + x * x * x / 6.0;
        return Math.Exp(x) - 1.0;
    }
}

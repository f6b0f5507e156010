namespace Lumen.Blackbody;

/// <summary>Which value of the second radiation constant c2 a Planckian calculation uses.</summary>
public enum C2Convention
{
    /// <summary>c2 = 1.4388 × 10⁻² m·K, the ITS-90 value CIE 15:2004/2018 prescribes for colorimetry (default).</summary>
    Cie15Its90,

    /// <summary>c2 = hc/k = 1.438 776 877… × 10⁻² m·K (CODATA 2018, exact since the 2019 SI).</summary>
    Codata2018,
}

/// <summary>The constants a Planck evaluation needs.</summary>
/// <param name="C1">First radiation constant c1 = 2πhc², W·m².</param>
/// <param name="C2">Second radiation constant c2, m·K.</param>
/// <param name="RefractiveIndex">Refractive index n of the medium (1 for colorimetry, CIE 15 App. E).</param>
public readonly record struct PlanckConstants(double C1, double C2, double RefractiveIndex)
{
    /// <summary>Constants for a c2 convention, c1 from CODATA 2018, n = 1.</summary>
    /// <param name="convention">The c2 convention.</param>
    /// <returns>The constants.</returns>
    public static PlanckConstants For(C2Convention convention) => new(
        RadiationConstants.C1,
        convention == C2Convention.Cie15Its90 ? RadiationConstants.C2Cie15 : RadiationConstants.C2,
        1.0);

    /// <summary>CIE colorimetric constants (c2 = 1.4388e-2 m·K).</summary>
    public static PlanckConstants Cie15 => For(C2Convention.Cie15Its90);
}

/// <summary>Radiation constants derived from the exact SI values of h, c and k (CODATA 2018).</summary>
/// <remarks>Methods note planck.md §2.1: deriving the constants in double precision reproduces the
/// CODATA digits (c1 = 3.741 771 852e-16 W·m², c2 = 1.438 776 877e-2 m·K, b = 2.897 771 955e-3 m·K,
/// σ = 5.670 374 419e-8 W·m⁻²·K⁻⁴).</remarks>
public static class RadiationConstants
{
    /// <summary>Planck constant h, J·s (exact).</summary>
    public const double PlanckJouleSeconds = 6.62607015e-34;

    /// <summary>Speed of light in vacuum c, m/s (exact).</summary>
    public const double SpeedOfLightMetresPerSecond = 299792458.0;

    /// <summary>Boltzmann constant k, J/K (exact).</summary>
    public const double BoltzmannJoulesPerKelvin = 1.380649e-23;

    /// <summary>Second radiation constant used by CIE 15 for colorimetry, m·K.</summary>
    public const double C2Cie15 = 1.4388e-2;

    /// <summary>First radiation constant c1 = 2πhc², W·m².</summary>
    public static readonly double C1 = 2 * Math.PI * PlanckJouleSeconds * SpeedOfLightMetresPerSecond * SpeedOfLightMetresPerSecond;

    /// <summary>First radiation constant for spectral radiance c1L = 2hc², W·m²·sr⁻¹.</summary>
    public static readonly double C1L = 2 * PlanckJouleSeconds * SpeedOfLightMetresPerSecond * SpeedOfLightMetresPerSecond;

    /// <summary>Second radiation constant c2 = hc/k, m·K.</summary>
    public static readonly double C2 = PlanckJouleSeconds * SpeedOfLightMetresPerSecond / BoltzmannJoulesPerKelvin;

    /// <summary>Root of x = 5(1 − e^(−x)) (peak of spectral radiance per unit wavelength).</summary>
    public const double WienX5 = 4.965114231744276;

    /// <summary>Wien wavelength displacement constant b = c2/x5, m·K.</summary>
    public static readonly double WienMetreKelvin = C2 / WienX5;

    /// <summary>Stefan–Boltzmann constant σ = 2π⁵k⁴/(15h³c²), W·m⁻²·K⁻⁴.</summary>
    public static readonly double StefanBoltzmann = 2 * Math.Pow(Math.PI, 5) * Math.Pow(BoltzmannJoulesPerKelvin, 4)
        / (15 * Math.Pow(PlanckJouleSeconds, 3) * SpeedOfLightMetresPerSecond * SpeedOfLightMetresPerSecond);
}

/// <summary>Planck's law for a blackbody (Planckian radiator).</summary>
public static class Planck
{
    /// <summary>
    /// Spectral radiance L_e,λ = c1 / (π·n²·λ⁵·(exp(c2/(n·λ·T)) − 1)) in W·sr⁻¹·m⁻² per metre of wavelength.
    /// </summary>
    /// <param name="wavelengthMetres">Wavelength λ in metres (positive).</param>
    /// <param name="temperatureKelvin">Thermodynamic temperature T in K (positive).</param>
    /// <param name="constants">c1, c2 and n.</param>
    /// <returns>Spectral radiance, W·sr⁻¹·m⁻³; 0 where exp overflows (x &gt; 700).</returns>
    /// <exception cref="ArgumentOutOfRangeException">Non-positive wavelength or temperature.</exception>
    /// <remarks>Methods note planck.md §1 (CIE 15:2004 App. E form); uses expm1 for precision at small x.
    /// Check value: L(500 nm, 5500 K) = 2.047 270 19e13 W·sr⁻¹·m⁻³ with c1 = 3.741771e-16, c2 = 1.4388e-2.</remarks>
    public static double SpectralRadiancePerMetre(double wavelengthMetres, double temperatureKelvin, PlanckConstants constants)
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
    /// <param name="constants">c1, c2 and n.</param>
    /// <returns>Spectral radiance per nm of wavelength.</returns>
    public static double SpectralRadianceNm(double wavelengthNm, double temperatureKelvin, PlanckConstants constants) =>
        SpectralRadiancePerMetre(wavelengthNm * 1e-9, temperatureKelvin, constants) * 1e-9;

    /// <summary>Spectral radiant exitance M = π·L in W·m⁻²·nm⁻¹.</summary>
    /// <param name="wavelengthNm">Wavelength in nm.</param>
    /// <param name="temperatureKelvin">Temperature in K.</param>
    /// <param name="constants">c1, c2 and n.</param>
    /// <returns>Spectral exitance per nm.</returns>
    public static double SpectralExitanceNm(double wavelengthNm, double temperatureKelvin, PlanckConstants constants) =>
        Math.PI * SpectralRadianceNm(wavelengthNm, temperatureKelvin, constants);

    /// <summary>exp(x) − 1 without cancellation for small x.</summary>
    /// <param name="x">Argument.</param>
    /// <returns>e^x − 1.</returns>
    public static double Expm1(double x)
    {
        if (Math.Abs(x) < 1e-5) return x + 0.5 * x * x + x * x * x / 6.0;
        return Math.Exp(x) - 1.0;
    }
}

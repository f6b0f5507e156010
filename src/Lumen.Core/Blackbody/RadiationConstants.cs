namespace Lumen.Blackbody;

/// <summary>Radiation constants derived from the exact SI values of h, c and k (CODATA 2018).</summary>
/// <remarks>docs/methods/planck.md §2.1: deriving the constants in double precision reproduces the
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

namespace Lumen.Blackbody;

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

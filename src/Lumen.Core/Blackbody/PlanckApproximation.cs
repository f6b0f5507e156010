namespace Lumen.Blackbody;

/// <summary>Approximations to Planck's law offered for comparison.</summary>
public enum PlanckApproximation
{
    /// <summary>No approximation (Planck's law).</summary>
    None,

    /// <summary>Wien: L ≈ c1L·λ⁻⁵·exp(−c2/(λT)); always slightly low; good when λT ≪ c2.</summary>
    Wien,

    /// <summary>Rayleigh–Jeans: L ≈ c1L·T/(c2·λ⁴); always high; good only when λT ≫ c2.</summary>
    RayleighJeans,
}

namespace Lumen.Blackbody;

/// <summary>Which value of the second radiation constant c2 a Planckian calculation uses.</summary>
public enum C2Convention
{
    /// <summary>c2 = 1.4388 × 10⁻² m·K, the ITS-90 value CIE 15:2004/2018 prescribes for colorimetry (default).</summary>
    Cie15Its90,

    /// <summary>c2 = hc/k = 1.438 776 877… × 10⁻² m·K (CODATA 2018, exact since the 2019 SI).</summary>
    Codata2018,
}

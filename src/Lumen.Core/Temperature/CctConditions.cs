namespace Lumen.Temperature;

/// <summary>Conditions that limit the meaning of a CCT result.</summary>
[Flags]
public enum CctConditions
{
    /// <summary>None: a CCT within 1000–100000 K and |Duv| ≤ 0.05.</summary>
    None = 0,

    /// <summary>|Duv| &gt; 0.05: CIE 15 says CCT is not meaningful so far from the locus.</summary>
    FarFromLocus = 1,

    /// <summary>CCT outside 1000–100000 K, the range Lumen validates.</summary>
    OutsideValidatedRange = 2,

    /// <summary>The nearest locus point is at the end of the tabulated locus (500 K or 10⁶ K): clamped.</summary>
    BeyondLocus = 4,

    /// <summary>The chromaticity is undefined (a black or empty spectrum): no CCT.</summary>
    Undefined = 8,
}

namespace Lumen.Cie;

/// <summary>The CIE standard colorimetric observers.</summary>
public enum Observer
{
    /// <summary>CIE 1931 2° standard colorimetric observer (ISO/CIE 11664-1:2019).</summary>
    Cie1931TwoDegree = 2,

    /// <summary>CIE 1964 10° standard colorimetric observer (ISO/CIE 11664-1:2019).</summary>
    Cie1964TenDegree = 10,
}

namespace Lumen.Graphics;

/// <summary>The chromaticity diagram used for plotting.</summary>
public enum DiagramSpace
{
    /// <summary>CIE 1931 (x, y).</summary>
    Xy,

    /// <summary>CIE 1976 (u′, v′).</summary>
    UPrimeVPrime,
}

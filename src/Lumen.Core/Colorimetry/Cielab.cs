namespace Lumen.Colorimetry;

/// <summary>CIE 1976 L*a*b* (CIE 15:2018 §8.2.1), with the exact constants (6/29)³ and 1/(3(6/29)²).</summary>
/// <remarks>docs/methods/compare.md §2.3.</remarks>
public static class Cielab
{
    private const double Delta = 6.0 / 29;

    /// <summary>CIELAB of a colour relative to a reference white.</summary>
    /// <param name="xyz">The colour, on the same scale as the white.</param>
    /// <param name="white">The reference white (all components positive), e.g. D65 with Y = 100.</param>
    /// <returns>L*, a*, b*.</returns>
    public static Lab FromXyz(Tristimulus xyz, Tristimulus white)
    {
        double fx = F(xyz.X / white.X), fy = F(xyz.Y / white.Y), fz = F(xyz.Z / white.Z);
        return new Lab(116 * fy - 16, 500 * (fx - fy), 200 * (fy - fz));
    }

    private static double F(double t) => t > Delta * Delta * Delta ? Math.Cbrt(t) : t / (3 * Delta * Delta) + 4.0 / 29;
}

namespace Lumen.Colorimetry;

/// <summary>
/// A chromaticity in the CIE 1931 (x, y), CIE 1960 UCS (u, v) and CIE 1976 UCS (u′, v′) diagrams.
/// </summary>
/// <remarks>Formulas of CIE 15:2004 as given in docs/methods/colorimetry.md §2: u = 4X/(X+15Y+3Z),
/// v = 6Y/(X+15Y+3Z), u′ = u, v′ = 1.5·v. A black stimulus (X+Y+Z = 0) has no chromaticity: its
/// components are NaN and <see cref="IsDefined"/> is false, so callers report it instead of printing NaN.</remarks>
public readonly record struct Chromaticity
{
    private Chromaticity(double x, double y, double u, double v)
    {
        SmallX = x; SmallY = y; U = u; V = v;
    }

    /// <summary>CIE 1931 chromaticity coordinate x (small x, named so to tell it from the tristimulus value X); 0–1, NaN when undefined.</summary>
    public double SmallX { get; }

    /// <summary>CIE 1931 chromaticity coordinate y (small y, as opposed to the tristimulus value Y); 0–1, NaN when undefined.</summary>
    public double SmallY { get; }

    /// <summary>CIE 1960 UCS u (equal to u′).</summary>
    public double U { get; }

    /// <summary>CIE 1960 UCS v (two thirds of v′).</summary>
    public double V { get; }

    /// <summary>CIE 1976 UCS u′.</summary>
    public double UPrime => U;

    /// <summary>CIE 1976 UCS v′.</summary>
    public double VPrime => 1.5 * V;

    /// <summary>False for a black stimulus, whose chromaticity is undefined.</summary>
    public bool IsDefined => double.IsFinite(SmallX) && double.IsFinite(SmallY);

    /// <summary>From tristimulus values.</summary>
    /// <param name="t">Tristimulus values on any common scale (their sum may not be zero for a defined result).</param>
    /// <returns>The chromaticity (undefined when X+Y+Z = 0).</returns>
    public static Chromaticity FromXyz(Tristimulus t)
    {
        double s = t.X + t.Y + t.Z;
        double d = t.X + 15 * t.Y + 3 * t.Z;
        if (s == 0 || d == 0) return new Chromaticity(double.NaN, double.NaN, double.NaN, double.NaN);
        return new Chromaticity(t.X / s, t.Y / s, 4 * t.X / d, 6 * t.Y / d);
    }

    /// <summary>From CIE 1931 x, y.</summary>
    /// <param name="x">CIE 1931 x, 0–1.</param>
    /// <param name="y">CIE 1931 y, 0–1.</param>
    /// <returns>The chromaticity.</returns>
    public static Chromaticity FromXy(double x, double y)
    {
        double d = -2 * x + 12 * y + 3;
        return new Chromaticity(x, y, 4 * x / d, 6 * y / d);
    }

    /// <summary>From CIE 1960 u, v.</summary>
    /// <param name="u">CIE 1960 u, 0–0.7.</param>
    /// <param name="v">CIE 1960 v, 0–0.4.</param>
    /// <returns>The chromaticity; x = 3u/(2u − 8v + 4), y = 2v/(2u − 8v + 4).</returns>
    public static Chromaticity FromUv(double u, double v)
    {
        double d = 2 * u - 8 * v + 4;
        return new Chromaticity(3 * u / d, 2 * v / d, u, v);
    }

    /// <summary>From CIE 1976 u′, v′.</summary>
    /// <param name="uPrime">CIE 1976 u′, 0–0.7.</param>
    /// <param name="vPrime">CIE 1976 v′, 0–0.6.</param>
    /// <returns>The chromaticity.</returns>
    public static Chromaticity FromUPrimeVPrime(double uPrime, double vPrime) => FromUv(uPrime, vPrime / 1.5);

    /// <summary>Euclidean distance in the CIE 1976 u′v′ diagram (Δu′v′).</summary>
    /// <param name="other">The other chromaticity.</param>
    /// <returns>Δu′v′.</returns>
    public double DeltaUPrimeVPrime(Chromaticity other)
    {
        double du = UPrime - other.UPrime, dv = VPrime - other.VPrime;
        return Math.Sqrt(du * du + dv * dv);
    }
}

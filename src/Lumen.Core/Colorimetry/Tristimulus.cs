namespace Lumen.Colorimetry;

/// <summary>CIE tristimulus values X, Y, Z (any consistent scale; see the producer for normalisation).</summary>
/// <param name="X">Tristimulus value X (relative, or absolute in the photometric unit when k = K_m).</param>
/// <param name="Y">Tristimulus value Y (100 for a relative source; lx, cd/m², cd or lm when absolute).</param>
/// <param name="Z">Tristimulus value Z, on the same scale as X and Y.</param>
public readonly record struct Tristimulus(double X, double Y, double Z)
{
    /// <summary>The same colour scaled so that Y = <paramref name="y"/>.</summary>
    /// <param name="y">Target Y (e.g. 100).</param>
    /// <returns>Scaled values; NaN components when Y is 0 (callers check <see cref="Y"/> first).</returns>
    public Tristimulus NormalisedToY(double y) => new(X * y / Y, y, Z * y / Y);

    /// <summary>Chromaticity of these values.</summary>
    public Chromaticity Chromaticity => Chromaticity.FromXyz(this);

    /// <summary>Tristimulus values with luminance <paramref name="y"/> at a chromaticity.</summary>
    /// <param name="c">Chromaticity (y must be non-zero).</param>
    /// <param name="y">The tristimulus value Y to scale to (any positive number).</param>
    /// <returns>X = x·Y/y, Z = (1 − x − y)·Y/y (CIE 15).</returns>
    public static Tristimulus FromChromaticity(Chromaticity c, double y) =>
        new(c.SmallX * y / c.SmallY, y, (1 - c.SmallX - c.SmallY) * y / c.SmallY);
}

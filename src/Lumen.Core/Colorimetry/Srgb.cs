namespace Lumen.Colorimetry;

/// <summary>
/// CIE XYZ to sRGB for display: Bradford chromatic adaptation from the scene white to D65, the IEC 61966-2-1
/// matrix and transfer function.
/// </summary>
/// <remarks>Matrices: sRGB (IEC 61966-2-1:1999, common practice, values as widely published) and Bradford
/// (Lam 1985, common practice). For display only: colours are approximations of appearance on a standard
/// sRGB monitor.</remarks>
public static class Srgb
{
    private static readonly double[,] XyzToLinear =
    {
        { 3.2406, -1.5372, -0.4986 },
        { -0.9689, 1.8758, 0.0415 },
        { 0.0557, -0.2040, 1.0570 },
    };

    private static readonly double[,] Bradford =
    {
        { 0.8951, 0.2664, -0.1614 },
        { -0.7502, 1.7135, 0.0367 },
        { 0.0389, -0.0685, 1.0296 },
    };

    private static readonly double[,] BradfordInverse =
    {
        { 0.9869929, -0.1470543, 0.1599627 },
        { 0.4323053, 0.5183603, 0.0492912 },
        { -0.0085287, 0.0400428, 0.9684867 },
    };

    /// <summary>D65 white, Y = 1 (IEC 61966-2-1 uses x = 0.3127, y = 0.3290).</summary>
    public static Tristimulus D65White { get; } = Tristimulus.FromChromaticity(Chromaticity.FromXy(0.3127, 0.3290), 1);

    /// <summary>sRGB transfer function (gamma encoding) of a linear value in [0, 1].</summary>
    /// <param name="linear">Linear-light value, 0–1 (values outside are clipped).</param>
    /// <returns>Encoded value.</returns>
    public static double Encode(double linear) => linear <= 0.0031308 ? 12.92 * linear : 1.055 * Math.Pow(linear, 1 / 2.4) - 0.055;

    /// <summary>Linear sRGB of XYZ already relative to D65 (Y = 1 is white).</summary>
    /// <param name="xyz">XYZ with the display white at Y = 1.</param>
    /// <returns>Linear R, G, B (may be outside [0, 1]).</returns>
    public static (double R, double G, double B) Linear(Tristimulus xyz) =>
        (XyzToLinear[0, 0] * xyz.X + XyzToLinear[0, 1] * xyz.Y + XyzToLinear[0, 2] * xyz.Z,
         XyzToLinear[1, 0] * xyz.X + XyzToLinear[1, 1] * xyz.Y + XyzToLinear[1, 2] * xyz.Z,
         XyzToLinear[2, 0] * xyz.X + XyzToLinear[2, 1] * xyz.Y + XyzToLinear[2, 2] * xyz.Z);

    /// <summary>Bradford adaptation of a colour seen under <paramref name="sourceWhite"/> to D65.</summary>
    /// <param name="xyz">Colour (same scale as the white).</param>
    /// <param name="sourceWhite">The scene white.</param>
    /// <returns>The corresponding colour under D65, scaled so the source white maps to Y = 1.</returns>
    public static Tristimulus AdaptToD65(Tristimulus xyz, Tristimulus sourceWhite)
    {
        var (rs, gs, bs) = Mul(Bradford, sourceWhite);
        var (rd, gd, bd) = Mul(Bradford, D65White);
        var (r, g, b) = Mul(Bradford, xyz);
        double k = 1 / sourceWhite.Y;
        var adapted = new Tristimulus(r * rd / rs, g * gd / gs, b * bd / bs);
        var (x, y, z) = Mul(BradfordInverse, adapted);
        return new Tristimulus(x * k * sourceWhite.Y / sourceWhite.Y, y * k * sourceWhite.Y / sourceWhite.Y, z * k * sourceWhite.Y / sourceWhite.Y);
    }

    /// <summary>8-bit sRGB of a colour (XYZ relative to D65, Y = 1 white), clipped into the gamut.</summary>
    /// <param name="xyz">The colour as CIE XYZ with the white at Y = 1 (D65-adapted).</param>
    /// <returns>The 8-bit colour.</returns>
    public static Rgb8 ToRgb8(Tristimulus xyz)
    {
        var (r, g, b) = Linear(xyz);
        bool clipped = r < -1e-6 || g < -1e-6 || b < -1e-6 || r > 1 + 1e-6 || g > 1 + 1e-6 || b > 1 + 1e-6;
        static byte Q(double v) => (byte)Math.Round(255 * Encode(Math.Clamp(v, 0, 1)));
        return new Rgb8(Q(r), Q(g), Q(b), clipped);
    }

    /// <summary>
    /// The colour of a light itself for a swatch: its chromaticity at full display luminance, scaled down just
    /// enough to fit the gamut (no chromatic adaptation: the patch shows the light as a D65-adapted viewer sees it).
    /// </summary>
    /// <param name="c">Chromaticity of the light.</param>
    /// <returns>The 8-bit colour; <see cref="Rgb8.Clipped"/> when saturated colours had to be clipped.</returns>
    public static Rgb8 LightColor(Chromaticity c)
    {
        var xyz = Tristimulus.FromChromaticity(c, 1);
        var (r, g, b) = Linear(xyz);
        double max = Math.Max(r, Math.Max(g, b));
        return ToRgb8(new Tristimulus(xyz.X / max, xyz.Y / max, xyz.Z / max));
    }

    private static (double, double, double) Mul(double[,] m, Tristimulus t) =>
        (m[0, 0] * t.X + m[0, 1] * t.Y + m[0, 2] * t.Z, m[1, 0] * t.X + m[1, 1] * t.Y + m[1, 2] * t.Z, m[2, 0] * t.X + m[2, 1] * t.Y + m[2, 2] * t.Z);
}

namespace Lumen.Colorimetry;

/// <summary>The CAT16 chromatic adaptation transform (Li et al. 2017), von Kries form with complete adaptation (D = 1).</summary>
/// <remarks>docs/methods/compare.md §2.2: RGB = M16·XYZ, scaled by the ratio of the two whites' RGB, and back with M16⁻¹.</remarks>
public static class Cat16
{
    private static readonly double[,] M =
    {
        { 0.401288, 0.650173, -0.051461 },
        { -0.250268, 1.204414, 0.045854 },
        { -0.002079, 0.048952, 0.953127 },
    };

    private static readonly double[,] Inverse = Invert(M);

    /// <summary>Adapts a colour seen under one white to how it looks under another.</summary>
    /// <param name="xyz">The colour, on the same scale as <paramref name="sourceWhite"/>.</param>
    /// <param name="sourceWhite">The white the colour is seen under (all components positive).</param>
    /// <param name="targetWhite">The white to adapt to.</param>
    /// <returns>The corresponding colour under <paramref name="targetWhite"/>; the source white maps to the target white.</returns>
    public static Tristimulus Adapt(Tristimulus xyz, Tristimulus sourceWhite, Tristimulus targetWhite)
    {
        var (r, g, b) = Mul(M, xyz.X, xyz.Y, xyz.Z);
        var (rs, gs, bs) = Mul(M, sourceWhite.X, sourceWhite.Y, sourceWhite.Z);
        var (rt, gt, bt) = Mul(M, targetWhite.X, targetWhite.Y, targetWhite.Z);
        var (x, y, z) = Mul(Inverse, r * rt / rs, g * gt / gs, b * bt / bs);
        return new Tristimulus(x, y, z);
    }

    private static (double, double, double) Mul(double[,] m, double a, double b, double c) =>
        (m[0, 0] * a + m[0, 1] * b + m[0, 2] * c, m[1, 0] * a + m[1, 1] * b + m[1, 2] * c, m[2, 0] * a + m[2, 1] * b + m[2, 2] * c);

    private static double[,] Invert(double[,] m)
    {
        double det = m[0, 0] * (m[1, 1] * m[2, 2] - m[1, 2] * m[2, 1]) - m[0, 1] * (m[1, 0] * m[2, 2] - m[1, 2] * m[2, 0]) + m[0, 2] * (m[1, 0] * m[2, 1] - m[1, 1] * m[2, 0]);
        var r = new double[3, 3];
        for (int i = 0; i < 3; i++)
            for (int j = 0; j < 3; j++)
            {
                int i1 = (j + 1) % 3, i2 = (j + 2) % 3, j1 = (i + 1) % 3, j2 = (i + 2) % 3;
                r[i, j] = (m[i1, j1] * m[i2, j2] - m[i1, j2] * m[i2, j1]) / det;
            }
        return r;
    }
}

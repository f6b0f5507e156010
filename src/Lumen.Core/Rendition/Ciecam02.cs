namespace Lumen.Rendition;

/// <summary>
/// The CIECAM02 forward model (CIE 159:2004) for a fixed white and viewing conditions, with the per-white
/// terms computed once.
/// </summary>
/// <remarks>Constants and steps as in docs/methods/cie224-tm30.md §4 (confirmed against colour-science).
/// Check: XYZ = (19.01, 20.00, 21.78), white (95.05, 100, 108.88), L_A = 318.31, Y_b = 20, average surround →
/// J = 41.7310911, M = 0.1088421, h = 219.0484326 (colour-science doctest).</remarks>
internal sealed class Ciecam02
{
    private static readonly double[,] Cat02 = { { 0.7328, 0.4296, -0.1624 }, { -0.7036, 1.6975, 0.0061 }, { 0.0030, 0.0136, 0.9834 } };
    private static readonly double[,] Hpe = { { 0.38971, 0.68898, -0.07868 }, { -0.22981, 1.18340, 0.04641 }, { 0.0, 0.0, 1.0 } };
    private static readonly double[,] HpeCat02Inverse = Multiply(Hpe, Invert(Cat02));

    private readonly double _fl, _n, _nbb, _ncb, _z, _c, _nc, _aw;
    private readonly double _chromaFactor, _fl025, _flOver100;
    private readonly double _dr, _dg, _db; // combined adaptation factors per channel

    /// <summary>Prepares the model for a white and viewing conditions.</summary>
    /// <param name="whiteX">X of the adopted white.</param>
    /// <param name="whiteY">Y of the adopted white (typically 100).</param>
    /// <param name="whiteZ">Z of the adopted white.</param>
    /// <param name="conditions">Viewing conditions.</param>
    public Ciecam02(double whiteX, double whiteY, double whiteZ, ViewingConditions conditions)
    {
        ArgumentNullException.ThrowIfNull(conditions);
        double la = conditions.AdaptingLuminance;
        double k = 1 / (5 * la + 1), k4 = k * k * k * k;
        _fl = 0.2 * k4 * (5 * la) + 0.1 * (1 - k4) * (1 - k4) * Math.Cbrt(5 * la);
        _n = conditions.BackgroundY / whiteY;
        _nbb = _ncb = 0.725 * Math.Pow(1 / _n, 0.2);
        _z = 1.48 + Math.Sqrt(_n);
        _c = conditions.C;
        _nc = conditions.Nc;
        double d = conditions.Degree ?? conditions.F * (1 - 1 / 3.6 * Math.Exp((-la - 42) / 92));
        var (rw, gw, bw) = Mul(Cat02, whiteX, whiteY, whiteZ);
        _dr = whiteY * d / rw + 1 - d;
        _dg = whiteY * d / gw + 1 - d;
        _db = whiteY * d / bw + 1 - d;
        _flOver100 = _fl / 100;
        var (ra, ga, ba) = Compressed(whiteX, whiteY, whiteZ);
        _aw = (2 * ra + ga + ba / 20 - 0.305) * _nbb;
        _chromaFactor = Math.Pow(1.64 - Math.Pow(0.29, _n), 0.73);
        _fl025 = Math.Pow(_fl, 0.25);
    }

    /// <summary>The luminance-level adaptation factor F_L.</summary>
    public double FL => _fl;

    /// <summary>Correlates J, C, M, h of a stimulus.</summary>
    /// <param name="x">X (same scale as the white).</param>
    /// <param name="y">Y.</param>
    /// <param name="z">Z.</param>
    /// <returns>The correlates.</returns>
    public Cam02 Forward(double x, double y, double z)
    {
        var (ra, ga, ba) = Compressed(x, y, z);
        double a = ra - 12 * ga / 11 + ba / 11;
        double b = (ra + ga - 2 * ba) / 9;
        double h = Math.Atan2(b, a) * 180 / Math.PI;
        if (h < 0) h += 360;
        double r = Math.Sqrt(a * a + b * b);
        // cos(h + 2 rad) from cos h = a/r, sin h = b/r (no trigonometric call).
        double cosH = r > 0 ? a / r : 1, sinH = r > 0 ? b / r : 0;
        double et = 0.25 * (cosH * Cos2 - sinH * Sin2 + 3.8);
        double achromatic = (2 * ra + ga + ba / 20 - 0.305) * _nbb;
        double j = 100 * Math.Pow(achromatic / _aw, _c * _z);
        double t = 50000.0 / 13 * _nc * _ncb * et * r / (ra + ga + 21 * ba / 20);
        double c = Math.Pow(t, 0.9) * Math.Sqrt(j / 100) * _chromaFactor;
        return new Cam02(j, c, c * _fl025, h);
    }

    /// <summary>
    /// CAM02-UCS J′, a′, b′ and CIECAM02 hue of many stimuli at once (vectorised transcendental steps); the same
    /// numbers as <see cref="Forward"/> followed by <see cref="Cam02.ToUcs"/>, to rounding.
    /// </summary>
    /// <param name="x">X of each stimulus.</param>
    /// <param name="y">Y of each stimulus.</param>
    /// <param name="z">Z of each stimulus.</param>
    /// <param name="jPrime">Output J′.</param>
    /// <param name="aPrime">Output a′.</param>
    /// <param name="bPrime">Output b′.</param>
    /// <param name="hueDegrees">Output hue h in degrees [0, 360), or an empty span to skip it.</param>
    public void ForwardUcs(ReadOnlySpan<double> x, ReadOnlySpan<double> y, ReadOnlySpan<double> z,
        Span<double> jPrime, Span<double> aPrime, Span<double> bPrime, Span<double> hueDegrees)
    {
        int n = x.Length;
        if (y.Length != n || z.Length != n || jPrime.Length < n || aPrime.Length < n || bPrime.Length < n)
            throw new ArgumentException("All spans must hold one value per stimulus.", nameof(x));
        var m = HpeCat02Inverse;
        Span<double> q = n <= 128 ? stackalloc double[3 * n] : new double[3 * n];
        Span<double> t = n <= 128 ? stackalloc double[3 * n] : new double[3 * n];
        for (int i = 0; i < n; i++)
        {
            var (r, g, b) = Mul(Cat02, x[i], y[i], z[i]);
            r *= _dr; g *= _dg; b *= _db;
            q[3 * i] = m[0, 0] * r + m[0, 1] * g + m[0, 2] * b;
            q[3 * i + 1] = m[1, 0] * r + m[1, 1] * g + m[1, 2] * b;
            q[3 * i + 2] = m[2, 0] * r + m[2, 1] * g + m[2, 2] * b;
            t[3 * i] = _flOver100 * Math.Abs(q[3 * i]);
            t[3 * i + 1] = _flOver100 * Math.Abs(q[3 * i + 1]);
            t[3 * i + 2] = _flOver100 * Math.Abs(q[3 * i + 2]);
        }
        PowInPlace(t, 0.42);
        Span<double> ach = n <= 128 ? stackalloc double[n] : new double[n];
        Span<double> tc = n <= 128 ? stackalloc double[n] : new double[n];
        Span<double> av = n <= 128 ? stackalloc double[n] : new double[n];
        Span<double> bv = n <= 128 ? stackalloc double[n] : new double[n];
        for (int i = 0; i < n; i++)
        {
            double ra = Math.Sign(q[3 * i]) * 400 * t[3 * i] / (27.13 + t[3 * i]) + 0.1;
            double ga = Math.Sign(q[3 * i + 1]) * 400 * t[3 * i + 1] / (27.13 + t[3 * i + 1]) + 0.1;
            double ba = Math.Sign(q[3 * i + 2]) * 400 * t[3 * i + 2] / (27.13 + t[3 * i + 2]) + 0.1;
            double a = ra - 12 * ga / 11 + ba / 11;
            double b = (ra + ga - 2 * ba) / 9;
            double rr = Math.Sqrt(a * a + b * b);
            double cosH = rr > 0 ? a / rr : 1, sinH = rr > 0 ? b / rr : 0;
            double et = 0.25 * (cosH * Cos2 - sinH * Sin2 + 3.8);
            ach[i] = (2 * ra + ga + ba / 20 - 0.305) * _nbb / _aw;
            tc[i] = 50000.0 / 13 * _nc * _ncb * et * rr / (ra + ga + 21 * ba / 20);
            av[i] = cosH; bv[i] = sinH;
            if (!hueDegrees.IsEmpty) { double h = Math.Atan2(b, a) * 180 / Math.PI; hueDegrees[i] = h < 0 ? h + 360 : h; }
        }
        PowInPlace(ach, _c * _z); // A/A_w → J/100
        PowInPlace(tc, 0.9);
        for (int i = 0; i < n; i++)
        {
            double j = 100 * ach[i];
            double mColorfulness = tc[i] * Math.Sqrt(ach[i]) * _chromaFactor * _fl025;
            jPrime[i] = 1.7 * j / (1 + 0.007 * j);
            tc[i] = 1 + 0.0228 * mColorfulness;
        }
        System.Numerics.Tensors.TensorPrimitives.Log(tc, tc);
        for (int i = 0; i < n; i++)
        {
            double mp = tc[i] / 0.0228;
            aPrime[i] = mp * av[i];
            bPrime[i] = mp * bv[i];
        }
    }

    /// <summary>x^p for non-negative x as exp(p·ln x), with the vectorised Log and Exp of System.Numerics.Tensors.</summary>
    private static void PowInPlace(Span<double> x, double p)
    {
        System.Numerics.Tensors.TensorPrimitives.Log(x, x);
        System.Numerics.Tensors.TensorPrimitives.Multiply(x, p, x);
        System.Numerics.Tensors.TensorPrimitives.Exp(x, x);
    }

    private (double R, double G, double B) Compressed(double x, double y, double z)
    {
        var (r, g, b) = Mul(Cat02, x, y, z);
        var (rp, gp, bp) = Mul(HpeCat02Inverse, r * _dr, g * _dg, b * _db);
        return (Compress(rp), Compress(gp), Compress(bp));
    }

    private static readonly double Cos2 = Math.Cos(2.0), Sin2 = Math.Sin(2.0);

    private double Compress(double q)
    {
        double t = Math.Pow(_flOver100 * Math.Abs(q), 0.42);
        return Math.Sign(q) * 400 * t / (27.13 + t) + 0.1;
    }

    private static (double, double, double) Mul(double[,] m, double x, double y, double z) =>
        (m[0, 0] * x + m[0, 1] * y + m[0, 2] * z, m[1, 0] * x + m[1, 1] * y + m[1, 2] * z, m[2, 0] * x + m[2, 1] * y + m[2, 2] * z);

    private static double[,] Multiply(double[,] a, double[,] b)
    {
        var r = new double[3, 3];
        for (int i = 0; i < 3; i++)
            for (int j = 0; j < 3; j++)
                for (int k = 0; k < 3; k++) r[i, j] += a[i, k] * b[k, j];
        return r;
    }

    private static double[,] Invert(double[,] m)
    {
        double det = m[0, 0] * (m[1, 1] * m[2, 2] - m[1, 2] * m[2, 1]) - m[0, 1] * (m[1, 0] * m[2, 2] - m[1, 2] * m[2, 0]) + m[0, 2] * (m[1, 0] * m[2, 1] - m[1, 1] * m[2, 0]);
        var r = new double[3, 3];
        r[0, 0] = (m[1, 1] * m[2, 2] - m[1, 2] * m[2, 1]) / det;
        r[0, 1] = (m[0, 2] * m[2, 1] - m[0, 1] * m[2, 2]) / det;
        r[0, 2] = (m[0, 1] * m[1, 2] - m[0, 2] * m[1, 1]) / det;
        r[1, 0] = (m[1, 2] * m[2, 0] - m[1, 0] * m[2, 2]) / det;
        r[1, 1] = (m[0, 0] * m[2, 2] - m[0, 2] * m[2, 0]) / det;
        r[1, 2] = (m[0, 2] * m[1, 0] - m[0, 0] * m[1, 2]) / det;
        r[2, 0] = (m[1, 0] * m[2, 1] - m[1, 1] * m[2, 0]) / det;
        r[2, 1] = (m[0, 1] * m[2, 0] - m[0, 0] * m[2, 1]) / det;
        r[2, 2] = (m[0, 0] * m[1, 1] - m[0, 1] * m[1, 0]) / det;
        return r;
    }
}

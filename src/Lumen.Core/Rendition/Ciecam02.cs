using System.Runtime.CompilerServices;
using System.Runtime.Intrinsics;

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
    private readonly double[] _toCones; // row-major 3×3: XYZ to adapted Hunt–Pointer–Estévez responses

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
        _toCones = new double[9];
        for (int i = 0; i < 3; i++)
            for (int j = 0; j < 3; j++)
                _toCones[3 * i + j] = HpeCat02Inverse[i, 0] * _dr * Cat02[0, j] + HpeCat02Inverse[i, 1] * _dg * Cat02[1, j] + HpeCat02Inverse[i, 2] * _db * Cat02[2, j];
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
        double h = HueAngleDegrees(a, b);
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
        if (y.Length != n || z.Length != n || jPrime.Length < n || aPrime.Length < n || bPrime.Length < n || (!hueDegrees.IsEmpty && hueDegrees.Length < n))
            throw new ArgumentException("All spans must hold one value per stimulus.", nameof(x));
        if (n == 0) return;
        // Eight (AVX-512) or four stimuli per step, with vectorised log and exp; the inputs are copied into buffers padded
        // to a multiple of eight with the last stimulus, whose extra results are not copied out.
        int padded = (n + 7) & ~7;
        const int Buffers = 8;
        Span<double> buffer = padded * Buffers <= 2048 ? stackalloc double[padded * Buffers] : new double[padded * Buffers];
        Span<double> bx = buffer[..padded], by = buffer.Slice(padded, padded), bz = buffer.Slice(2 * padded, padded);
        Span<double> oj = buffer.Slice(3 * padded, padded), oa = buffer.Slice(4 * padded, padded), ob = buffer.Slice(5 * padded, padded);
        Span<double> ha = buffer.Slice(6 * padded, padded), hb = buffer.Slice(7 * padded, padded);
        x.CopyTo(bx); y.CopyTo(by); z.CopyTo(bz);
        bx[n..].Fill(x[n - 1]); by[n..].Fill(y[n - 1]); bz[n..].Fill(z[n - 1]);
        if (Vector512.IsHardwareAccelerated)
            for (int i = 0; i < padded; i += 8) Step512(bx.Slice(i, 8), by.Slice(i, 8), bz.Slice(i, 8), oj.Slice(i, 8), oa.Slice(i, 8), ob.Slice(i, 8), ha.Slice(i, 8), hb.Slice(i, 8));
        else
            for (int i = 0; i < padded; i += 4) Step256(bx.Slice(i, 4), by.Slice(i, 4), bz.Slice(i, 4), oj.Slice(i, 4), oa.Slice(i, 4), ob.Slice(i, 4), ha.Slice(i, 4), hb.Slice(i, 4));
        oj[..n].CopyTo(jPrime); oa[..n].CopyTo(aPrime); ob[..n].CopyTo(bPrime);
        if (hueDegrees.IsEmpty) return;
        for (int i = 0; i < n; i++) hueDegrees[i] = HueAngleDegrees(ha[i], hb[i]);
    }

    /// <summary>The hue angle h in degrees, 0 ≤ h &lt; 360, of the opponent coordinates a, b (or of any a, b scaled alike,
    /// such as CAM02-UCS a′, b′).</summary>
    /// <param name="a">Red–green coordinate.</param>
    /// <param name="b">Yellow–blue coordinate.</param>
    /// <returns>The angle.</returns>
    internal static double HueAngleDegrees(double a, double b)
    {
        double h = Math.Atan2(b, a) * 180 / Math.PI;
        return h < 0 ? h + 360 : h;
    }

    /// <summary>One step of <see cref="ForwardUcs"/> on 8 stimuli (Vector512); the same arithmetic as the other width.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)] // vector code is many times slower unoptimised; tables are built with it at start-up
    private void Step512(ReadOnlySpan<double> x, ReadOnlySpan<double> y, ReadOnlySpan<double> z, Span<double> jPrime, Span<double> aPrime, Span<double> bPrime, Span<double> a, Span<double> b)
    {
        var m = _toCones;
        var vx = Vector512.Create(x); var vy = Vector512.Create(y); var vz = Vector512.Create(z);
        var fl = Vector512.Create(_flOver100);
        var ra = PostAdaptation(Vector512.Create(m[0]) * vx + Vector512.Create(m[1]) * vy + Vector512.Create(m[2]) * vz, fl);
        var ga = PostAdaptation(Vector512.Create(m[3]) * vx + Vector512.Create(m[4]) * vy + Vector512.Create(m[5]) * vz, fl);
        var ba = PostAdaptation(Vector512.Create(m[6]) * vx + Vector512.Create(m[7]) * vy + Vector512.Create(m[8]) * vz, fl);
        var va = ra - ga * (12.0 / 11) + ba * (1.0 / 11);
        var vb = (ra + ga - ba * 2) * (1.0 / 9);
        var rr = Vector512.Sqrt(va * va + vb * vb);
        var positive = Vector512.GreaterThan(rr, Vector512<double>.Zero);
        var cosH = Vector512.ConditionalSelect(positive, va / rr, Vector512<double>.One);
        var sinH = Vector512.ConditionalSelect(positive, vb / rr, Vector512<double>.Zero);
        // e_t = ¼(cos(h + 2) + 3.8) with cos(h + 2) from cos h and sin h (no trigonometric call).
        var et = (cosH * Cos2 - sinH * Sin2 + Vector512.Create(3.8)) * 0.25;
        var ach = (ra * 2 + ga + ba * (1.0 / 20) - Vector512.Create(0.305)) * (_nbb / _aw); // A / A_w
        var t = Vector512.Create(50000.0 / 13 * _nc * _ncb) * et * rr / (ra + ga + ba * (21.0 / 20));
        var logAch = Vector512.Log(ach);
        var j = Vector512.Exp(Vector512.Create(_c * _z) * logAch) * 100; // J = 100·(A/A_w)^(cz)
        // M = t^0.9·√(J/100)·(1.64 − 0.29^n)^0.73·F_L^0.25, with t^0.9·√(J/100) as one exponential.
        var colourfulness = Vector512.Exp(Vector512.Create(0.9) * Vector512.Log(t) + Vector512.Create(0.5 * _c * _z) * logAch) * (_chromaFactor * _fl025);
        var mp = Vector512.Log(Vector512<double>.One + colourfulness * 0.0228) * (1 / 0.0228);
        (j * 1.7 / (Vector512<double>.One + j * 0.007)).CopyTo(jPrime);
        (mp * cosH).CopyTo(aPrime);
        (mp * sinH).CopyTo(bPrime);
        va.CopyTo(a); vb.CopyTo(b);
    }

    /// <summary>The post-adaptation non-linear compression of CIECAM02: sign(q)·400·t/(27.13 + t) + 0.1, t = (F_L|q|/100)^0.42.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)] // vector code is many times slower unoptimised; tables are built with it at start-up
    private static Vector512<double> PostAdaptation(Vector512<double> q, Vector512<double> flOver100)
    {
        var t = Vector512.Exp(Vector512.Create(0.42) * Vector512.Log(flOver100 * Vector512.Abs(q)));
        return Vector512.CopySign(t * 400 / (t + Vector512.Create(27.13)), q) + Vector512.Create(0.1);
    }

    /// <summary>One step of <see cref="ForwardUcs"/> on 4 stimuli (Vector256); the same arithmetic as the other width.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)] // vector code is many times slower unoptimised; tables are built with it at start-up
    private void Step256(ReadOnlySpan<double> x, ReadOnlySpan<double> y, ReadOnlySpan<double> z, Span<double> jPrime, Span<double> aPrime, Span<double> bPrime, Span<double> a, Span<double> b)
    {
        var m = _toCones;
        var vx = Vector256.Create(x); var vy = Vector256.Create(y); var vz = Vector256.Create(z);
        var fl = Vector256.Create(_flOver100);
        var ra = PostAdaptation(Vector256.Create(m[0]) * vx + Vector256.Create(m[1]) * vy + Vector256.Create(m[2]) * vz, fl);
        var ga = PostAdaptation(Vector256.Create(m[3]) * vx + Vector256.Create(m[4]) * vy + Vector256.Create(m[5]) * vz, fl);
        var ba = PostAdaptation(Vector256.Create(m[6]) * vx + Vector256.Create(m[7]) * vy + Vector256.Create(m[8]) * vz, fl);
        var va = ra - ga * (12.0 / 11) + ba * (1.0 / 11);
        var vb = (ra + ga - ba * 2) * (1.0 / 9);
        var rr = Vector256.Sqrt(va * va + vb * vb);
        var positive = Vector256.GreaterThan(rr, Vector256<double>.Zero);
        var cosH = Vector256.ConditionalSelect(positive, va / rr, Vector256<double>.One);
        var sinH = Vector256.ConditionalSelect(positive, vb / rr, Vector256<double>.Zero);
        // e_t = ¼(cos(h + 2) + 3.8) with cos(h + 2) from cos h and sin h (no trigonometric call).
        var et = (cosH * Cos2 - sinH * Sin2 + Vector256.Create(3.8)) * 0.25;
        var ach = (ra * 2 + ga + ba * (1.0 / 20) - Vector256.Create(0.305)) * (_nbb / _aw); // A / A_w
        var t = Vector256.Create(50000.0 / 13 * _nc * _ncb) * et * rr / (ra + ga + ba * (21.0 / 20));
        var logAch = Vector256.Log(ach);
        var j = Vector256.Exp(Vector256.Create(_c * _z) * logAch) * 100; // J = 100·(A/A_w)^(cz)
        // M = t^0.9·√(J/100)·(1.64 − 0.29^n)^0.73·F_L^0.25, with t^0.9·√(J/100) as one exponential.
        var colourfulness = Vector256.Exp(Vector256.Create(0.9) * Vector256.Log(t) + Vector256.Create(0.5 * _c * _z) * logAch) * (_chromaFactor * _fl025);
        var mp = Vector256.Log(Vector256<double>.One + colourfulness * 0.0228) * (1 / 0.0228);
        (j * 1.7 / (Vector256<double>.One + j * 0.007)).CopyTo(jPrime);
        (mp * cosH).CopyTo(aPrime);
        (mp * sinH).CopyTo(bPrime);
        va.CopyTo(a); vb.CopyTo(b);
    }

    /// <summary>The post-adaptation non-linear compression of CIECAM02: sign(q)·400·t/(27.13 + t) + 0.1, t = (F_L|q|/100)^0.42.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)] // vector code is many times slower unoptimised; tables are built with it at start-up
    private static Vector256<double> PostAdaptation(Vector256<double> q, Vector256<double> flOver100)
    {
        var t = Vector256.Exp(Vector256.Create(0.42) * Vector256.Log(flOver100 * Vector256.Abs(q)));
        return Vector256.CopySign(t * 400 / (t + Vector256.Create(27.13)), q) + Vector256.Create(0.1);
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

namespace Lumen.Colorimetry;

/// <summary>The CIEDE2000 colour difference (CIE 142-2001; implementation after Sharma, Wu and Dalal 2005).</summary>
/// <remarks>docs/methods/compare.md §2.4; checked against the 33 pairs of Sharma, Wu and Dalal (2005) Table 1 to 10⁻⁴.</remarks>
public static class Ciede2000
{
    private const double Deg = Math.PI / 180;
    private static readonly double Pow25To7 = Math.Pow(25, 7);

    /// <summary>ΔE00 between two CIELAB colours, with the parametric factors k_L = k_C = k_H = 1 unless given.</summary>
    /// <param name="first">The first colour.</param>
    /// <param name="second">The second colour.</param>
    /// <param name="kL">Lightness weight (1 for reference conditions).</param>
    /// <param name="kC">Chroma weight (1 for reference conditions).</param>
    /// <param name="kH">Hue weight (1 for reference conditions).</param>
    /// <returns>ΔE00 (≥ 0; symmetric in its two colours).</returns>
    public static double Difference(Lab first, Lab second, double kL = 1, double kC = 1, double kH = 1)
    {
        double c1 = Math.Sqrt(first.A * first.A + first.B * first.B), c2 = Math.Sqrt(second.A * second.A + second.B * second.B);
        double cBar7 = Math.Pow((c1 + c2) / 2, 7);
        double g = 0.5 * (1 - Math.Sqrt(cBar7 / (cBar7 + Pow25To7)));
        double a1 = (1 + g) * first.A, a2 = (1 + g) * second.A;
        double cp1 = Math.Sqrt(a1 * a1 + first.B * first.B), cp2 = Math.Sqrt(a2 * a2 + second.B * second.B);
        double h1 = Hue(a1, first.B), h2 = Hue(a2, second.B);

        double dL = second.L - first.L, dC = cp2 - cp1;
        double dh = 0;
        if (cp1 * cp2 != 0)
        {
            dh = h2 - h1;
            if (dh > 180) dh -= 360;
            else if (dh < -180) dh += 360;
        }
        double dH = 2 * Math.Sqrt(cp1 * cp2) * Math.Sin(dh / 2 * Deg);

        double lBar = (first.L + second.L) / 2, cpBar = (cp1 + cp2) / 2;
        double hBar = h1 + h2;
        if (cp1 * cp2 != 0)
        {
            hBar = Math.Abs(h1 - h2) <= 180 ? (h1 + h2) / 2 : (h1 + h2 < 360 ? (h1 + h2 + 360) / 2 : (h1 + h2 - 360) / 2);
        }
        double t = 1 - 0.17 * Math.Cos((hBar - 30) * Deg) + 0.24 * Math.Cos(2 * hBar * Deg) + 0.32 * Math.Cos((3 * hBar + 6) * Deg) - 0.20 * Math.Cos((4 * hBar - 63) * Deg);
        double dTheta = 30 * Math.Exp(-Math.Pow((hBar - 275) / 25, 2));
        double cpBar7 = Math.Pow(cpBar, 7);
        double rc = 2 * Math.Sqrt(cpBar7 / (cpBar7 + Pow25To7));
        double l50 = (lBar - 50) * (lBar - 50);
        double sl = 1 + 0.015 * l50 / Math.Sqrt(20 + l50), sc = 1 + 0.045 * cpBar, sh = 1 + 0.015 * cpBar * t;
        double rt = -Math.Sin(2 * dTheta * Deg) * rc;
        double tl = dL / (kL * sl), tc = dC / (kC * sc), th = dH / (kH * sh);
        return Math.Sqrt(tl * tl + tc * tc + th * th + rt * tc * th);
    }

    private static double Hue(double a, double b)
    {
        if (a == 0 && b == 0) return 0;
        double h = Math.Atan2(b, a) / Deg;
        return h < 0 ? h + 360 : h;
    }
}

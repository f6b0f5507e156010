namespace Lumen.Uncertainty;

/// <summary>Coverage intervals from Monte Carlo draws (JCGM 101:2008 §7.7).</summary>
public static class CoverageInterval
{
    /// <summary>
    /// The probabilistically symmetric coverage interval for probability p from M sorted draws (JCGM 101:2008 §7.7.2):
    /// q = pM if that is an integer, else ⌊pM + ½⌋; r = (M − q)/2 when M − q is even, else (M − q + 1)/2; the interval is
    /// [ỹ₍ᵣ₎, ỹ₍ᵣ₊q₎] in the 1-based order statistics.
    /// </summary>
    /// <param name="sorted">The draws in ascending order.</param>
    /// <param name="p">Coverage probability, e.g. 0.95.</param>
    /// <returns>(low, high); NaN for both without draws.</returns>
    public static (double Low, double High) ProbabilisticallySymmetric(ReadOnlySpan<double> sorted, double p = 0.95)
    {
        int m = sorted.Length;
        if (m == 0) return (double.NaN, double.NaN);
        double pm = p * m;
        long q = Math.Abs(pm - Math.Round(pm)) < 1e-9 ? (long)Math.Round(pm) : (long)Math.Floor(pm + 0.5);
        long r = (m - q) % 2 == 0 ? (m - q) / 2 : (m - q + 1) / 2;
        r = Math.Clamp(r, 1, m);
        long hi = Math.Clamp(r + q, 1, m);
        return (sorted[(int)r - 1], sorted[(int)hi - 1]);
    }
}

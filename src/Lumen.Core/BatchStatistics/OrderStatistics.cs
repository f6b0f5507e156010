namespace Lumen.BatchStatistics;

/// <summary>
/// Order statistics without sorting (issue 16): a batch summary needs medians and percentiles of every unit's values,
/// and sorting 100,000 values for each took a twentieth of a second at the end of every such batch, after the last row.
/// </summary>
/// <remarks>Quickselect (C. A. R. Hoare, "Algorithm 65: Find", CACM 4(7), 1961) with a median-of-three pivot, falling
/// back to a sort of the part left when it has not shrunk fast enough, so no input costs more than a sort. The values are
/// the same as those a sort gives (the k-th smallest is unique as a value), under the order <see cref="Array.Sort(Array)"/>
/// uses; inputs holding NaN are sorted.</remarks>
public static class OrderStatistics
{
    /// <summary>Rearranges <paramref name="values"/> so that the element at <paramref name="k"/> is the one a sort would
    /// put there, none before it larger and none after it smaller; returns it.</summary>
    /// <param name="values">Values, rearranged in place.</param>
    /// <param name="k">Zero-based rank.</param>
    /// <returns>The k-th smallest value.</returns>
    public static double Select(Span<double> values, int k)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(k);
        ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual(k, values.Length);
        if (HasNaN(values)) { values.Sort(); return values[k]; }
        int lo = 0, hi = values.Length - 1, budget = 2 * (System.Numerics.BitOperations.Log2((uint)values.Length) + 1);
        while (hi - lo > 16)
        {
            if (--budget < 0) { values[lo..(hi + 1)].Sort(); return values[k]; }
            // Median of three as the pivot, then Hoare's partition around its value.
            int mid = lo + (hi - lo) / 2;
            if (values[mid] < values[lo]) Swap(values, mid, lo);
            if (values[hi] < values[lo]) Swap(values, hi, lo);
            if (values[hi] < values[mid]) Swap(values, hi, mid);
            double pivot = values[mid];
            int i = lo, j = hi;
            while (i <= j)
            {
                while (values[i] < pivot) i++;
                while (values[j] > pivot) j--;
                if (i <= j) { Swap(values, i, j); i++; j--; }
            }
            // Now values[lo..j] <= pivot <= values[i..hi], and anything between j and i equals the pivot.
            if (k <= j) hi = j;
            else if (k >= i) lo = i;
            else return values[k];
        }
        values[lo..(hi + 1)].Sort();
        return values[k];
    }

    /// <summary>The median (the mean of the two middle values for an even count); NaN when empty.</summary>
    /// <param name="values">Values, rearranged in place.</param>
    /// <returns>The median.</returns>
    public static double Median(Span<double> values)
    {
        int n = values.Length;
        if (n == 0) return double.NaN;
        double upper = Select(values, n / 2);
        if (n % 2 == 1) return upper;
        double lower = HasNaN(values) ? values[n / 2 - 1] : Max(values[..(n / 2)]); // the largest of those before it (sorted when NaN)
        return 0.5 * (lower + upper);
    }

    /// <summary>Linear-interpolated percentile (common practice, "type 7": between ranks ⌊h⌋ and ⌊h⌋ + 1, h = (n − 1)·p).</summary>
    /// <param name="values">Values, rearranged in place.</param>
    /// <param name="p">Fraction in [0, 1].</param>
    /// <returns>The percentile, NaN when empty.</returns>
    public static double Percentile(Span<double> values, double p)
    {
        int n = values.Length;
        if (n == 0) return double.NaN;
        double h = (n - 1) * p;
        int i = (int)Math.Floor(h);
        double low = Select(values, i);
        if (i + 1 >= n) return low;
        double high = HasNaN(values) ? values[i + 1] : Min(values[(i + 1)..]); // the next rank: the smallest of those after it (sorted when NaN)
        return low + (h - i) * (high - low);
    }

    private static bool HasNaN(ReadOnlySpan<double> values)
    {
        foreach (double v in values) if (double.IsNaN(v)) return true;
        return false;
    }

    private static double Max(ReadOnlySpan<double> values)
    {
        double m = values[0];
        foreach (double v in values) if (v > m) m = v;
        return m;
    }

    private static double Min(ReadOnlySpan<double> values)
    {
        double m = values[0];
        foreach (double v in values) if (v < m) m = v;
        return m;
    }

    private static void Swap(Span<double> values, int a, int b) => (values[a], values[b]) = (values[b], values[a]);
}

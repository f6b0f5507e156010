using Lumen.BatchStatistics;

namespace Lumen.Core.Tests;

/// <summary>Medians and percentiles by selection (issue 16) equal those read from a sorted copy, on every kind of input.</summary>
public sealed class OrderStatisticsTests
{
    private static double SortedMedian(double[] values)
    {
        var a = (double[])values.Clone();
        Array.Sort(a);
        int n = a.Length;
        return n % 2 == 1 ? a[n / 2] : 0.5 * (a[n / 2 - 1] + a[n / 2]);
    }

    private static double SortedPercentile(double[] values, double p)
    {
        var a = (double[])values.Clone();
        Array.Sort(a);
        double h = (a.Length - 1) * p;
        int i = (int)Math.Floor(h);
        return i + 1 < a.Length ? a[i] + (h - i) * (a[i + 1] - a[i]) : a[i];
    }

    /// <summary>Inputs of every shape a quickselect can stumble on: random, few distinct values, sorted, reversed, all
    /// equal, organ pipe, sawtooth, and sizes around the point where it switches to sorting.</summary>
    public static TheoryData<string, int> Shapes()
    {
        var data = new TheoryData<string, int>();
        foreach (var shape in new[] { "random", "few", "sorted", "reversed", "equal", "pipe", "saw" })
            foreach (int n in new[] { 1, 2, 3, 16, 17, 18, 100, 1001, 20_000 })
                data.Add(shape, n);
        return data;
    }

    private static double[] Make(string shape, int n, int seed)
    {
        var rng = new Random(seed);
        return Enumerable.Range(0, n).Select(i => shape switch
        {
            "random" => rng.NextDouble() * 10 - 5,
            "few" => rng.Next(3),
            "sorted" => i,
            "reversed" => n - i,
            "equal" => 7.25,
            "pipe" => Math.Min(i, n - i),
            _ => i % 13,
        }).ToArray();
    }

    [Theory]
    [MemberData(nameof(Shapes))]
    public void Selection_equals_sorting(string shape, int n)
    {
        for (int seed = 0; seed < 3; seed++)
        {
            var values = Make(shape, n, seed);
            Assert.Equal(SortedMedian(values), OrderStatistics.Median((double[])values.Clone()));
            foreach (double p in new[] { 0.0, 0.05, 0.5, 0.95, 0.999, 1.0 })
                Assert.Equal(SortedPercentile(values, p), OrderStatistics.Percentile((double[])values.Clone(), p));
            var sorted = (double[])values.Clone();
            Array.Sort(sorted);
            int k = new Random(seed).Next(n);
            var work = (double[])values.Clone();
            Assert.Equal(sorted[k], OrderStatistics.Select(work, k));
            Assert.All(work.Take(k), v => Assert.True(v <= sorted[k]));
            Assert.All(work.Skip(k + 1), v => Assert.True(v >= sorted[k]));
        }
    }

    [Fact]
    public void Known_values_and_edges()
    {
        // Common practice ("type 7" percentile, as spreadsheets compute PERCENTILE): p95 of 1..101 is 96, of 1..4 is 3.85.
        Assert.Equal(96.0, OrderStatistics.Percentile(Enumerable.Range(1, 101).Select(i => (double)i).Reverse().ToArray(), 0.95), 12);
        Assert.Equal(3.85, OrderStatistics.Percentile(new double[] { 4, 1, 3, 2 }, 0.95), 12);
        Assert.Equal(2.5, OrderStatistics.Median(new double[] { 4, 1, 3, 2 }));
        Assert.True(double.IsNaN(OrderStatistics.Median(Span<double>.Empty)));
        Assert.True(double.IsNaN(OrderStatistics.Percentile(Span<double>.Empty, 0.5)));
        // NaN sorts first under Array.Sort; selection follows the same order.
        double[] withNaN = [3, double.NaN, 1, 2];
        Assert.Equal(SortedMedian(withNaN), OrderStatistics.Median((double[])withNaN.Clone()));
        Assert.Throws<ArgumentOutOfRangeException>(() => OrderStatistics.Select(new double[] { 1 }, 1));
    }
}

using Lumen.BatchStatistics;

namespace Lumen.Core.Tests;

/// <summary>The batch's largest Δu′v′ between two units (hull with interior points dropped first, issue 16) equals the
/// brute-force maximum over every pair, bit for bit, on clouds of every shape.</summary>
public sealed class LargestDistanceTests
{
    private static double BruteForce(float[] u, float[] v)
    {
        double best = 0;
        for (int i = 0; i < u.Length; i++)
            for (int j = i + 1; j < u.Length; j++)
            {
                double du = (double)u[i] - u[j], dv = (double)v[i] - v[j];
                best = Math.Max(best, Math.Sqrt(du * du + dv * dv));
            }
        return best;
    }

    [Theory]
    [InlineData("cloud", 2000)]
    [InlineData("square", 2000)]
    [InlineData("circle", 500)]
    [InlineData("line", 300)]
    [InlineData("grid", 400)]
    [InlineData("same", 50)]
    [InlineData("cloud", 2)]
    [InlineData("cloud", 3)]
    [InlineData("diamond", 4)]
    public void Equals_the_largest_distance_over_every_pair(string shape, int n)
    {
        for (int seed = 0; seed < 4; seed++)
        {
            var rng = new Random(seed);
            var u = new float[n];
            var v = new float[n];
            for (int i = 0; i < n; i++)
            {
                double a = rng.NextDouble() * 2 * Math.PI, g = Math.Sqrt(-2 * Math.Log(1 - rng.NextDouble())) * Math.Cos(a);
                (double x, double y) = shape switch
                {
                    "cloud" => (0.25 + 0.002 * g, 0.52 + 0.001 * Math.Sqrt(-2 * Math.Log(1 - rng.NextDouble())) * Math.Sin(a)),
                    "square" => (0.25 + 0.01 * rng.NextDouble(), 0.52 + 0.01 * rng.NextDouble()),
                    "circle" => (0.25 + 0.01 * Math.Cos(a), 0.52 + 0.01 * Math.Sin(a)),
                    "line" => (0.25 + 0.001 * (i % 37), 0.52 + 0.002 * (i % 37)),
                    "grid" => (0.25 + 0.001 * (i % 20), 0.52 + 0.001 * (i / 20)),
                    "diamond" => i switch { 0 => (0.0, 1.0), 1 => (1.0, 0.0), 2 => (2.0, 1.0), _ => (1.0, 2.0) },
                    _ => (0.25, 0.52),
                };
                u[i] = (float)x;
                v[i] = (float)y;
            }
            Assert.Equal(BruteForce(u, v), BatchSummaryBuilder.LargestDistance(u, v));
        }
    }

    [Fact]
    public void Fewer_than_two_points_have_no_spread()
    {
        Assert.Equal(0, BatchSummaryBuilder.LargestDistance([], []));
        Assert.Equal(0, BatchSummaryBuilder.LargestDistance([0.2f], [0.5f]));
    }
}

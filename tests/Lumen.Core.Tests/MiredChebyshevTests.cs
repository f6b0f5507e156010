using Lumen.Rendition;

namespace Lumen.Core.Tests;

/// <summary>
/// The piecewise Chebyshev tables behind the tabulated rendition references (issue 16) fit each piece on its first use:
/// only the pieces a run needs are fitted, each once, a piece that fails its own check is not used, and a value never
/// depends on which temperatures came first. The functions here are smooth test functions of our own; the tables' accuracy
/// on the real reference sums is checked against direct sums in <see cref="BlockedRenditionTests"/>.
/// </summary>
public class MiredChebyshevTests
{
    /// <summary>A smooth positive function of the mired (two values a point), counting its calls.</summary>
    private sealed class Smooth
    {
        private int _calls;
        public int Calls => _calls;

        /// <summary>A kink at this mired (none when NaN): the piece holding it cannot pass its check.</summary>
        public double KinkAt { get; init; } = double.NaN;

        public double[] At(double[] mireds)
        {
            Interlocked.Increment(ref _calls);
            var values = new double[2 * mireds.Length];
            for (int i = 0; i < mireds.Length; i++)
            {
                double m = mireds[i];
                values[2 * i] = Math.Exp(-m / 300) + (double.IsNaN(KinkAt) ? 0 : 0.01 * Math.Abs(m - KinkAt));
                values[2 * i + 1] = 1 + Math.Sin(m / 100) / 3;
            }
            return values;
        }
    }

    private static MiredChebyshev Table(Smooth f) =>
        MiredChebyshev.Build(200, 1000, 2, logarithmic: true, f.At, (t, d) => Math.Abs(t - d) <= 1e-12 * Math.Abs(d), pieces: 8, nodesPerPiece: 16);

    [Fact]
    public void Only_the_pieces_used_are_fitted_each_once()
    {
        var f = new Smooth();
        var table = Table(f);
        Assert.Equal(0, f.Calls); // nothing before the first use
        var v = new double[2];
        Assert.True(table.TryEvaluate(3000, v)); // 333 mired: piece 1 of 200–1000 in eight
        Assert.Equal(2, f.Calls); // its nodes, then its check
        Assert.True(table.TryEvaluate(3100, v)); // the same piece
        Assert.Equal(2, f.Calls);
        Assert.True(table.TryEvaluate(1500, v)); // 667 mired: another piece
        Assert.Equal(4, f.Calls);
        var direct = f.At([1e6 / 1500]);
        Assert.True(Math.Abs(v[0] - direct[0]) <= 1e-12 * direct[0] && Math.Abs(v[1] - direct[1]) <= 1e-12 * direct[1]);
    }

    [Fact]
    public void A_value_does_not_depend_on_the_temperatures_before_it()
    {
        var temperatures = new[] { 1000.0, 1234.5, 2700, 3000, 3333.3, 4100, 4999, 5000 };
        var forward = Table(new Smooth());
        var backward = Table(new Smooth());
        var a = new double[2];
        var b = new double[2];
        var first = temperatures.Select(t => { Assert.True(forward.TryEvaluate(t, a)); return a.ToArray(); }).ToList();
        var second = temperatures.Reverse().Select(t => { Assert.True(backward.TryEvaluate(t, b)); return b.ToArray(); }).Reverse().ToList();
        for (int i = 0; i < temperatures.Length; i++)
            Assert.Equal(first[i].Select(BitConverter.DoubleToInt64Bits), second[i].Select(BitConverter.DoubleToInt64Bits));
    }

    [Fact]
    public void A_piece_that_fails_its_check_is_not_used_and_the_others_are()
    {
        var f = new Smooth { KinkAt = 480 }; // inside piece 2 (400–500 mired)
        var table = Table(f);
        var v = new double[2];
        Assert.False(table.TryEvaluate(1e6 / 450, v)); // the caller computes directly there
        Assert.False(table.TryEvaluate(1e6 / 490, v)); // a failed piece stays failed
        Assert.True(table.TryEvaluate(1e6 / 300, v)); // |m − 480| is smooth away from the kink
        var direct = f.At([300]);
        Assert.True(Math.Abs(v[0] - direct[0]) <= 1e-12 * direct[0]);
        Assert.False(table.TryEvaluate(4999.9 + 1000, v)); // outside the range
    }

    [Fact]
    public void Threads_that_need_one_piece_at_once_fit_it_once()
    {
        var f = new Smooth();
        var table = Table(f);
        Parallel.For(0, 64, new ParallelOptions { MaxDegreeOfParallelism = 8 }, i =>
        {
            var v = new double[2];
            Assert.True(table.TryEvaluate(2900 + i, v)); // all in piece 1
        });
        Assert.Equal(2, f.Calls);
    }
}

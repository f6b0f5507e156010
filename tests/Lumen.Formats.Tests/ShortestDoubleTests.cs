using System.Globalization;

namespace Lumen.Formats.Tests;

/// <summary>
/// The CSV's number formatter (Ryū digits, issue 16) against .NET's round-trip format, the reference (shortest text that
/// reads back as the same double, since .NET Core 3.0): the same characters on doubles of every exponent and kind, and
/// every text reads back (with .NET's correctly rounded parser) as the very double it was written from.
/// </summary>
/// <remarks>
/// .NET 10's own format misses on some powers of two, whose rounding interval is narrower below them: for 2^−958 it
/// writes 4.104536801298376E-289, which reads back as the next double down; Ryū gives 4.1045368012983762E-289, which
/// reads back exactly (5^958 begins 4104536801298376249…). Where .NET's text does not read back, ours must, and may differ.
/// </remarks>
public sealed class ShortestDoubleTests
{
    private static int _netMisses;

    private static void Same(double value)
    {
        Span<char> buffer = stackalloc char[32];
        Assert.True(ShortestDouble.TryFormat(value, buffer, out int n));
        string ours = buffer[..n].ToString(), net = value.ToString("R", CultureInfo.InvariantCulture);
        string where = $"{BitConverter.DoubleToInt64Bits(value):X16}: .NET {net}, ours {ours}";
        Assert.True(BitConverter.DoubleToInt64Bits(double.Parse(ours, CultureInfo.InvariantCulture)) == BitConverter.DoubleToInt64Bits(value), where);
        if (BitConverter.DoubleToInt64Bits(double.Parse(net, CultureInfo.InvariantCulture)) == BitConverter.DoubleToInt64Bits(value))
            Assert.True(net == ours, where);
        else
        {
            Assert.True(BitConverter.DoubleToInt64Bits(value) << 12 == 0, "only powers of two were seen to trip .NET: " + where);
            Interlocked.Increment(ref _netMisses);
        }
    }

    [Fact]
    public void Where_dotnet_does_not_read_back_ours_does()
    {
        double v = Math.ScaleB(1, -958);
        Span<char> buffer = stackalloc char[32];
        Assert.True(ShortestDouble.TryFormat(v, buffer, out int n));
        Assert.Equal("4.1045368012983762E-289", buffer[..n].ToString());
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(1.0)]
    [InlineData(-1.5)]
    [InlineData(0.1)]
    [InlineData(1.0 / 3)]
    [InlineData(100.0)]
    [InlineData(1e15)]
    [InlineData(1e16)]
    [InlineData(99999999999999980.0)]
    [InlineData(1e17)]
    [InlineData(1.2345678901234567e17)]
    [InlineData(1e21)]
    [InlineData(1e22)]
    [InlineData(1e23)]
    [InlineData(0.0001)]
    [InlineData(0.00012345)]
    [InlineData(0.00001)]
    [InlineData(9.9999e-5)]
    [InlineData(1e-7)]
    [InlineData(5e-324)]
    [InlineData(2.2250738585072014e-308)] // smallest normal
    [InlineData(2.2250738585072009e-308)] // largest subnormal
    [InlineData(double.MaxValue)]
    [InlineData(9007199254740993.0)]
    [InlineData(3015.220569239548)] // a CCT from the batch CSV
    [InlineData(0.00031125080453348465)] // a Duv from the batch CSV
    public void Known_values_match_the_round_trip_format(double value) => Same(value);

    [Fact]
    public void Random_doubles_of_every_exponent_match_the_round_trip_format()
    {
        var rng = new Random(20261203);
        Span<byte> bits = stackalloc byte[8];
        for (int i = 0; i < 400_000; i++)
        {
            rng.NextBytes(bits);
            double any = BitConverter.ToDouble(bits);
            if (double.IsFinite(any)) Same(any);
            Same(rng.NextDouble());                                // [0, 1): the chromaticities
            Same(rng.NextDouble() * 10_000);                       // CCTs, indices
            Same(Math.Round(rng.NextDouble() * 1000, rng.Next(6))); // short decimals: ties in Ryū's interval
            Same(rng.Next() * Math.Pow(10, rng.Next(-30, 30)));    // integers scaled by powers of ten
            Same((rng.NextDouble() - 0.5) * 1e-3);                 // signed small values (Duv)
        }
    }

    [Fact]
    public void Powers_of_two_and_ten_and_their_neighbours_match()
    {
        for (int e = -1074; e <= 1023; e++)
        {
            double p = Math.ScaleB(1, e);
            Same(p);
            Same(Math.BitIncrement(p));
            Same(Math.BitDecrement(p));
        }
        for (int e = -323; e <= 308; e++)
        {
            double p = double.Parse($"1e{e}", CultureInfo.InvariantCulture);
            Same(p);
            if (p > 0) { Same(Math.BitIncrement(p)); Same(Math.BitDecrement(p)); }
        }
        for (long k = 1; k < 200_000; k++) Same(k);
    }

    [Fact]
    public void Negative_zero_keeps_its_sign() => Same(-0.0);

    [Fact]
    public void Non_finite_values_are_left_to_the_caller()
    {
        Span<char> buffer = stackalloc char[32];
        Assert.False(ShortestDouble.TryFormat(double.NaN, buffer, out _));
        Assert.False(ShortestDouble.TryFormat(double.PositiveInfinity, buffer, out _));
        Assert.False(ShortestDouble.TryFormat(double.NegativeInfinity, buffer, out _));
    }
}

/// <summary>The robust-z column's text, written from the integer number of thousandths, equals the custom format it
/// replaced (rounded to three decimals, <c>0.###</c>) on every kind of z.</summary>
public sealed class RobustZTextTests
{
    [Fact]
    public void Equals_the_three_decimal_format()
    {
        var rng = new Random(7);
        var inv = CultureInfo.InvariantCulture;
        var values = new List<double> { 0, -0.0, 0.0004, -0.0004, 0.0005, -0.0005, 0.0015, 1.0005, 2.5, -2.5, 3.5, 21.522, 1e11 + 0.123, 999_999_999_999.999, 1e12, 1e15, 1e20, -1e20, 123456.7895 };
        for (int i = 0; i < 200_000; i++)
        {
            values.Add((rng.NextDouble() - 0.5) * 10);
            values.Add((rng.NextDouble() - 0.5) * Math.Pow(10, rng.Next(-6, 16)));
            values.Add(Math.Round((rng.NextDouble() - 0.5) * 100, rng.Next(0, 5)));
        }
        foreach (double z in values)
            Assert.True(Math.Round(z, 3).ToString("0.###", inv) == OutlierColumns.ZText(z), $"{z:R}: {Math.Round(z, 3).ToString("0.###", inv)} vs {OutlierColumns.ZText(z)}");
    }
}

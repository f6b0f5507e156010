using System.Globalization;
using Lumen.Formats;
using Xunit;

namespace Lumen.Formats.Tests;

/// <summary>
/// The exact fast path for plain decimals (issue 16) gives the same double, bit for bit, as .NET's correctly rounded
/// parser (the reference: IEEE 754 round-to-nearest, which double.Parse follows since .NET Core 3.0), and declines
/// everything it does not cover.
/// </summary>
public class PlainDecimalTests
{
    [Theory]
    [InlineData("0")]
    [InlineData("-0")]
    [InlineData("+0.0")]
    [InlineData("1")]
    [InlineData("1.")]
    [InlineData(".5")]
    [InlineData("-.25")]
    [InlineData("007.5")]
    [InlineData("0.0012345")]
    [InlineData("0.1")]
    [InlineData("0.3")]
    [InlineData("123456789012345")]
    [InlineData("1234567.89012345")]
    [InlineData("0.0000000000000000000001")]
    [InlineData("900719925474.099")]
    [InlineData("9007199254740991")] // 2^53 - 1: the largest exact integer (16 digits)
    [InlineData("-0.000000000000000000000")]
    [InlineData("1e5")]
    [InlineData("1E-3")]
    [InlineData("1.234E-03")]
    [InlineData("-6.02e+2")]
    [InlineData("1.e5")]
    [InlineData(".5e1")]
    [InlineData("1e22")]
    [InlineData("1e-22")]
    [InlineData("0.12345678901234")]
    [InlineData("3.00000000")]
    [InlineData("0.0000")]
    public void Plain_decimals_equal_the_general_parser_bit_for_bit(string text)
    {
        Assert.True(PlainDecimal.TryParse(text, out double fast));
        double general = double.Parse(text, NumberStyles.Float, CultureInfo.InvariantCulture);
        Assert.Equal(BitConverter.DoubleToInt64Bits(general), BitConverter.DoubleToInt64Bits(fast));
    }

    [Theory]
    [InlineData("")]
    [InlineData("-")]
    [InlineData(".")]
    [InlineData("1e")]
    [InlineData("1e+")]
    [InlineData("e5")]
    [InlineData("1e5.0")]
    [InlineData("1e00001")] // five exponent digits
    [InlineData("1e23")] // 10^23 is not an exact double
    [InlineData("1.5e-23")] // 15·10^-24: beyond 10^22
    [InlineData("123456789e-30")]
    [InlineData("0.12/45")] // '/' and ':' border the digits
    [InlineData("0.123:5")]
    [InlineData("0.1٢34")] // a digit of another script
    [InlineData("0e-400")]
    [InlineData("9007199254740993")] // 2^53 + 1: its digits are not an exact double
    [InlineData("12345678901234567890")] // 20 digits: beyond 64 bits
    [InlineData("0.00000000000000000000001")] // 23 decimals: beyond 10^22
    [InlineData("1.2.3")]
    [InlineData("1,5")]
    [InlineData(" 1")]
    [InlineData("NaN")]
    [InlineData("∞")]
    [InlineData("--1")]
    public void Anything_else_goes_to_the_general_parser(string text) => Assert.False(PlainDecimal.TryParse(text, out _));

    [Fact]
    public void Random_decimals_of_every_length_scale_and_exponent_equal_the_general_parser()
    {
        var rng = new Random(16);
        int taken = 0;
        for (int n = 0; n < 200_000; n++)
        {
            int digits = rng.Next(1, 18), point = rng.Next(0, digits + 1), zeros = rng.Next(0, 8);
            var chars = new char[digits];
            for (int i = 0; i < digits; i++) chars[i] = (char)('0' + rng.Next(10));
            string body = new string(chars);
            string text = (rng.Next(4) == 0 ? "-" : "") + (point == digits ? body : body[..point] + "." + new string('0', zeros) + body[point..]);
            if (rng.Next(3) == 0) text += (rng.Next(2) == 0 ? "e" : "E") + (rng.Next(3) switch { 0 => "-", 1 => "+", _ => "" }) + rng.Next(0, 40).ToString(CultureInfo.InvariantCulture);
            double general = double.Parse(text, NumberStyles.Float, CultureInfo.InvariantCulture);
            if (!PlainDecimal.TryParse(text, out double fast)) continue;
            taken++;
            Assert.True(BitConverter.DoubleToInt64Bits(general) == BitConverter.DoubleToInt64Bits(fast), $"{text}: {general:R} vs {fast:R}");
        }
        Assert.True(taken > 100_000, $"only {taken} took the fast path");
    }

    /// <summary>The cell reader on UTF-8 bytes (the rows of a batch) against the same on characters, which the tests above
    /// hold to .NET's parser: the same answer, value (bit for bit) and length on random cells followed by random text,
    /// after every byte value, and around the 2^53 limit.</summary>
    [Fact]
    public void Utf8_cells_equal_character_cells_bit_for_bit()
    {
        var rng = new Random(20261203);
        const string alphabet = "01234567890123456789012345678901234567890123456789..-+eE,; x:";
        int taken = 0;
        void Compare(string text)
        {
            bool fromChars = PlainDecimal.TryParseCell(text.AsSpan(), ',', out double a, out int lengthA);
            var bytes = System.Text.Encoding.UTF8.GetBytes(text);
            bool fromBytes = PlainDecimal.TryParseCell<byte>(bytes, (byte)',', out double b, out int lengthB);
            Assert.True(fromChars == fromBytes, text);
            if (!fromChars) return;
            taken++;
            Assert.True(BitConverter.DoubleToInt64Bits(a) == BitConverter.DoubleToInt64Bits(b) && lengthA == lengthB, $"{text}: {a:R}/{lengthA} vs {b:R}/{lengthB}");
        }
        for (int n = 0; n < 300_000; n++)
        {
            var chars = new char[rng.Next(0, 40)];
            for (int i = 0; i < chars.Length; i++) chars[i] = alphabet[rng.Next(alphabet.Length)];
            Compare(new string(chars));
            // A plain decimal of 1–20 digits, then a delimiter and more digits (the row's next cell).
            string digits = string.Concat(Enumerable.Range(0, rng.Next(1, 21)).Select(_ => (char)('0' + rng.Next(10))));
            int point = rng.Next(0, digits.Length + 1);
            Compare((rng.Next(3) == 0 ? "-" : "") + digits[..point] + (rng.Next(2) == 0 ? "." : "") + digits[point..] + ",12345678,9");
        }
        // Every byte value after a digit run of every length up to 11.
        for (int run = 0; run < 12; run++)
            for (int b = 0; b < 256; b++)
            {
                var bytes = System.Text.Encoding.ASCII.GetBytes("0.12345678901"[..Math.Max(0, run)] + "\0" + "7777777777,1");
                bytes[Math.Max(0, run)] = (byte)b;
                string text = b < 0x80 ? System.Text.Encoding.ASCII.GetString(bytes) : System.Text.Encoding.Latin1.GetString(bytes);
                bool fromChars = PlainDecimal.TryParseCell(text.AsSpan(), ',', out double a, out int lengthA);
                bool fromBytes = PlainDecimal.TryParseCell<byte>(bytes, (byte)',', out double v, out int lengthB);
                Assert.True(fromChars == fromBytes && (!fromChars || (a.Equals(v) && lengthA == lengthB)), $"run {run}, byte {b}");
            }
        foreach (var edge in new[] { "9007199254740991", "9007199254740992", "900719925474099.1", "90071992547409910", "0.9007199254740991", "0000000000000000000009007199254740991" })
            Compare(edge + ",1");
        Assert.True(taken > 100_000, $"only {taken} cells parsed");
    }
}

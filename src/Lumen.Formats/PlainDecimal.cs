using System.Globalization;
using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace Lumen.Formats;

/// <summary>The exact fast path for the plain decimals that fill spectral files (issue 16).</summary>
internal static class PlainDecimal
{
    private static readonly double[] PowersOfTen = [1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22];

    /// <summary>Largest integer below which every integer is a double (2^53).</summary>
    private const ulong ExactIntegers = 1UL << 53;

    /// <summary>
    /// The common decimal of spectral files (optional sign, digits, optional point and digits, optional exponent of up to
    /// four digits; no other character) by Clinger's exact fast path (W. D. Clinger, "How to read floating point numbers
    /// accurately", PLDI 1990): when its digits, read as an integer m, are below 2^53 and its value is m·10^p with
    /// |p| ≤ 22, both m and 10^p are exact doubles and one IEEE division or multiplication rounds correctly, so the value
    /// is the very double that <see cref="double.TryParse(ReadOnlySpan{char}, NumberStyles, IFormatProvider?, out double)"/>
    /// gives. Anything else returns false and goes to the general parser.
    /// </summary>
    public static bool TryParse(ReadOnlySpan<char> cell, out double value) =>
        TryParseCell(cell, '\uFFFF', out value, out int length) && length == cell.Length;

    /// <summary>
    /// <see cref="TryParse"/> on the start of <paramref name="text"/> up to the first <paramref name="delimiter"/> (or its
    /// end), in one pass: for a row parser that reads a number and finds the end of its cell together. False when the cell
    /// is anything but a plain decimal running exactly to the delimiter (spaces, quotes, an exponent, a decimal comma…):
    /// the caller then takes the general path for that cell.
    /// </summary>
    /// <typeparam name="TChar">UTF-16 characters (<see cref="char"/>) or UTF-8 bytes (<see cref="byte"/>): the cell is ASCII
    /// either way, and a byte that is not ASCII simply ends it.</typeparam>
    /// <param name="text">The rest of a row, from the first character of a cell.</param>
    /// <param name="delimiter">The cell delimiter.</param>
    /// <param name="value">The number.</param>
    /// <param name="length">Characters of the cell (the delimiter, if any, is at this index).</param>
    public static bool TryParseCell<TChar>(ReadOnlySpan<TChar> text, TChar delimiter, out double value, out int length)
        where TChar : unmanaged, IBinaryInteger<TChar>
    {
        value = 0;
        length = 0;
        int i = 0, n = text.Length;
        bool negative = false;
        if (n > 0 && (At(text, 0) == '-' || At(text, 0) == '+')) { negative = At(text, 0) == '-'; i = 1; }
        ulong mantissa = 0;
        int digitsFrom = i;
        uint c = 0;
        // Below 2^53 before a digit, below 2^57 after it: no overflow; at or above 2^53 it can only grow, so decline.
        while (i < n && (c = At(text, i) - '0') <= 9)
        {
            if (mantissa >= ExactIntegers) return false;
            mantissa = mantissa * 10 + c;
            i++;
        }
        int digits = i - digitsFrom, fraction = 0;
        if (i < n && At(text, i) == '.')
        {
            int from = ++i;
            // UTF-8 (a batch's rows): up to seven fraction digits read at once, eight bytes at a time (DigitRun,
            // DigitsValue), without the loop's mispredicted exit at a varying length. With the whole part below 10^8 the
            // integer stays below 10^15 < 2^53, where the loop's check never fires: the same mantissa, the same refusals.
            if (typeof(TChar) == typeof(byte) && BitConverter.IsLittleEndian && i + 8 <= n && mantissa < 100_000_000)
            {
                ulong bytes = Unsafe.ReadUnaligned<ulong>(ref Unsafe.Add(ref Unsafe.As<TChar, byte>(ref MemoryMarshal.GetReference(text)), i));
                int run = DigitRun(bytes);
                if (run < 8)
                {
                    mantissa = mantissa * IntegerPowersOfTen[run] + DigitsValue(bytes, run);
                    i += run;
                }
            }
            while (i < n && (c = At(text, i) - '0') <= 9)
            {
                if (mantissa >= ExactIntegers) return false;
                mantissa = mantissa * 10 + c;
                i++;
            }
            fraction = i - from;
        }
        if (digits + fraction == 0 || mantissa >= ExactIntegers) return false;
        int power = -fraction;
        if (i < n && (At(text, i) | 0x20) == 'e')
        {
            // An exponent (1.5E-03, as many instruments write): one to four digits, optional sign.
            bool minus = false;
            if (++i < n && (At(text, i) == '-' || At(text, i) == '+')) { minus = At(text, i) == '-'; i++; }
            int from = i, exponent = 0;
            while (i < n && (c = At(text, i) - '0') <= 9 && i - from < 4) { exponent = exponent * 10 + (int)c; i++; }
            if (i == from) return false;
            power += minus ? -exponent : exponent;
        }
        if (i < n && text[i] != delimiter) return false;
        // The integer is exact (below 2^53) and so is the power of ten (at most 10^22): one correctly rounded operation.
        double v;
        if (power < 0) { if (power < -22) return false; v = mantissa / PowersOfTen[-power]; }
        else { if (power > 22) return false; v = mantissa * PowersOfTen[power]; }
        value = negative ? -v : v;
        length = i;
        return true;
    }

    /// <summary>Powers of ten below 10^8, as integers.</summary>
    private static readonly ulong[] IntegerPowersOfTen = [1, 10, 100, 1_000, 10_000, 100_000, 1_000_000, 10_000_000];

    /// <summary>How many of the eight bytes (first byte lowest) are ASCII digits before the first that is not (8: all are).</summary>
    /// <remarks>A byte is a digit when its high nibble is 3 and adding 6 keeps it so. Adding 6 to a byte from 0xFA carries
    /// into the next byte, but such a byte is no digit, so only bytes after the first non-digit can be misjudged.</remarks>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    internal static int DigitRun(ulong bytes)
    {
        const ulong High = 0xF0F0F0F0F0F0F0F0, Threes = 0x3030303030303030, Sixes = 0x0606060606060606, Low7 = 0x7F7F7F7F7F7F7F7F;
        ulong other = ((bytes & High) ^ Threes) | (((bytes + Sixes) & High) ^ Threes); // non-zero bytes: no digit
        ulong flags = (((other & Low7) + Low7) | other) & ~Low7; // the high bit of each non-zero byte
        return BitOperations.TrailingZeroCount(flags) >> 3; // 64 >> 3 = 8 when every byte is a digit
    }

    /// <summary>The integer written by the first <paramref name="count"/> (0–7) of the eight bytes, ASCII digits, first
    /// byte lowest: the digits moved to the high end (zeros before them), then pairs, fours and eights combined by three
    /// multiplications (the eight-digit method of simdjson, D. Lemire and G. Langdale, 2019; common practice since).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    internal static ulong DigitsValue(ulong bytes, int count)
    {
        int shift = 4 * (8 - count); // two shifts: one shift by 64 would be a shift by 0
        ulong x = ((bytes & 0x0F0F0F0F0F0F0F0F) << shift) << shift;
        x = (x * 2561) >> 8; // 10 · 256 + 1: each pair of bytes becomes a two-digit number
        x = ((x & 0x00FF00FF00FF00FF) * 6553601) >> 16; // 100 · 65536 + 1
        return ((x & 0x0000FFFF0000FFFF) * 42949672960001) >> 32; // 10000 · 2^32 + 1
    }

    /// <summary>The code unit at <paramref name="i"/> as a number (an ASCII character has the same value in both).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static uint At<TChar>(ReadOnlySpan<TChar> text, int i) where TChar : unmanaged, IBinaryInteger<TChar> => uint.CreateTruncating(text[i]);
}

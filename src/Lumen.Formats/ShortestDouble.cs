using System.Numerics;
using System.Runtime.CompilerServices;

namespace Lumen.Formats;

/// <summary>
/// The shortest text that reads back as the same double, laid out exactly as .NET's round-trip format
/// (<c>double.ToString("R", CultureInfo.InvariantCulture)</c>) lays it out, for the batch CSV (issue 16: .NET's formatter
/// took about 200 ns a number, 8 % of a batch's CPU and most of its writer thread).
/// </summary>
/// <remarks>
/// The digits come from Ryū (U. Adams, "Ryū: fast float-to-string conversion", PLDI 2018): the shortest decimal in the
/// interval of reals that round to the double, and of those the nearest to it; .NET's formatter gives the same digits
/// (shortest round trip, since .NET Core 3.0), and tests compare the two on millions of doubles of every exponent. The
/// layout: fixed notation when the first digit's power of ten is from −5 (exclusive) to 16, otherwise
/// <c>d.dddE±XX</c> with at least two exponent digits. Non-finite values are left to .NET.
/// </remarks>
internal static class ShortestDouble
{
    private const int MantissaBits = 52, ExponentBits = 11, Bias = 1023;
    private const int Pow5InverseBitCount = 125, Pow5BitCount = 125;

    /// <summary>5^i scaled to 125 bits, i = 0…325 (low, high 64-bit halves).</summary>
    private static readonly (ulong Low, ulong High)[] Pow5Split = Build(326, inverse: false);

    /// <summary>⌊2^(bitlength(5^i) − 1 + 125) / 5^i⌋ + 1, i = 0…341.</summary>
    private static readonly (ulong Low, ulong High)[] Pow5InverseSplit = Build(342, inverse: true);

    private static (ulong, ulong)[] Build(int count, bool inverse)
    {
        var table = new (ulong, ulong)[count];
        var mask = (BigInteger.One << 64) - 1;
        var pow = BigInteger.One;
        for (int i = 0; i < count; i++, pow *= 5) // 5^i by one multiplication each (BigInteger.Pow each time cost ~1 ms at start)
        {
            int length = (int)pow.GetBitLength();
            BigInteger v = inverse
                ? (BigInteger.One << (length - 1 + Pow5InverseBitCount)) / pow + 1
                : length >= Pow5BitCount ? pow >> (length - Pow5BitCount) : pow << (Pow5BitCount - length);
            table[i] = ((ulong)(v & mask), (ulong)(v >> 64));
        }
        return table;
    }

    /// <summary>Writes the shortest round-trip text of a finite double.</summary>
    /// <param name="value">The value.</param>
    /// <param name="output">At least 25 characters.</param>
    /// <param name="written">Characters written.</param>
    /// <returns>False for NaN and infinities (nothing written).</returns>
    public static bool TryFormat(double value, Span<char> output, out int written)
    {
        written = 0;
        ulong bits = BitConverter.DoubleToUInt64Bits(value);
        bool negative = (bits >> 63) != 0;
        ulong mantissa = bits & ((1UL << MantissaBits) - 1);
        uint exponent = (uint)(bits >> MantissaBits) & ((1u << ExponentBits) - 1);
        if (exponent == (1u << ExponentBits) - 1) return false;
        int at = 0;
        if (negative) output[at++] = '-';
        if (exponent == 0 && mantissa == 0)
        {
            output[at++] = '0';
            written = at;
            return true;
        }
        var (digits, e10) = Shortest(mantissa, exponent);
        while (digits % 10 == 0) { digits /= 10; e10++; } // a rounded-up last digit can leave a zero; the layout has none
        // The digits, most significant first.
        Span<char> d = stackalloc char[20];
        int n = 0;
        for (ulong rest = digits; rest > 0;)
        {
            (rest, ulong digit) = Math.DivRem(rest, 10UL);
            d[n++] = (char)('0' + (int)digit);
        }
        d[..n].Reverse();
        int x = e10 + n - 1; // the first digit's power of ten
        if (x > -5 && x < 17)
        {
            if (x >= 0)
            {
                int whole = x + 1;
                for (int i = 0; i < whole; i++) output[at++] = i < n ? d[i] : '0';
                if (n > whole)
                {
                    output[at++] = '.';
                    for (int i = whole; i < n; i++) output[at++] = d[i];
                }
            }
            else
            {
                output[at++] = '0';
                output[at++] = '.';
                for (int i = 0; i < -x - 1; i++) output[at++] = '0';
                for (int i = 0; i < n; i++) output[at++] = d[i];
            }
        }
        else
        {
            output[at++] = d[0];
            if (n > 1)
            {
                output[at++] = '.';
                for (int i = 1; i < n; i++) output[at++] = d[i];
            }
            output[at++] = 'E';
            output[at++] = x < 0 ? '-' : '+';
            int magnitude = Math.Abs(x);
            if (magnitude >= 100) output[at++] = (char)('0' + magnitude / 100);
            output[at++] = (char)('0' + magnitude / 10 % 10);
            output[at++] = (char)('0' + magnitude % 10);
        }
        written = at;
        return true;
    }

    /// <summary>The shortest round-trip text of any double (non-finite values as .NET writes them).</summary>
    /// <param name="value">The value.</param>
    /// <returns>The text.</returns>
    public static string ToText(double value)
    {
        Span<char> buffer = stackalloc char[32];
        return TryFormat(value, buffer, out int n) ? buffer[..n].ToString() : value.ToString("R", System.Globalization.CultureInfo.InvariantCulture);
    }

    /// <summary>Ryū's d2d: the shortest decimal m·10^e in the rounding interval of the double (nearest when several).</summary>
    private static (ulong Digits, int Exponent) Shortest(ulong ieeeMantissa, uint ieeeExponent)
    {
        int e2;
        ulong m2;
        if (ieeeExponent == 0)
        {
            e2 = 1 - Bias - MantissaBits - 2;
            m2 = ieeeMantissa;
        }
        else
        {
            e2 = (int)ieeeExponent - Bias - MantissaBits - 2;
            m2 = (1UL << MantissaBits) | ieeeMantissa;
        }
        bool acceptBounds = (m2 & 1) == 0;
        ulong mv = 4 * m2;
        uint mmShift = ieeeMantissa != 0 || ieeeExponent <= 1 ? 1u : 0u;

        ulong vr, vp, vm;
        int e10;
        bool vmIsTrailingZeros = false, vrIsTrailingZeros = false;
        if (e2 >= 0)
        {
            int q = Log10Pow2(e2) - (e2 > 3 ? 1 : 0);
            e10 = q;
            int k = Pow5InverseBitCount + Pow5Bits(q) - 1;
            int i = -e2 + q + k;
            var mul = Pow5InverseSplit[q];
            vr = MulShift(4 * m2, mul, i);
            vp = MulShift(4 * m2 + 2, mul, i);
            vm = MulShift(4 * m2 - 1 - mmShift, mul, i);
            if (q <= 21)
            {
                if (mv % 5 == 0) vrIsTrailingZeros = MultipleOfPowerOf5(mv, q);
                else if (acceptBounds) vmIsTrailingZeros = MultipleOfPowerOf5(mv - 1 - mmShift, q);
                else vp -= MultipleOfPowerOf5(mv + 2, q) ? 1UL : 0UL;
            }
        }
        else
        {
            int q = Log10Pow5(-e2) - (-e2 > 1 ? 1 : 0);
            e10 = q + e2;
            int i = -e2 - q;
            int k = Pow5Bits(i) - Pow5BitCount;
            int j = q - k;
            var mul = Pow5Split[i];
            vr = MulShift(4 * m2, mul, j);
            vp = MulShift(4 * m2 + 2, mul, j);
            vm = MulShift(4 * m2 - 1 - mmShift, mul, j);
            if (q <= 1)
            {
                vrIsTrailingZeros = true;
                if (acceptBounds) vmIsTrailingZeros = mmShift == 1;
                else --vp;
            }
            else if (q < 63)
            {
                vrIsTrailingZeros = (mv & ((1UL << q) - 1)) == 0;
            }
        }

        int removed = 0;
        uint lastRemovedDigit = 0;
        ulong output;
        if (vmIsTrailingZeros || vrIsTrailingZeros)
        {
            // The general case (rare): exact ties and interval ends that are themselves short decimals.
            void RemoveDigit()
            {
                vrIsTrailingZeros &= lastRemovedDigit == 0;
                lastRemovedDigit = (uint)(vr % 10);
                vr /= 10;
                vp /= 10;
                vm /= 10;
                removed++;
            }
            while (vp / 10 > vm / 10)
            {
                vmIsTrailingZeros &= vm % 10 == 0;
                RemoveDigit();
            }
            if (vmIsTrailingZeros)
                while (vm % 10 == 0) RemoveDigit();
            if (vrIsTrailingZeros && lastRemovedDigit == 5 && vr % 2 == 0) lastRemovedDigit = 4; // round half to even
            output = vr + ((vr == vm && (!acceptBounds || !vmIsTrailingZeros)) || lastRemovedDigit >= 5 ? 1UL : 0UL);
        }
        else
        {
            bool roundUp = false;
            if (vp / 100 > vm / 100)
            {
                roundUp = vr % 100 >= 50;
                vr /= 100;
                vp /= 100;
                vm /= 100;
                removed += 2;
            }
            while (vp / 10 > vm / 10)
            {
                roundUp = vr % 10 >= 5;
                vr /= 10;
                vp /= 10;
                vm /= 10;
                removed++;
            }
            output = vr + (vr == vm || roundUp ? 1UL : 0UL);
        }
        return (output, e10 + removed);
    }

    /// <summary>(m · mul) >> j for a 125-bit multiplier, with 64 &lt; j &lt; 128 (Ryū's mulShift64).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static ulong MulShift(ulong m, (ulong Low, ulong High) mul, int j)
    {
        ulong high0 = Math.BigMul(m, mul.Low, out _);
        ulong high1 = Math.BigMul(m, mul.High, out ulong low1);
        ulong sum = high0 + low1;
        if (sum < high0) high1++; // the carry
        int shift = j - 64;
        return (high1 << (64 - shift)) | (sum >> shift);
    }

    private static int Log10Pow2(int e) => (int)(((uint)e * 78913) >> 18);

    private static int Log10Pow5(int e) => (int)(((uint)e * 732923) >> 20);

    private static int Pow5Bits(int e) => (int)(((uint)e * 1217359) >> 19) + 1;

    private static bool MultipleOfPowerOf5(ulong value, int p)
    {
        int count = 0;
        while (value != 0 && value % 5 == 0)
        {
            value /= 5;
            count++;
        }
        return count >= p;
    }
}

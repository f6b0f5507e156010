using System.Globalization;

namespace Lumen.Formats;

/// <summary>The exact fast path for the plain decimals that fill spectral files (issue 16).</summary>
internal static class PlainDecimal
{
    private static readonly double[] PowersOfTen = [1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22];

    /// <summary>
    /// The common plain decimal (optional sign, digits, optional point and digits, at most 15 significant digits;
    /// no exponent, no other character) by Clinger's exact fast path: an integer below 2^53 divided by an exact power
    /// of ten (≤ 10^22) is one correctly rounded IEEE division, so the value is the very double that
    /// <see cref="double.TryParse(ReadOnlySpan{char}, NumberStyles, IFormatProvider?, out double)"/> gives. Anything
    /// else returns false and goes to the general parser.
    /// </summary>
    public static bool TryParse(ReadOnlySpan<char> cell, out double value)
    {
        value = 0;
        int i = 0;
        bool negative = false;
        if (cell.Length > 0 && (cell[0] == '-' || cell[0] == '+')) { negative = cell[0] == '-'; i = 1; }
        long mantissa = 0;
        int digits = 0, fraction = 0;
        bool point = false, any = false;
        for (; i < cell.Length; i++)
        {
            char c = cell[i];
            if (c >= '0' && c <= '9')
            {
                any = true;
                if (mantissa == 0 && c == '0') { if (point) fraction++; continue; } // leading zeros are not significant
                if (++digits > 15) return false;
                mantissa = mantissa * 10 + (c - '0');
                if (point) fraction++;
            }
            else if (c == '.' && !point) point = true;
            else return false;
        }
        if (!any || fraction > 22) return false;
        value = mantissa / PowersOfTen[fraction];
        if (negative) value = -value;
        return true;
    }
}

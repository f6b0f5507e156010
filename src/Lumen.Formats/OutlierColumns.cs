using System.Globalization;
using System.Text;

namespace Lumen.Formats;

/// <summary>
/// Adds each record's robust z and outlier flag to finished batch results. Both need the whole batch (the median and
/// MAD of every unit's chromaticity), while the rows stream as they are computed; so the rows go to a scratch file first
/// and this pass copies them to the output with the two values added: CSV gains the last two columns
/// <c>robust_z</c> and <c>outlier</c> (<c>yes</c>/<c>no</c>, empty for an error), JSON rows gain
/// <c>"outlier": {"robustZ", "flag"}</c>. Every row of <see cref="BatchResultWriter"/> is one line.
/// </summary>
public static class OutlierColumns
{
    /// <summary>Name of the robust-z column.</summary>
    public const string RobustZ = "robust_z";

    /// <summary>Name of the outlier-flag column.</summary>
    public const string Flag = "outlier";

    /// <summary>
    /// The robust z as written: rounded to three decimals, no trailing zeros (<c>0.###</c>), in ASCII
    /// (<see cref="ZBytes"/>).
    /// </summary>
    /// <param name="z">A finite robust z.</param>
    /// <returns>The text.</returns>
    internal static string ZText(double z)
    {
        Span<byte> bytes = stackalloc byte[ZBytesLength];
        return Encoding.ASCII.GetString(bytes[..ZBytes(z, bytes)]);
    }

    /// <summary>Room <see cref="ZBytes"/> needs.</summary>
    internal const int ZBytesLength = 64;

    /// <summary>
    /// <see cref="ZText"/> as ASCII bytes. Below 10^12 the value rounded to three decimals is the double nearest k/1000
    /// for an integer k, and has at most 15 significant digits, so <c>0.###</c> writes the digits of k with the point
    /// three places from the right and trailing zeros dropped (a minus sign for a negative value, and for a negative
    /// value that rounds to zero, as <c>0.###</c> writes <c>-0</c>): written here from k directly, as it runs once per
    /// row on one thread after the batch. Larger values take the custom format.
    /// </summary>
    /// <param name="z">A finite robust z.</param>
    /// <param name="output">At least <see cref="ZBytesLength"/> bytes.</param>
    /// <returns>Bytes written.</returns>
    internal static int ZBytes(double z, Span<byte> output)
    {
        double rounded = Math.Round(z, 3);
        if (!(Math.Abs(rounded) < 1e12))
            return Encoding.ASCII.GetBytes(rounded.ToString("0.###", CultureInfo.InvariantCulture), output);
        long k = (long)Math.Abs(Math.Round(rounded * 1000)); // rounded·1000 is within far less than ½ of k
        int n = 0;
        if (double.IsNegative(rounded)) output[n++] = (byte)'-';
        long whole = k / 1000;
        int fraction = (int)(k % 1000);
        Span<byte> digits = stackalloc byte[20];
        int d = 0;
        do { digits[d++] = (byte)('0' + (int)(whole % 10)); whole /= 10; } while (whole > 0);
        while (d > 0) output[n++] = digits[--d];
        if (fraction != 0)
        {
            output[n++] = (byte)'.';
            int places = fraction % 100 == 0 ? 1 : fraction % 10 == 0 ? 2 : 3;
            output[n++] = (byte)('0' + fraction / 100);
            if (places > 1) output[n++] = (byte)('0' + fraction / 10 % 10);
            if (places > 2) output[n++] = (byte)('0' + fraction % 10);
        }
        return n;
    }

    /// <summary>
    /// <see cref="Copy(TextReader, TextWriter, bool, Func{long, double}, double)"/> from the rows' UTF-8 bytes (the scratch
    /// file). CSV going to a UTF-8 <see cref="StreamWriter"/> (a file) is copied as bytes: no string per row and no
    /// decoding and re-encoding of 30 MB per 100,000 rows, which ran after the batch, on one thread (issue 16); the
    /// bytes are the same as the text copy's. Anything else goes through the text copy.
    /// </summary>
    /// <param name="rows">The rows as <see cref="BatchResultWriter"/> wrote them, UTF-8 without a byte-order mark.</param>
    /// <param name="output">Destination.</param>
    /// <param name="json">The rows are a JSON array (else CSV).</param>
    /// <param name="robustZ">Robust z by record ordinal (NaN when the record has none).</param>
    /// <param name="threshold">z above which a record is an outlier.</param>
    public static void Copy(Stream rows, TextWriter output, bool json, Func<long, double> robustZ, double threshold)
    {
        ArgumentNullException.ThrowIfNull(rows);
        ArgumentNullException.ThrowIfNull(output);
        ArgumentNullException.ThrowIfNull(robustZ);
        if (json || output is not StreamWriter { Encoding: UTF8Encoding encoding } writer || encoding.GetPreamble().Length > 0)
        {
            using var text = new StreamReader(rows, Encoding.UTF8, false, 1 << 16, leaveOpen: true);
            Copy(text, output, json, robustZ, threshold);
            return;
        }
        writer.Flush();
        var target = writer.BaseStream;
        var lines = LineReader.Open(rows); // owns rows from here; the caller disposes them too
        byte[] newLine = Encoding.UTF8.GetBytes(writer.NewLine);
        var buffer = new byte[1 << 16];
        int used = 0;
        void Put(ReadOnlySpan<byte> bytes)
        {
            if (used + bytes.Length > buffer.Length)
            {
                target.Write(buffer, 0, used);
                used = 0;
                if (bytes.Length > buffer.Length) { target.Write(bytes); return; }
            }
            bytes.CopyTo(buffer.AsSpan(used));
            used += bytes.Length;
        }
        long record = 0;
        bool header = true;
        Span<byte> cell = stackalloc byte[ZBytesLength];
        while (lines.TryReadLineUtf8(out var line))
        {
            Put(line);
            if (header)
            {
                Put(Encoding.UTF8.GetBytes($",{RobustZ},{Flag}"));
                header = false;
            }
            else
            {
                double z = robustZ(record++);
                Put(","u8);
                if (double.IsFinite(z))
                {
                    Put(cell[..ZBytes(z, cell)]);
                    Put(z > threshold ? ",yes"u8 : ",no"u8);
                }
                else Put(","u8);
            }
            Put(newLine);
        }
        target.Write(buffer, 0, used);
    }

    /// <summary>Copies finished results, adding the robust z and the flag of each record.</summary>
    /// <param name="rows">The rows as <see cref="BatchResultWriter"/> wrote them.</param>
    /// <param name="output">Destination.</param>
    /// <param name="json">The rows are a JSON array (else CSV).</param>
    /// <param name="robustZ">Robust z by record ordinal (NaN when the record has none).</param>
    /// <param name="threshold">z above which a record is an outlier.</param>
    public static void Copy(TextReader rows, TextWriter output, bool json, Func<long, double> robustZ, double threshold)
    {
        ArgumentNullException.ThrowIfNull(rows);
        ArgumentNullException.ThrowIfNull(output);
        ArgumentNullException.ThrowIfNull(robustZ);
        var inv = CultureInfo.InvariantCulture;
        long record = 0;
        bool header = !json;
        string? line;
        while ((line = rows.ReadLine()) is not null)
        {
            if (header)
            {
                output.Write(line);
                output.WriteLine($",{RobustZ},{Flag}");
                header = false;
                continue;
            }
            if (json && !line.StartsWith('{'))
            {
                output.WriteLine(line);
                continue;
            }
            double z = robustZ(record++);
            string zText = double.IsFinite(z) ? ZText(z) : "";
            if (!json)
            {
                output.Write(line);
                output.Write(',');
                output.Write(zText);
                output.Write(',');
                output.WriteLine(double.IsFinite(z) ? (z > threshold ? "yes" : "no") : "");
                continue;
            }
            bool comma = line.EndsWith(',');
            var body = comma ? line[..^1] : line;
            output.Write(body[..^1]); // without the closing brace
            output.Write(double.IsFinite(z)
                ? $",\"outlier\":{{\"robustZ\":{zText},\"flag\":{(z > threshold ? "true" : "false")}}}}}"
                : ",\"outlier\":null}");
            output.WriteLine(comma ? "," : "");
        }
    }
}

using System.Globalization;

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
    /// The robust z as written: rounded to three decimals, no trailing zeros (<c>0.###</c>). Below 10^12 the rounded
    /// value has at most 15 significant digits, so its shortest round-trip text is those digits
    /// (<see cref="ShortestDouble"/>, a tenth of the time of the custom format, which ran once per row after the batch).
    /// </summary>
    /// <param name="z">A finite robust z.</param>
    /// <returns>The text.</returns>
    internal static string ZText(double z)
    {
        double rounded = Math.Round(z, 3);
        return Math.Abs(rounded) < 1e12 ? ShortestDouble.ToText(rounded) : rounded.ToString("0.###", CultureInfo.InvariantCulture);
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

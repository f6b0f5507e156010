using System.Globalization;
using Parquet;
using Parquet.Schema;

namespace Lumen.Formats;

/// <summary>
/// Batch results as Apache Parquet: the CSV columns with their types (numbers as nullable doubles, text as strings, the
/// metadata columns kept), then <c>robust_z</c> (double) and <c>outlier</c> (boolean), in row groups of
/// <see cref="RowGroupSize"/> rows written as they come, so memory stays flat. Written with Parquet.Net (MIT).
/// </summary>
public static class ParquetResults
{
    /// <summary>Rows per row group.</summary>
    public const int RowGroupSize = 10_000;

    /// <summary>Converts finished CSV results (as <see cref="BatchResultWriter"/> wrote them) to Parquet.</summary>
    /// <param name="csvRows">The CSV: a header line, then one line per record.</param>
    /// <param name="numeric">For each CSV column, whether it holds numbers.</param>
    /// <param name="output">Destination stream.</param>
    /// <param name="robustZ">Robust z by record ordinal (NaN for none).</param>
    /// <param name="threshold">z above which a record is an outlier.</param>
    /// <param name="metadata">Key-value metadata for the file footer (specification, rule, tool version).</param>
    public static void Write(TextReader csvRows, IReadOnlyList<bool> numeric, Stream output, Func<long, double> robustZ, double threshold, IReadOnlyDictionary<string, string> metadata)
    {
        ArgumentNullException.ThrowIfNull(csvRows);
        ArgumentNullException.ThrowIfNull(numeric);
        ArgumentNullException.ThrowIfNull(output);
        ArgumentNullException.ThrowIfNull(robustZ);
        WriteAsync(csvRows, numeric, output, robustZ, threshold, metadata).GetAwaiter().GetResult();
    }

    private static async Task WriteAsync(TextReader csvRows, IReadOnlyList<bool> numeric, Stream output, Func<long, double> robustZ, double threshold, IReadOnlyDictionary<string, string> metadata)
    {
        var header = Csv.Split(csvRows.ReadLine() ?? "");
        if (header.Length != numeric.Count) throw new InvalidOperationException("The CSV header does not match the column types.");
        var fields = new List<DataField>();
        for (int i = 0; i < header.Length; i++)
            fields.Add(numeric[i] ? new DataField<double?>(header[i]) : new DataField<string>(header[i]));
        var z = new DataField<double?>(OutlierColumns.RobustZ);
        var flag = new DataField<bool?>(OutlierColumns.Flag);
        var schema = new ParquetSchema([.. fields, z, flag]);
        await using var writer = await ParquetWriter.CreateAsync(schema, output);
        writer.CustomMetadata = metadata.ToDictionary(kv => kv.Key, kv => kv.Value);
        var rows = new List<string[]>(RowGroupSize);
        long record = 0;
        string? line;
        while ((line = csvRows.ReadLine()) is not null)
        {
            rows.Add(Csv.Split(line));
            if (rows.Count == RowGroupSize) { await Flush(); rows.Clear(); }
        }
        if (rows.Count > 0 || record == 0) await Flush();

        async Task Flush()
        {
            using var group = writer.CreateRowGroup();
            for (int c = 0; c < fields.Count; c++)
            {
                if (numeric[c])
                {
                    var values = new double?[rows.Count];
                    for (int r = 0; r < rows.Count; r++)
                        values[r] = c < rows[r].Length && rows[r][c].Length > 0 ? double.Parse(rows[r][c], NumberStyles.Float, CultureInfo.InvariantCulture) : null;
                    await group.WriteAsync<double>(fields[c], values);
                }
                else
                {
                    var values = new string[rows.Count];
                    for (int r = 0; r < rows.Count; r++) values[r] = c < rows[r].Length && rows[r][c].Length > 0 ? rows[r][c] : null!;
                    await group.WriteAsync(fields[c], values);
                }
            }
            var zs = new double?[rows.Count];
            var flags = new bool?[rows.Count];
            for (int r = 0; r < rows.Count; r++, record++)
            {
                double v = robustZ(record);
                zs[r] = double.IsFinite(v) ? Math.Round(v, 3) : null;
                flags[r] = double.IsFinite(v) ? v > threshold : null;
            }
            await group.WriteAsync<double>(z, zs);
            await group.WriteAsync<bool>(flag, flags);
        }
    }
}

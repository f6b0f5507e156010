using System.Globalization;
using Lumen.Cli;
using Lumen.Formats;
using Parquet;

namespace Lumen.Cli.Tests;

/// <summary>Batch results as Apache Parquet, read back with the library (issue 15).</summary>
public sealed class ParquetTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), $"lumen-pq-{Guid.NewGuid():N}");
    private static readonly string Lot = Path.Combine(CliTests.RepoRoot, "examples", "batch", "quillfern-dl30-lot-A17.csv");
    private static readonly string Spec = Path.Combine(CliTests.RepoRoot, "examples", "batch", "spec-dl30.json");

    public ParquetTests() => Directory.CreateDirectory(_dir);

    public void Dispose() => Directory.Delete(_dir, true);

    [Fact]
    public async Task Every_value_and_metadata_column_equals_the_csv_and_every_record_is_a_row()
    {
        string csv = Path.Combine(_dir, "r.csv"), pq = Path.Combine(_dir, "r.parquet");
        Assert.Equal(ExitCodes.InputErrors, CliTests.Run("", "batch", Lot, "--spec", Spec, "-o", csv).Code);
        Assert.Equal(ExitCodes.InputErrors, CliTests.Run("", "batch", Lot, "--spec", Spec, "-o", pq).Code);
        var lines = File.ReadAllLines(csv);
        var header = Csv.Split(lines[0]);
        var rows = lines.Skip(1).Select(Csv.Split).ToArray();

        await using var reader = await ParquetReader.CreateAsync(pq);
        Assert.Contains("within 3 steps", reader.CustomMetadata["lumen.spec"], StringComparison.Ordinal);
        var fields = reader.Schema.DataFields;
        Assert.Equal(header, fields.Select(f => f.Name).ToArray());
        long total = 0;
        for (int g = 0; g < reader.RowGroupCount; g++)
        {
            using var group = reader.OpenRowGroupReader(g);
            int n = (int)group.RowCount;
            for (int c = 0; c < fields.Length; c++)
            {
                var f = fields[c];
                if (f.ClrType == typeof(double))
                {
                    var values = new double?[n];
                    await group.ReadAsync<double>(f, values);
                    for (int r = 0; r < n; r++)
                    {
                        string cell = rows[total + r][c];
                        Assert.Equal(cell.Length == 0 ? null : double.Parse(cell, CultureInfo.InvariantCulture), values[r]);
                    }
                }
                else if (f.ClrType == typeof(bool))
                {
                    var values = new bool?[n];
                    await group.ReadAsync<bool>(f, values);
                    for (int r = 0; r < n; r++)
                        Assert.Equal(rows[total + r][c] switch { "yes" => true, "no" => false, _ => (bool?)null }, values[r]);
                }
                else
                {
                    var values = new string?[n];
                    await group.ReadAsync(f, values.AsMemory());
                    for (int r = 0; r < n; r++) Assert.Equal(rows[total + r][c], values[r] ?? "");
                }
            }
            total += n;
        }
        Assert.Equal(240, total); // records read = rows, error rows included
        Assert.Contains("lot", header); // the metadata column, typed as text
        Assert.NotEqual(typeof(double), fields.Single(f => f.Name == "lot").ClrType); // text (read back as characters)
        Assert.Equal(typeof(double), fields.Single(f => f.Name == "cri.r9").ClrType);
    }

    [Fact]
    public void Parquet_to_standard_output_is_refused()
    {
        Assert.Equal(ExitCodes.UsageError, CliTests.Run("", "batch", Lot, "--spec", Spec, "--format", "parquet").Code);
    }
}

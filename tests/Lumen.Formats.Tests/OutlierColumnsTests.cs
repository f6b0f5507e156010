using System.Text;

namespace Lumen.Formats.Tests;

/// <summary>The robust-z copy from the scratch file's bytes (issue 16) writes exactly what the text copy writes.</summary>
public sealed class OutlierColumnsTests
{
    private static readonly Func<long, double> Z = i => (i % 7) switch
    {
        0 => double.NaN,
        1 => -0.0004,
        2 => 3.5 + i * 1e-4,
        3 => 1e13 + i,
        4 => -12.3456,
        5 => double.PositiveInfinity,
        _ => i * 0.123,
    };

    private static string Scratch(string newLine, int rows) =>
        "id,location,lot,cct.kelvin" + newLine + string.Concat(Enumerable.Range(0, rows).Select(i =>
            $"U-{i},\"f.csv:{i + 2}\",Lot ü{i % 3},{3000 + i * 0.25}" + newLine));

    private static byte[] ByText(string scratch, bool json, string newLine)
    {
        var output = new StringWriter { NewLine = newLine };
        OutlierColumns.Copy(new StringReader(scratch), output, json, Z, 3.5);
        return Encoding.UTF8.GetBytes(output.ToString());
    }

    private static byte[] ByBytes(string scratch, bool json, string newLine, Encoding encoding)
    {
        var target = new MemoryStream();
        using (var writer = new StreamWriter(target, encoding, 1 << 16, leaveOpen: true) { NewLine = newLine })
            OutlierColumns.Copy(new MemoryStream(new UTF8Encoding(false).GetBytes(scratch)), writer, json, Z, 3.5);
        return target.ToArray();
    }

    [Theory]
    [InlineData("\n", "\n", 5)]
    [InlineData("\r\n", "\n", 5)]
    [InlineData("\n", "\r\n", 5)]
    [InlineData("\n", "\n", 20_000)] // past the copy's 64 KB buffer
    public void Csv_bytes_equal_the_text_copy(string scratchNewLine, string outputNewLine, int rows)
    {
        string scratch = Scratch(scratchNewLine, rows);
        var expected = ByText(scratch, false, outputNewLine);
        Assert.Equal(expected, ByBytes(scratch, false, outputNewLine, new UTF8Encoding(false)));
        Assert.Contains(",robust_z,outlier" + outputNewLine, Encoding.UTF8.GetString(expected), StringComparison.Ordinal);
    }

    [Fact]
    public void Json_and_writers_with_a_byte_order_mark_take_the_text_copy()
    {
        string json = "[\n{\"id\":\"A\"},\n{\"id\":\"B\"}\n]\n";
        Assert.Equal(ByText(json, true, "\n"), ByBytes(json, true, "\n", new UTF8Encoding(false)));
        string scratch = Scratch("\n", 3);
        var withMark = ByBytes(scratch, false, "\n", new UTF8Encoding(true));
        Assert.Equal([.. Encoding.UTF8.GetPreamble(), .. ByText(scratch, false, "\n")], withMark);
    }
}

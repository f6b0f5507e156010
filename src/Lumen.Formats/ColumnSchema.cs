namespace Lumen.Formats;

/// <summary>
/// An ordered set of columns: the one definition from which a format's CSV header, CSV rows and text table come, so
/// that a header and its rows can never disagree.
/// </summary>
/// <typeparam name="T">The row type.</typeparam>
/// <param name="Columns">The columns, in output order.</param>
public sealed record ColumnSchema<T>(IReadOnlyList<Column<T>> Columns)
{
    /// <summary>Column names, in order.</summary>
    public IReadOnlyList<string> Names => Columns.Select(c => c.Name).ToArray();

    /// <summary>Writes the CSV header line.</summary>
    /// <param name="output">Destination.</param>
    public void WriteCsvHeader(TextWriter output)
    {
        ArgumentNullException.ThrowIfNull(output);
        output.WriteLine(string.Join(',', Columns.Select(c => Csv.Quote(c.Name))));
    }

    /// <summary>Writes one CSV row.</summary>
    /// <param name="output">Destination.</param>
    /// <param name="row">The row.</param>
    public void WriteCsvRow(TextWriter output, T row)
    {
        ArgumentNullException.ThrowIfNull(output);
        for (int i = 0; i < Columns.Count; i++)
        {
            if (i > 0) output.Write(',');
            Columns[i].WriteCsvCell(output, row);
        }
        output.WriteLine();
    }

    /// <summary>
    /// Writes an aligned text table: text columns left-aligned, numbers right-aligned, each column as wide as its widest
    /// cell (text cells cut at <paramref name="maxTextWidth"/> with "…").
    /// </summary>
    /// <param name="output">Destination.</param>
    /// <param name="rows">The rows.</param>
    /// <param name="wholeLine">For a row that is not tabular (an error), the text to print after its first cell; else null.</param>
    /// <param name="suffix">Text appended to a tabular row (e.g. a warning mark); may be null.</param>
    /// <param name="maxTextWidth">Widest text cell, characters.</param>
    public void WriteTable(TextWriter output, IReadOnlyList<T> rows, Func<T, string?>? wholeLine = null, Func<T, string>? suffix = null, int maxTextWidth = 32)
    {
        ArgumentNullException.ThrowIfNull(output);
        ArgumentNullException.ThrowIfNull(rows);
        var cells = rows.Select(r => Columns.Select(c => Fit(c.TableCell(r), c.IsNumeric ? int.MaxValue : maxTextWidth)).ToArray()).ToArray();
        var widths = Columns.Select((c, i) => Math.Max(c.Heading.Length, cells.Length == 0 ? 0 : cells.Max(r => r[i].Length))).ToArray();
        string Line(IEnumerable<string> parts) => string.Join("  ", parts).TrimEnd();
        output.WriteLine(Line(Columns.Select((c, i) => c.IsNumeric ? c.Heading.PadLeft(widths[i]) : c.Heading.PadRight(widths[i]))));
        output.WriteLine(new string('-', widths.Sum() + 2 * (widths.Length - 1)));
        for (int r = 0; r < rows.Count; r++)
        {
            if (wholeLine?.Invoke(rows[r]) is { } whole)
            {
                output.WriteLine(cells[r][0].PadRight(widths[0]) + "  " + whole);
                continue;
            }
            output.WriteLine(Line(Columns.Select((c, i) => c.IsNumeric ? cells[r][i].PadLeft(widths[i]) : cells[r][i].PadRight(widths[i]))) + (suffix?.Invoke(rows[r]) ?? ""));
        }
    }

    private static string Fit(string s, int max) => s.Length <= max ? s : s[..(max - 1)] + "…";
}

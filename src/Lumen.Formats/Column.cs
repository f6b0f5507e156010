using System.Globalization;

namespace Lumen.Formats;

/// <summary>
/// One column of an output schema: its CSV name, its table heading, and how a row gives its cell. Numbers are written
/// round-trip in CSV (the shortest text that reads back as the same double, laid out as .NET's "R" format:
/// <see cref="ShortestDouble"/>) and with <see cref="TextFormat"/> in text tables; a missing or non-finite number is an
/// empty CSV cell and "—" in a table.
/// </summary>
/// <typeparam name="T">The row type.</typeparam>
public sealed class Column<T>
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;
    private readonly Func<T, double?>? _number;
    private readonly Func<T, string?>? _text;

    private Column(string name, string heading, Func<T, double?>? number, Func<T, string?>? text, string textFormat)
    {
        Name = name;
        Heading = heading;
        _number = number;
        _text = text;
        TextFormat = textFormat;
    }

    /// <summary>CSV column name (documented in the README; stable).</summary>
    public string Name { get; }

    /// <summary>Heading in text tables.</summary>
    public string Heading { get; }

    /// <summary>.NET number format for text tables (invariant culture).</summary>
    public string TextFormat { get; }

    /// <summary>True for a numeric column (right-aligned in tables).</summary>
    public bool IsNumeric => _number is not null;

    /// <summary>A numeric column.</summary>
    /// <param name="name">CSV name.</param>
    /// <param name="value">The row's value; null when not computed.</param>
    /// <param name="textFormat">Format in text tables, e.g. <c>0.0000</c>.</param>
    /// <param name="heading">Table heading (default: the CSV name).</param>
    /// <returns>The column.</returns>
    public static Column<T> Number(string name, Func<T, double?> value, string textFormat = "0.####", string? heading = null) =>
        new(name, heading ?? name, value ?? throw new ArgumentNullException(nameof(value)), null, textFormat);

    /// <summary>A text column.</summary>
    /// <param name="name">CSV name.</param>
    /// <param name="value">The row's text; null for an empty cell.</param>
    /// <param name="heading">Table heading (default: the CSV name).</param>
    /// <returns>The column.</returns>
    public static Column<T> Text(string name, Func<T, string?> value, string? heading = null) =>
        new(name, heading ?? name, null, value ?? throw new ArgumentNullException(nameof(value)), "");

    /// <summary>The row's value when the column is numeric and the value finite; else null.</summary>
    /// <param name="row">The row.</param>
    /// <returns>The number, or null.</returns>
    public double? NumberOf(T row) => _number?.Invoke(row) is { } x && double.IsFinite(x) ? x : null;

    /// <summary>The CSV cell (quoted when needed).</summary>
    /// <param name="row">The row.</param>
    /// <returns>The cell text.</returns>
    public string CsvCell(T row)
    {
        if (_number is not null) return NumberOf(row) is { } x ? ShortestDouble.ToText(x) : "";
        return _text!(row) is { } s ? Csv.Quote(s) : "";
    }

    /// <summary>Writes the CSV cell (the same text as <see cref="CsvCell"/>), numbers without an intermediate string.</summary>
    /// <param name="output">Destination.</param>
    /// <param name="row">The row.</param>
    public void WriteCsvCell(TextWriter output, T row)
    {
        ArgumentNullException.ThrowIfNull(output);
        if (_number is null) { output.Write(CsvCell(row)); return; }
        if (NumberOf(row) is not { } x) return;
        Span<char> buffer = stackalloc char[32]; // at most 24 characters for a double
        if (ShortestDouble.TryFormat(x, buffer, out int written)) output.Write(buffer[..written]);
        else output.Write(x.ToString("R", Inv));
    }

    /// <summary>The text-table cell.</summary>
    /// <param name="row">The row.</param>
    /// <returns>The cell text ("—" when missing).</returns>
    public string TableCell(T row)
    {
        if (_number is not null) return NumberOf(row) is { } x ? x.ToString(TextFormat, Inv) : "—";
        return _text!(row) ?? "";
    }
}

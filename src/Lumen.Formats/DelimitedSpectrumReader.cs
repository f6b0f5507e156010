using Lumen.Analysis;
using System.Globalization;
using Lumen.Spectra;

namespace Lumen.Formats;

/// <summary>
/// Reads delimited text as instruments export it: a wavelength column in nm, then one spectrum per column.
/// </summary>
/// <remarks>
/// <list type="bullet">
/// <item>Delimiter: tab, semicolon or comma (detected from the first row, in that order of preference);
/// runs of spaces when none of them occurs.</item>
/// <item>Optional header row (its first cell is not a number); header cells name the spectra. Without a header
/// spectra are named <c>stem#k</c>, k the one-based data column.</item>
/// <item>Lines starting with <c>#</c> are comments; <c># unit: W/m2/nm</c> declares the unit of the values.</item>
/// <item>UTF-8 with or without byte-order mark; CRLF or LF.</item>
/// <item>Decimal comma: with a tab or semicolon delimiter, a comma inside a number is its decimal separator
/// (detected per cell, never taken from the machine's culture).</item>
/// </list>
/// Every problem is a <see cref="ReadDiagnostic"/> naming file, line and column. A bad cell spoils only its own
/// column; a bad wavelength, a ragged row or a descending wavelength spoils every column of the file, and each
/// column then appears as an error record.
/// </remarks>
public static class DelimitedSpectrumReader
{
    /// <summary>Reads a file (or standard input when <paramref name="path"/> is <c>-</c>).</summary>
    /// <param name="path">File path.</param>
    /// <param name="unit">Unit to assume when the file does not declare one; null for relative.</param>
    /// <param name="stdin">Standard input, used for <c>-</c>.</param>
    /// <returns>One record per data column, in file order.</returns>
    public static IReadOnlyList<InputRecord> ReadFile(string path, SpectralUnit? unit = null, TextReader? stdin = null)
    {
        ArgumentNullException.ThrowIfNull(path);
        if (path == "-")
            return Read(stdin ?? Console.In, "-", "stdin", unit);
        if (!File.Exists(path))
            return [FileError(path, 0, 0, "file not found")];
        using var reader = new StreamReader(path, detectEncodingFromByteOrderMarks: true);
        return Read(reader, path, Path.GetFileNameWithoutExtension(path), unit);
    }

    /// <summary>Reads delimited spectra from a reader.</summary>
    /// <param name="reader">The text.</param>
    /// <param name="source">Source label for messages and origins (usually the path).</param>
    /// <param name="stem">Stem for names of spectra without a header.</param>
    /// <param name="unit">Unit to assume when the text does not declare one; null for relative.</param>
    /// <returns>One record per data column, in order; a single error record when the file has no usable data.</returns>
    public static IReadOnlyList<InputRecord> Read(TextReader reader, string source, string stem, SpectralUnit? unit = null)
    {
        ArgumentNullException.ThrowIfNull(reader);
        var declaredUnit = unit;
        char? delimiter = null;
        string[]? header = null;
        int headerLine = 0, columnCount = 0;
        List<double>? wavelengths = null;
        List<double>[]? values = null;
        ReadDiagnostic?[]? columnErrors = null;
        ReadDiagnostic? fileError = null;
        int lineNo = 0, lastLine = 0;
        var preamble = new List<KeyValuePair<string, string>>();
        // Instrument exports: a preamble before the numeric block becomes comments (line numbers kept).
        var all = new List<string>();
        for (string? l; (l = reader.ReadLine()) is not null;) all.Add(l);
        var normalised = InstrumentExport.Normalise(all);
        double factor = 1;
        bool unitFromCells = false;
        foreach (var l in normalised.Lines)
        {
            var line = l;
            lineNo++;
            if (lineNo == 1 && line.Length > 0 && line[0] == '\uFEFF') line = line[1..];
            var trimmed = line.Trim();
            if (trimmed.Length == 0) continue;
            if (trimmed[0] == '#')
            {
                var directive = trimmed.TrimStart('#').Trim();
                if (directive.StartsWith("wavelength unit", StringComparison.OrdinalIgnoreCase) && directive.Contains(':', StringComparison.Ordinal))
                    factor = InstrumentExport.WavelengthFactor(directive[(directive.IndexOf(':', StringComparison.Ordinal) + 1)..]);
                else if (directive.StartsWith("unit", StringComparison.OrdinalIgnoreCase) && directive.Contains(':', StringComparison.Ordinal))
                {
                    var text = directive[(directive.IndexOf(':', StringComparison.Ordinal) + 1)..].Trim();
                    if (SpectralUnits.TryParse(text, out var u)) declaredUnit ??= u;
                    else fileError ??= new ReadDiagnostic(source, lineNo, 1, $"unknown unit '{text}'; expected relative, W/m2/nm, W/sr/m2/nm, W/sr/nm or W/nm");
                }
                else if (wavelengths is null && Preamble.TryParse(trimmed, out var key, out var value)) preamble.Add(new(key, value));
                continue;
            }
            if (fileError is not null) { lastLine = lineNo; continue; }
            delimiter ??= DetectDelimiter(trimmed);
            var cells = Split(trimmed, delimiter.Value);
            if (wavelengths is null)
            {
                // First non-comment row: header or data?
                if (!InstrumentExport.TryParseWavelength(cells[0], delimiter.Value, 1, out _))
                {
                    header = cells;
                    if (factor == 1) factor = InstrumentExport.WavelengthFactor(cells[0]);
                    headerLine = lineNo;
                    columnCount = cells.Length;
                    if (columnCount < 2)
                    {
                        fileError = new ReadDiagnostic(source, lineNo, 1, "header has one cell; expected a wavelength column and at least one spectrum column (is the delimiter a comma, semicolon or tab?)");
                        continue;
                    }
                    Init(columnCount);
                    continue;
                }
                columnCount = cells.Length;
                if (columnCount < 2)
                {
                    fileError = new ReadDiagnostic(source, lineNo, 2, "row has one cell; expected a wavelength and at least one value");
                    continue;
                }
                Init(columnCount);
            }
            lastLine = lineNo;
            if (cells.Length > columnCount)
            {
                fileError = new ReadDiagnostic(source, lineNo, columnCount + 1, $"ragged row: expected {columnCount} cells, found {cells.Length}");
                continue;
            }
            if (!InstrumentExport.TryParseWavelength(cells[0], delimiter.Value, factor, out double w) || w <= 0)
            {
                fileError = new ReadDiagnostic(source, lineNo, 1, $"'{Shorten(cells[0])}' is not a wavelength; expected a positive number of nm"
                    + (LooksLikeShortRowHeader(header, delimiter.Value)
                        ? $" (read as columns, wavelengths down the first column: the header's other cells are wavelengths, as in a row-layout file, one spectrum per row, which needs at least {RowSpectrumReader.MinimumWavelengths} of them)"
                        : ""));
                continue;
            }
            if (wavelengths!.Count > 0 && w <= wavelengths[^1])
            {
                fileError = new ReadDiagnostic(source, lineNo, 1,
                    w == wavelengths[^1] ? $"duplicate wavelength {w} nm; expected ascending wavelengths"
                                         : $"wavelength {w} nm follows {wavelengths[^1]} nm; expected ascending wavelengths");
                continue;
            }
            wavelengths.Add(w);
            for (int c = 1; c < columnCount; c++)
            {
                if (columnErrors![c] is not null) { values![c].Add(0); continue; }
                if (c >= cells.Length)
                {
                    columnErrors[c] = new ReadDiagnostic(source, lineNo, c + 1, $"ragged row: missing value; expected {columnCount} cells, found {cells.Length}");
                    values![c].Add(0);
                    continue;
                }
                if (InstrumentExport.TryParseValue(cells[c], delimiter.Value, out double v, out var cellUnit) && cellUnit is { } cu)
                {
                    // A value that names its unit: it must agree with the file's (and sets it when none was declared).
                    if (declaredUnit is null || (unitFromCells && declaredUnit == cu)) { declaredUnit = cu; unitFromCells = true; }
                    else if (declaredUnit != cu)
                    {
                        columnErrors[c] = new ReadDiagnostic(source, lineNo, c + 1, $"the cell's unit {SpectralUnits.Symbol(cu)} differs from the file's unit {SpectralUnits.Symbol(declaredUnit.Value)}");
                        v = 0;
                    }
                }
                else if (!InstrumentExport.TryParseValue(cells[c], delimiter.Value, out v, out _))
                {
                    columnErrors[c] = new ReadDiagnostic(source, lineNo, c + 1,
                        cells[c].Length == 0 ? "empty cell; expected a number" : $"'{Shorten(cells[c])}' is not a number; expected a finite decimal number");
                    v = 0;
                }
                values![c].Add(v);
            }
        }

        if (wavelengths is null && header is null && fileError is null)
            return [FileError(source, Math.Max(1, lineNo), 1, lineNo == 0 ? "empty file; expected a header row or rows of wavelength and values" : "no data rows; expected rows of wavelength and values")];
        if (fileError is null && (wavelengths is null || wavelengths.Count == 0))
            fileError = new ReadDiagnostic(source, headerLine + 1, 1, "header only; expected rows of wavelength and values after it");
        if (columnCount < 2)
            return [FileError(source, fileError!.Line, fileError.Column, fileError.Message)];

        var records = new List<InputRecord>(columnCount - 1);
        var finalUnit = declaredUnit ?? SpectralUnit.Relative;
        var metadata = preamble.Count == 0 ? [] : Preamble.Merge(preamble);
        for (int c = 1; c < columnCount; c++)
        {
            string name = header is not null && c < header.Length && header[c].Length > 0 ? header[c] : $"{stem}#{c}";
            var error = fileError ?? columnErrors![c];
            if (error is not null)
            {
                records.Add(new ErrorRecord(source, c + 1, name, error) { Metadata = metadata });
                continue;
            }
            try
            {
                var s = new Spectrum(wavelengths!.ToArray(), values![c].ToArray(), finalUnit, name, new SpectrumOrigin(source, c + 1) { Layout = "column layout (wavelengths down the first column, one spectrum per column)" + (InstrumentExport.Describe(normalised, factor) is { } how ? "; " + how : "") });
                records.Add(new SpectrumRecord(source, c + 1, name, s) { Metadata = metadata });
            }
            catch (InvalidSpectrumException ex)
            {
                records.Add(new ErrorRecord(source, c + 1, name, new ReadDiagnostic(source, lastLine, c + 1, ex.Message)) { Metadata = metadata });
            }
        }
        return records;

        void Init(int n)
        {
            wavelengths = new List<double>(512);
            values = new List<double>[n];
            for (int i = 0; i < n; i++) values[i] = new List<double>(512);
            columnErrors = new ReadDiagnostic?[n];
        }
    }

    /// <summary>Recognises a <c># unit: …</c> comment.</summary>
    /// <param name="comment">A trimmed line starting with '#'.</param>
    /// <param name="unit">The unit, when recognised.</param>
    /// <param name="error">A message when the directive names no known unit, else null.</param>
    /// <returns>True when the comment is a unit directive.</returns>
    public static bool UnitDirective(string comment, out SpectralUnit unit, out string? error)
    {
        ArgumentNullException.ThrowIfNull(comment);
        unit = SpectralUnit.Relative;
        error = null;
        var directive = comment.TrimStart('#').Trim();
        if (!directive.StartsWith("unit", StringComparison.OrdinalIgnoreCase) || !directive.Contains(':', StringComparison.Ordinal)) return false;
        var text = directive[(directive.IndexOf(':', StringComparison.Ordinal) + 1)..].Trim();
        if (!SpectralUnits.TryParse(text, out unit))
            error = $"unknown unit '{text}'; expected relative, W/m2/nm, W/sr/m2/nm, W/sr/nm or W/nm";
        return true;
    }

    private static ErrorRecord FileError(string source, int line, int column, string message) =>
        new(source, 0, Path.GetFileName(source), new ReadDiagnostic(source, line, column, message));

    /// <summary>A column-layout header whose cells after the first are all wavelength-like numbers: a row-layout header
    /// too short to be recognised as one.</summary>
    private static bool LooksLikeShortRowHeader(string[]? header, char delimiter)
    {
        if (header is null || header.Length < 2) return false;
        for (int i = 1; i < header.Length; i++)
            if (!TryParseNumber(header[i], delimiter, out double w) || !(w > 100 && w < 5000)) return false;
        return true;
    }

    private static string Shorten(string s) => s.Length <= 24 ? s : s[..21] + "...";

    /// <summary>Detects the delimiter of a row: tab, then semicolon, then comma, else runs of spaces.</summary>
    /// <param name="row">A header or data row.</param>
    /// <returns>The delimiter (<c>' '</c> for whitespace).</returns>
    public static char DetectDelimiter(string row)
    {
        ArgumentNullException.ThrowIfNull(row);
        if (row.Contains('\t', StringComparison.Ordinal)) return '\t';
        if (row.Contains(';', StringComparison.Ordinal)) return ';';
        if (row.Contains(',', StringComparison.Ordinal)) return ',';
        return ' ';
    }

    internal static string[] Split(string row, char delimiter)
    {
        var parts = delimiter == ' '
            ? row.Split((char[]?)null, StringSplitOptions.RemoveEmptyEntries)
            : row.Split(delimiter);
        for (int i = 0; i < parts.Length; i++) parts[i] = parts[i].Trim().Trim('"').Trim();
        // A trailing delimiter (common in exports) leaves one empty last cell: drop it.
        if (parts.Length > 2 && parts[^1].Length == 0) Array.Resize(ref parts, parts.Length - 1);
        return parts;
    }

    /// <summary>Parses a number with the invariant culture; with a non-comma delimiter a comma is a decimal comma.</summary>
    /// <param name="cell">Cell text.</param>
    /// <param name="delimiter">The file's delimiter.</param>
    /// <param name="value">The value, when finite.</param>
    /// <returns>True for a finite number (NaN and infinities are rejected).</returns>
    public static bool TryParseNumber(string cell, char delimiter, out double value)
    {
        ArgumentNullException.ThrowIfNull(cell);
        return TryParseNumber(cell.AsSpan(), delimiter, out value);
    }

    /// <summary><see cref="TryParseNumber(string, char, out double)"/> on a span (the row reader's cells).</summary>
    internal static bool TryParseNumber(ReadOnlySpan<char> cell, char delimiter, out double value)
    {
        if (delimiter != ',' && cell.Contains(',') && !cell.Contains('.'))
        {
            Span<char> copy = cell.Length <= 64 ? stackalloc char[64] : new char[cell.Length];
            copy = copy[..cell.Length];
            cell.Replace(copy, ',', '.');
            return ParseDecimal(copy, out value);
        }
        return ParseDecimal(cell, out value);
    }

    private static bool ParseDecimal(ReadOnlySpan<char> text, out double value) =>
        PlainDecimal.TryParse(text, out value) || (double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out value) && double.IsFinite(value));
}

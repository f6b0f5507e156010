using Lumen.Spectra;

namespace Lumen.Formats;

/// <summary>Layout of a delimited spectrum file.</summary>
public enum TableLayout
{
    /// <summary>Wavelengths down the first column, one spectrum per further column.</summary>
    Columns,

    /// <summary>Production-tester layout: first row the wavelengths (after optional ID/metadata columns), one spectrum per row.</summary>
    Rows,
}

/// <summary>Bytes of input consumed so far (for progress and ETA); updated by the reading thread, read by others.</summary>
public sealed class ReadProgress
{
    private long _bytes;

    /// <summary>Bytes consumed from all files so far.</summary>
    public long Bytes => Interlocked.Read(ref _bytes);

    internal void Add(long delta) => Interlocked.Add(ref _bytes, delta);
}

/// <summary>Reads spectrum files in either layout: the one entry point for every command.</summary>
public static class SpectrumFiles
{
    /// <summary>All records of a file (or standard input for <c>-</c>): row layout streamed, column layout per file.</summary>
    /// <param name="path">File path or <c>-</c>.</param>
    /// <param name="unit">Unit when the file declares none.</param>
    /// <param name="stdin">Standard input for <c>-</c>.</param>
    /// <param name="layout">Layout, or null to detect it from the first non-comment row.</param>
    /// <param name="progress">Optional byte counter, advanced as the file is consumed.</param>
    /// <returns>Records in file order.</returns>
    public static IEnumerable<SpectrumRecord> Read(string path, SpectralUnit? unit = null, TextReader? stdin = null, TableLayout? layout = null, ReadProgress? progress = null)
    {
        ArgumentNullException.ThrowIfNull(path);
        if (path == "-")
        {
            // Standard input cannot be read twice: buffer it (interactive use, small).
            var text = (stdin ?? Console.In).ReadToEnd();
            var kind = layout ?? Detect(new StringReader(text));
            return kind == TableLayout.Rows
                ? RowSpectrumReader.Read(new StringReader(text), "-", "stdin", unit)
                : DelimitedSpectrumReader.Read(new StringReader(text), "-", "stdin", unit);
        }
        if (!File.Exists(path)) return [new SpectrumRecord(path, 0, Path.GetFileName(path), null, new ReadDiagnostic(path, 0, 0, "file not found"))];
        TableLayout k;
        using (var probe = new StreamReader(path, detectEncodingFromByteOrderMarks: true)) k = layout ?? Detect(probe);
        return k == TableLayout.Columns ? Counted(DelimitedSpectrumReader.ReadFile(path, unit), new FileInfo(path).Length, progress) : StreamRows(path, unit, progress);
    }

    private static IEnumerable<SpectrumRecord> Counted(IReadOnlyList<SpectrumRecord> records, long bytes, ReadProgress? progress)
    {
        progress?.Add(bytes);
        return records;
    }

    private static IEnumerable<SpectrumRecord> StreamRows(string path, SpectralUnit? unit, ReadProgress? progress)
    {
        using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, 1 << 16);
        using var reader = new StreamReader(stream, System.Text.Encoding.UTF8, detectEncodingFromByteOrderMarks: true, bufferSize: 1 << 16);
        long reported = 0;
        foreach (var r in RowSpectrumReader.Read(reader, path, Path.GetFileNameWithoutExtension(path), unit))
        {
            long position = stream.Position;
            if (position != reported) { progress?.Add(position - reported); reported = position; }
            yield return r;
        }
        progress?.Add(stream.Length - reported);
    }

    /// <summary>Expands inputs: a folder becomes its .csv, .tsv and .txt files (recursively, in ordinal order); a file stays.</summary>
    /// <param name="inputs">Files or folders.</param>
    /// <returns>Files.</returns>
    public static IReadOnlyList<string> Expand(IEnumerable<string> inputs)
    {
        ArgumentNullException.ThrowIfNull(inputs);
        var files = new List<string>();
        foreach (var input in inputs)
        {
            if (Directory.Exists(input))
                files.AddRange(Directory.EnumerateFiles(input, "*", SearchOption.AllDirectories)
                    .Where(f => f.EndsWith(".csv", StringComparison.OrdinalIgnoreCase) || f.EndsWith(".tsv", StringComparison.OrdinalIgnoreCase) || f.EndsWith(".txt", StringComparison.OrdinalIgnoreCase))
                    .OrderBy(f => f, StringComparer.Ordinal));
            else files.Add(input);
        }
        return files;
    }

    /// <summary>Detects the layout from the first non-comment row of a text.</summary>
    /// <param name="reader">The text (consumed up to that row).</param>
    /// <returns>The layout (columns when the text is empty).</returns>
    public static TableLayout Detect(TextReader reader)
    {
        ArgumentNullException.ThrowIfNull(reader);
        string? line;
        while ((line = reader.ReadLine()) is not null)
        {
            var t = line.Trim().TrimStart('\uFEFF');
            if (t.Length == 0 || t[0] == '#') continue;
            return RowSpectrumReader.DetectLayout(t);
        }
        return TableLayout.Columns;
    }
}

/// <summary>
/// Streams the row layout used by production testers: the first row holds optional ID/metadata headers then
/// the wavelengths; each further row is one unit: optional ID/metadata cells, then its values. Memory stays
/// flat: one row is held at a time.
/// </summary>
/// <remarks>Same conventions as <see cref="DelimitedSpectrumReader"/> (delimiters, comments, decimal comma,
/// <c># unit:</c> directive). Every data row becomes exactly one record: a spectrum, or an error naming the line
/// and column. The record's name is its first metadata cell (the ID) or <c>stem:line</c>.</remarks>
public static class RowSpectrumReader
{
    /// <summary>Minimum number of ascending wavelengths that makes a first row a row-layout header.</summary>
    public const int MinimumWavelengths = 10;

    /// <summary>Detects the layout from a file's first non-comment row.</summary>
    /// <param name="firstRow">The row.</param>
    /// <returns>Rows when the row ends in at least 10 strictly ascending numbers between 100 and 5000 nm; otherwise columns.</returns>
    public static TableLayout DetectLayout(string firstRow)
    {
        ArgumentNullException.ThrowIfNull(firstRow);
        char d = DelimitedSpectrumReader.DetectDelimiter(firstRow);
        var cells = Cells(firstRow, d);
        return WavelengthStart(cells, d) >= 0 ? TableLayout.Rows : TableLayout.Columns;
    }

    /// <summary>Index of the first wavelength cell of a row-layout header, or -1.</summary>
    private static int WavelengthStart(string[] cells, char d)
    {
        int k = cells.Length;
        double next = double.PositiveInfinity;
        while (k > 0 && DelimitedSpectrumReader.TryParseNumber(cells[k - 1], d, out double w) && w > 100 && w < 5000 && w < next)
        {
            next = w;
            k--;
        }
        return cells.Length - k >= MinimumWavelengths ? k : -1;
    }

    private static string[] Cells(string row, char d)
    {
        var parts = d == ' ' ? row.Split((char[]?)null, StringSplitOptions.RemoveEmptyEntries) : row.Split(d);
        for (int i = 0; i < parts.Length; i++) parts[i] = parts[i].Trim().Trim('"').Trim();
        if (parts.Length > 2 && parts[^1].Length == 0) Array.Resize(ref parts, parts.Length - 1);
        return parts;
    }

    /// <summary>Streams the records of a row-layout text.</summary>
    /// <param name="reader">The text.</param>
    /// <param name="source">Source label.</param>
    /// <param name="stem">Stem for names of rows without an ID.</param>
    /// <param name="unit">Unit when the text declares none; null for relative.</param>
    /// <returns>Records in file order.</returns>
    public static IEnumerable<SpectrumRecord> Read(TextReader reader, string source, string stem, SpectralUnit? unit = null)
    {
        ArgumentNullException.ThrowIfNull(reader);
        SpectralUnit? declared = unit;
        double[]? wavelengths = null;
        int idColumns = 0, expectedCells = 0;
        char d = ',';
        string? line;
        int lineNo = 0;
        while ((line = reader.ReadLine()) is not null)
        {
            lineNo++;
            if (lineNo == 1 && line.Length > 0 && line[0] == '\uFEFF') line = line[1..];
            var t = line.Trim();
            if (t.Length == 0) continue;
            if (t[0] == '#')
            {
                if (DelimitedSpectrumReader.UnitDirective(t, out var u, out var bad))
                {
                    if (bad is not null)
                    {
                        yield return new SpectrumRecord(source, 0, Path.GetFileName(source), null, new ReadDiagnostic(source, lineNo, 1, bad));
                        yield break;
                    }
                    declared ??= u;
                }
                continue;
            }
            if (wavelengths is null)
            {
                d = DelimitedSpectrumReader.DetectDelimiter(t);
                var header = Cells(t, d);
                idColumns = WavelengthStart(header, d);
                if (idColumns < 0)
                {
                    yield return new SpectrumRecord(source, 0, Path.GetFileName(source), null,
                        new ReadDiagnostic(source, lineNo, 1, $"first row is not a wavelength header; expected optional ID columns then at least {MinimumWavelengths} ascending wavelengths in nm"));
                    yield break;
                }
                expectedCells = header.Length;
                wavelengths = new double[header.Length - idColumns];
                for (int i = 0; i < wavelengths.Length; i++) DelimitedSpectrumReader.TryParseNumber(header[idColumns + i], d, out wavelengths[i]);
                continue;
            }
            yield return ParseRow(t, lineNo);
        }
        if (wavelengths is null)
            yield return new SpectrumRecord(source, 0, Path.GetFileName(source), null, new ReadDiagnostic(source, Math.Max(1, lineNo), 1, "empty file; expected a wavelength header row"));

        SpectrumRecord ParseRow(string row, int ln)
        {
            var cells = Cells(row, d);
            string name = idColumns > 0 && cells.Length > 0 && cells[0].Length > 0 ? cells[0] : $"{stem}:{ln}";
            if (cells.Length != expectedCells)
                return new SpectrumRecord(source, 0, name, null, new ReadDiagnostic(source, ln, Math.Min(cells.Length, expectedCells) + 1,
                    $"ragged row: expected {expectedCells} cells, found {cells.Length}")) { Line = ln };
            var values = new double[wavelengths!.Length];
            for (int i = 0; i < values.Length; i++)
            {
                var cell = cells[idColumns + i];
                if (!DelimitedSpectrumReader.TryParseNumber(cell, d, out values[i]))
                    return new SpectrumRecord(source, 0, name, null, new ReadDiagnostic(source, ln, idColumns + i + 1,
                        cell.Length == 0 ? "empty cell; expected a number" : $"'{(cell.Length > 24 ? cell[..21] + "..." : cell)}' is not a number; expected a finite decimal number")) { Line = ln };
            }
            try
            {
                var s = new Spectrum(wavelengths, values, declared ?? SpectralUnit.Relative, name, new SpectrumOrigin($"{source}, line {ln}", 0));
                return new SpectrumRecord(source, 0, name, s, null) { Line = ln };
            }
            catch (InvalidSpectrumException ex)
            {
                return new SpectrumRecord(source, 0, name, null, new ReadDiagnostic(source, ln, 1, ex.Message)) { Line = ln };
            }
        }
    }
}

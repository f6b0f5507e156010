using System.Buffers;
using System.Globalization;
using System.Text;
using Lumen.Analysis;
using Lumen.Spectra;

namespace Lumen.Formats;

/// <summary>
/// Streams the row layout used by production testers: the first row holds optional ID/metadata headers then
/// the wavelengths; each further row is one unit: optional ID/metadata cells, then its values. Memory stays
/// flat: one row is held at a time.
/// </summary>
/// <remarks>Same conventions as <see cref="DelimitedSpectrumReader"/> (delimiters, comments, decimal comma,
/// <c># unit:</c> directive), except that <c>#</c> lines are comments only before the header: after it every non-blank
/// line is a unit, so IDs may start with <c>#</c>. A header cell that breaks the wavelength grid is an error at its column. Every data row becomes exactly one record: a spectrum, or an error naming the line
/// and column. The record's name is its first metadata cell (the ID) or <c>stem:line</c>.</remarks>
public static class RowSpectrumReader
{
    /// <summary>Minimum number of ascending wavelengths that makes a first row a row-layout header.</summary>
    public const int MinimumWavelengths = 10;

    /// <summary>Detects the layout from a file's first non-comment row.</summary>
    /// <param name="firstRow">The row.</param>
    /// <returns>
    /// Rows when the row ends in at least 10 strictly ascending numbers between 100 and 5000 nm that form a plausible
    /// wavelength grid (reaching into 380–780 nm, steps within a factor of 4 of the median step), or in such a grid
    /// written longest wavelength first (read as rows so that the reader can say the header descends, instead of
    /// reading the rows as columns); otherwise columns — so a column file whose header names its spectra by serial
    /// numbers stays a column file.
    /// </returns>
    public static TableLayout DetectLayout(string firstRow)
    {
        ArgumentNullException.ThrowIfNull(firstRow);
        char d = DelimitedSpectrumReader.DetectDelimiter(firstRow);
        var cells = Cells(firstRow, d);
        int k = WavelengthStart(cells, d);
        if (k >= 0 && PlausibleGrid(Numbers(cells, k, d))) return TableLayout.Rows;
        int j = DescendingStart(cells, d);
        return j >= 0 && PlausibleGrid([.. Numbers(cells, j, d).Reverse()]) ? TableLayout.Rows : TableLayout.Columns;
    }

    private static double[] Numbers(string[] cells, int start, char d)
    {
        var w = new double[cells.Length - start];
        for (int i = 0; i < w.Length; i++) DelimitedSpectrumReader.TryParseNumber(cells[start + i], d, out w[i]);
        return w;
    }

    /// <summary>Whether ascending wavelengths form a plausible grid (see <see cref="DetectLayout"/>).</summary>
    private static bool PlausibleGrid(double[] w)
    {
        if (w[0] > 780 || w[^1] < 380) return false;
        var steps = new double[w.Length - 1];
        for (int i = 0; i < steps.Length; i++) steps[i] = w[i + 1] - w[i];
        var sorted = steps.Order().ToArray();
        double median = sorted[sorted.Length / 2];
        return sorted[^1] <= 4 * median;
    }

    /// <summary>
    /// A problem with a row-layout header: a number among the ID/metadata cells means a cell broke the wavelength run
    /// (a typo such as <c>5OO</c>, or a duplicate or descending wavelength), which would otherwise silently turn part of
    /// the grid into ID columns.
    /// </summary>
    private static (int Column, string Message)? HeaderProblem(string[] header, int start, char d)
    {
        for (int i = 0; i < start; i++)
        {
            if (DelimitedSpectrumReader.TryParseNumber(header[i], d, out double w) && w > 100 && w < 5000)
            {
                string cell = header[start - 1];
                string why = DelimitedSpectrumReader.TryParseNumber(cell, d, out double b)
                    ? $"{b:G9} nm does not ascend to {header[start]} nm (duplicate or out of order)"
                    : $"'{(cell.Length > 24 ? cell[..21] + "..." : cell)}' is not a wavelength";
                return (start, $"header cell {start} breaks the wavelength grid: {why}; the wavelengths before it would be taken as ID columns. Fix the header (or give --layout columns if this is a column file)");
            }
        }
        return null;
    }

    /// <summary>The metadata column names of a row-layout header: its ID/metadata cells after the first (the ID), an empty
    /// one named <c>columnK</c>; empty when the row is not a row-layout header.</summary>
    /// <param name="headerRow">The header row.</param>
    /// <returns>The names, in order.</returns>
    public static IReadOnlyList<string> MetadataNames(string headerRow)
    {
        ArgumentNullException.ThrowIfNull(headerRow);
        char d = DelimitedSpectrumReader.DetectDelimiter(headerRow);
        var header = Cells(headerRow, d);
        int k = WavelengthStart(header, d);
        if (k <= 1) return [];
        return Enumerable.Range(1, k - 1).Select(i => MetadataName(header, i)).ToArray();
    }

    private static string MetadataName(string[] header, int i) => header[i].Length > 0 ? header[i] : $"column{i + 1}";

    /// <summary>Index of the first wavelength cell of a row-layout header, or -1.</summary>
    private static int WavelengthStart(string[] cells, char d) => WavelengthRun(cells, d, descending: false);

    /// <summary>Index of the first cell of a run of at least <see cref="MinimumWavelengths"/> strictly descending
    /// wavelengths (100–5000 nm) that ends the row, or -1.</summary>
    private static int DescendingStart(string[] cells, char d) => WavelengthRun(cells, d, descending: true);

    /// <summary>Index of the first cell of the run of wavelengths (100–5000 nm, strictly ascending, or descending)
    /// that ends the row, when it holds at least <see cref="MinimumWavelengths"/> of them; else -1.</summary>
    private static int WavelengthRun(string[] cells, char d, bool descending)
    {
        int k = cells.Length;
        double after = descending ? double.NegativeInfinity : double.PositiveInfinity; // the cell to the right
        while (k > 0 && DelimitedSpectrumReader.TryParseNumber(cells[k - 1], d, out double w) && w > 100 && w < 5000 && (descending ? w > after : w < after))
        {
            after = w;
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
    public static IEnumerable<InputRecord> Read(TextReader reader, string source, string stem, SpectralUnit? unit = null) =>
        ReadDeferred(reader, source, stem, unit).Select(parse => parse());

    /// <summary>
    /// Streams the rows of a row-layout text unparsed: each item parses its row when called (thread-safe, no shared
    /// state), so a batch can read lines on one thread and parse them on all cores. Calling every item in order gives
    /// exactly <see cref="Read"/>'s records. Call each item once: the rows of a UTF-8 <see cref="LineReader"/> wait as
    /// bytes in its read buffers, which are read into again once their rows are parsed, and a second call throws
    /// <see cref="InvalidOperationException"/>.
    /// </summary>
    /// <param name="reader">The text.</param>
    /// <param name="source">Source label.</param>
    /// <param name="stem">Stem for names of rows without an ID.</param>
    /// <param name="unit">Unit when the text declares none; null for relative.</param>
    /// <returns>One parser per record, in file order.</returns>
    public static IEnumerable<Func<InputRecord>> ReadDeferred(TextReader reader, string source, string stem, SpectralUnit? unit = null) =>
        ReadDeferred(reader, source, stem, unit, spans: true);

    /// <summary><see cref="ReadDeferred(TextReader, string, string, SpectralUnit?)"/>, optionally without the span fast path
    /// (tests compare the two).</summary>
    internal static IEnumerable<Func<InputRecord>> ReadDeferred(TextReader reader, string source, string stem, SpectralUnit? unit, bool spans)
    {
        ArgumentNullException.ThrowIfNull(reader);
        SpectralUnit? declared = unit;
        string? line;
        int lineNo = 0, rows = 0;
        var preamble = new List<KeyValuePair<string, string>>();
        RowParser? parser = null;
        var utf8 = spans && reader is LineReader { IsUtf8: true } bytes ? bytes : null;
        while (true)
        {
            if (parser is not null && utf8 is not null && parser.TakesUtf8)
            {
                // After the header, the rows of a UTF-8 input stay bytes until a worker parses them (issue 16).
                var kind = NextRowUtf8(utf8, out var rowText, out var rowBytes, out var hold);
                if (kind == RowLine.End) break;
                lineNo++;
                if (kind == RowLine.Blank) continue;
                rows++;
                int atLine = lineNo;
                var rp = parser;
                if (rowBytes is { } kept) yield return new DeferredRow(rp, kept, hold, atLine).Parse;
                else yield return () => rp.Parse(rowText!, atLine);
                continue;
            }
            if ((line = reader.ReadLine()) is null) break;
            lineNo++;
            if (lineNo == 1 && line.Length > 0 && line[0] == '\uFEFF') line = line[1..];
            var t = line.Trim();
            if (t.Length == 0) continue;
            if (t[0] == '#' && parser is null) // comments and directives only before the header: after it, '#' starts an ID
            {
                if (DelimitedSpectrumReader.UnitDirective(t, out var u, out var bad))
                {
                    if (bad is not null)
                    {
                        var e = new ErrorRecord(source, 0, Path.GetFileName(source), new ReadDiagnostic(source, lineNo, 1, bad));
                        yield return () => e;
                        yield break;
                    }
                    declared ??= u;
                }
                else if (Preamble.TryParse(t, out var key, out var value)) preamble.Add(new(key, value));
                continue;
            }
            if (parser is null)
            {
                char d = DelimitedSpectrumReader.DetectDelimiter(t);
                var header = Cells(t, d);
                int idColumns = WavelengthStart(header, d);
                if (idColumns < 0)
                {
                    int descending = DescendingStart(header, d);
                    var e = new ErrorRecord(source, 0, Path.GetFileName(source), descending >= 0
                        ? new ReadDiagnostic(source, lineNo, descending + 2,
                            $"the wavelengths descend ({header[descending + 1]} nm follows {header[descending]} nm); expected ascending wavelengths, shortest first: reverse the wavelength columns")
                        : new ReadDiagnostic(source, lineNo, 1, $"first row is not a wavelength header; expected optional ID columns then at least {MinimumWavelengths} ascending wavelengths in nm"));
                    yield return () => e;
                    yield break;
                }
                if (HeaderProblem(header, idColumns, d) is var (col, message))
                {
                    var e = new ErrorRecord(source, 0, Path.GetFileName(source), new ReadDiagnostic(source, lineNo, col, message)) { Line = lineNo };
                    yield return () => e;
                    yield break;
                }
                parser = new RowParser(source, stem, declared ?? SpectralUnit.Relative, d, header, idColumns, preamble, spans);
                continue;
            }
            rows++;
            string row = t;
            int at = lineNo;
            var p = parser;
            yield return () => p.Parse(row, at);
        }
        if (parser is not null && rows == 0)
        {
            var e = new ErrorRecord(source, 0, Path.GetFileName(source), new ReadDiagnostic(source, Math.Max(1, lineNo), 1, "header only; expected one row per unit after the wavelength header"));
            yield return () => e;
        }
        if (parser is null)
        {
            var e = new ErrorRecord(source, 0, Path.GetFileName(source), new ReadDiagnostic(source, Math.Max(1, lineNo), 1, "empty file; expected a wavelength header row"));
            yield return () => e;
        }
    }

    private enum RowLine { End, Blank, Row }

    /// <summary>
    /// The next line after the header, as the string path would see it (<c>line.Trim()</c>): blank, or a row as UTF-8
    /// bytes when its ends are ASCII other than white space (then trimming the ASCII white space around it is all the
    /// trimming there is), else as the trimmed string (a line padded with, say, a no-break space).
    /// </summary>
    private static RowLine NextRowUtf8(LineReader reader, out string? text, out ReadOnlyMemory<byte>? bytes, out SharedReadBuffer? hold)
    {
        text = null;
        bytes = null;
        if (!reader.TryReadLineUtf8Stable(out var kept, out hold)) return RowLine.End;
        var line = kept.Span;
        int start = 0, end = line.Length;
        while (start < end && line[start] < 0x80 && char.IsWhiteSpace((char)line[start])) start++;
        while (end > start && line[end - 1] < 0x80 && char.IsWhiteSpace((char)line[end - 1])) end--;
        if (start < end && line[start] < 0x80 && line[end - 1] < 0x80)
        {
            bytes = kept[start..end]; // valid after later reads: parsed on a worker, not copied (issue 16)
            return RowLine.Row;
        }
        text = start == end ? "" : Encoding.UTF8.GetString(line).Trim(); // a copy: the buffer is not needed
        hold?.Release();
        hold = null;
        return text.Length == 0 ? RowLine.Blank : RowLine.Row;
    }

    /// <summary>
    /// A row kept as UTF-8 bytes in the line reader's buffer until a worker parses it (<see cref="LineReader.TryReadLineUtf8Stable"/>):
    /// parsing it releases its hold on the buffer, which the reader then reads into again, so a row is parsed once and
    /// a second call throws instead of reading bytes that may belong to another row by then.
    /// </summary>
    private sealed class DeferredRow(RowParser parser, ReadOnlyMemory<byte> bytes, SharedReadBuffer? hold, int line)
    {
        private int _parsed;

        public InputRecord Parse()
        {
            if (Interlocked.Exchange(ref _parsed, 1) != 0) throw new InvalidOperationException($"the row of line {line} was parsed already: each deferred row is parsed once");
            try { return parser.Parse(bytes, line); }
            finally { hold?.Release(); }
        }
    }

    /// <summary>Parses data rows once the header is known: immutable, so rows may be parsed on any thread.</summary>
    private sealed class RowParser
    {
        private readonly string _source, _stem;
        private readonly SpectralUnit _unit;
        private readonly char _d;
        private readonly int _idColumns, _expectedCells;
        private readonly double[] _wavelengths;
        private readonly string[] _metadataNames;
        private readonly IReadOnlyList<KeyValuePair<string, string>> _preamble;
        private readonly KeyValuePair<string, string>[] _metadataTemplate; // the preamble and metadata keys, merged once
        private readonly int[] _metadataSlots; // where each metadata column's entry lies in it

        private readonly bool _spans;

        public RowParser(string source, string stem, SpectralUnit unit, char d, string[] header, int idColumns, List<KeyValuePair<string, string>> preamble, bool spans)
        {
            _spans = spans;
            _source = source;
            _stem = stem;
            _unit = unit;
            _d = d;
            _idColumns = idColumns;
            _expectedCells = header.Length;
            _metadataNames = new string[idColumns];
            for (int i = 1; i < idColumns; i++) _metadataNames[i] = MetadataName(header, i);
            _wavelengths = new double[header.Length - idColumns];
            for (int i = 0; i < _wavelengths.Length; i++) DelimitedSpectrumReader.TryParseNumber(header[idColumns + i], d, out _wavelengths[i]);
            _preamble = preamble.Count == 0 ? [] : Preamble.Merge(preamble);
            // Merging the same keys for every row gives the same layout: merged once here, filled per row (issue 16).
            var keys = Preamble.Merge(_preamble.Concat(_metadataNames.Skip(1).Select(n => new KeyValuePair<string, string>(n, ""))));
            _metadataTemplate = [.. keys];
            _metadataSlots = new int[idColumns];
            for (int i = 1; i < idColumns; i++) _metadataSlots[i] = Array.FindIndex(_metadataTemplate, kv => kv.Key == _metadataNames[i]);
            // The grid every row shares (checked once); an invalid grid leaves it null, and each row then reports it.
            try { _grid = new Spectrum(_wavelengths, new double[_wavelengths.Length], unit, "grid", new SpectrumOrigin(source, 0)); }
            catch (InvalidSpectrumException) { _grid = null; }
        }

        private readonly Spectrum? _grid;

        public InputRecord Parse(string row, int ln) => (_spans ? TryParseFast(row, ln) : null) ?? ParseCells(row, ln);

        /// <summary>True when rows may come as UTF-8 bytes: an ASCII delimiter other than white space.</summary>
        public bool TakesUtf8 => _spans && _d < 0x80 && _d != ' ';

        /// <summary>
        /// A row as UTF-8 bytes (trimmed as <see cref="NextRowUtf8"/> does): the common row (ID and metadata cells, then
        /// plain decimals, an optional trailing delimiter) read from the bytes; any other row decoded and given to
        /// <see cref="Parse(string, int)"/>, so both give the same record and diagnostics have one source.
        /// </summary>
        public InputRecord Parse(ReadOnlyMemory<byte> row, int ln)
        {
            var rented = ArrayPool<double>.Shared.Rent(_wavelengths.Length); // the spectrum keeps its own copy
            try { return TryParseFast(row.Span, rented.AsSpan(0, _wavelengths.Length), ln) ?? Parse(Encoding.UTF8.GetString(row.Span), ln); }
            finally { ArrayPool<double>.Shared.Return(rented); }
        }

        private InputRecord? TryParseFast(ReadOnlySpan<byte> text, Span<double> values, int ln)
        {
            byte d = (byte)_d;
            var idCells = _idColumns == 0 ? [] : new string[_idColumns];
            int cell = 0, pos = 0;
            while (true)
            {
                int v = cell - _idColumns;
                if (v >= 0 && v < values.Length)
                {
                    if (!PlainDecimal.TryParseCell(text[pos..], d, out values[v], out int length)) return null;
                    pos += length + 1;
                    cell++;
                    if (pos > text.Length) break; // that was the last cell
                    continue;
                }
                int at = text[pos..].IndexOf(d);
                int end = at < 0 ? text.Length : pos + at;
                // An ID or metadata cell: decoded, then trimmed exactly as the string path trims it.
                if (cell < _idColumns) idCells[cell] = Encoding.UTF8.GetString(text[pos..end]).Trim().Trim('"').Trim();
                else if (!(at < 0 && end == pos && cell == _expectedCells && cell + 1 > 2)) return null; // only a trailing delimiter may follow
                cell++;
                if (at < 0) break;
                pos = end + 1;
            }
            if (cell < _expectedCells || (cell > _expectedCells && cell != _expectedCells + 1)) return null;
            string name = _idColumns > 0 && idCells[0].Length > 0 ? idCells[0] : $"{_stem}:{ln}";
            return Built(values, name, ln, Metadata(idCells));
        }

        /// <summary>
        /// The common case without per-cell strings (issue 16): cells found and trimmed as spans, numbers parsed from the
        /// spans; only the ID and metadata cells become strings. Anything unusual (a ragged row, a cell that is not a
        /// number) returns null, and <see cref="ParseCells"/> then gives the diagnostic, so diagnostics have one source.
        /// Same trimming, decimal-comma and trailing-delimiter rules as <see cref="Cells"/> and
        /// <see cref="DelimitedSpectrumReader.TryParseNumber(string, char, out double)"/>; a test compares both paths on a hostile corpus.
        /// </summary>
        private InputRecord? TryParseFast(string row, int ln)
        {
            ReadOnlySpan<char> text = row;
            var rented = ArrayPool<double>.Shared.Rent(_wavelengths.Length); // the spectrum keeps its own copy
            try { return TryParseFast(text, rented.AsSpan(0, _wavelengths.Length), ln); }
            finally { ArrayPool<double>.Shared.Return(rented); }
        }

        private InputRecord? TryParseFast(ReadOnlySpan<char> text, Span<double> values, int ln)
        {
            var idCells = _idColumns == 0 ? [] : new string[_idColumns];
            int cell = 0, pos = 0;
            bool whitespace = _d == ' ';
            while (true)
            {
                int start, end;
                bool last;
                if (whitespace)
                {
                    while (pos < text.Length && char.IsWhiteSpace(text[pos])) pos++;
                    if (pos == text.Length) break;
                    start = pos;
                    while (pos < text.Length && !char.IsWhiteSpace(text[pos])) pos++;
                    end = pos;
                    int rest = pos;
                    while (rest < text.Length && char.IsWhiteSpace(text[rest])) rest++;
                    last = rest == text.Length;
                }
                else
                {
                    int v = cell - _idColumns;
                    if (v >= 0 && v < values.Length && PlainDecimal.TryParseCell(text[pos..], _d, out values[v], out int length))
                    {
                        // The common cell: a plain decimal running exactly to the delimiter, read in one pass (no search,
                        // no trimming: there is nothing to trim). Anything else takes the general steps below.
                        pos += length + 1;
                        cell++;
                        if (pos > text.Length) break; // that was the last cell
                        continue;
                    }
                    start = pos;
                    int at = text[pos..].IndexOf(_d);
                    end = at < 0 ? text.Length : pos + at;
                    last = at < 0;
                    pos = end + 1;
                }
                var token = text[start..end].Trim().Trim('"').Trim();
                if (cell < _idColumns) idCells[cell] = token.ToString();
                else if (cell - _idColumns < values.Length)
                {
                    if (!DelimitedSpectrumReader.TryParseNumber(token, _d, out values[cell - _idColumns])) return null;
                }
                else if (!(last && token.IsEmpty && cell == _expectedCells && cell + 1 > 2)) return null; // only a trailing delimiter may follow
                cell++;
                if (last) break;
            }
            if (cell < _expectedCells || (cell > _expectedCells && cell != _expectedCells + 1)) return null;
            string name = _idColumns > 0 && idCells[0].Length > 0 ? idCells[0] : $"{_stem}:{ln}";
            return Built(values, name, ln, Metadata(idCells));
        }

        private InputRecord Built(ReadOnlySpan<double> values, string name, int ln, IReadOnlyList<KeyValuePair<string, string>> metadata)
        {
            try
            {
                var origin = new SpectrumOrigin($"{_source}, line {ln}", 0) { Layout = "row layout (wavelengths in the header row, one spectrum per row)" };
                var s = _grid is null ? new Spectrum(_wavelengths, values, _unit, name, origin) : new Spectrum(_grid, values, _unit, name, origin);
                return new SpectrumRecord(_source, 0, name, s) { Line = ln, Metadata = metadata };
            }
            catch (InvalidSpectrumException ex)
            {
                return new ErrorRecord(_source, 0, name, new ReadDiagnostic(_source, ln, 1, ex.Message)) { Line = ln, Metadata = metadata };
            }
        }

        /// <summary>The general path: every cell a string (<see cref="Cells"/>); gives the located diagnostics.</summary>
        private InputRecord ParseCells(string row, int ln)
        {
            var cells = Cells(row, _d);
            string name = _idColumns > 0 && cells.Length > 0 && cells[0].Length > 0 ? cells[0] : $"{_stem}:{ln}";
            var metadata = Metadata(cells);
            if (cells.Length != _expectedCells)
                return new ErrorRecord(_source, 0, name, new ReadDiagnostic(_source, ln, Math.Min(cells.Length, _expectedCells) + 1,
                    $"ragged row: expected {_expectedCells} cells, found {cells.Length}")) { Line = ln, Metadata = metadata };
            var values = new double[_wavelengths.Length];
            for (int i = 0; i < values.Length; i++)
            {
                var cell = cells[_idColumns + i];
                if (!DelimitedSpectrumReader.TryParseNumber(cell, _d, out values[i]))
                    return new ErrorRecord(_source, 0, name, new ReadDiagnostic(_source, ln, _idColumns + i + 1,
                        cell.Length == 0 ? "empty cell; expected a number" : $"'{(cell.Length > 24 ? cell[..21] + "..." : cell)}' is not a number; expected a finite decimal number")) { Line = ln, Metadata = metadata };
            }
            return Built(values, name, ln, metadata);
        }

        // The preamble, then this row's metadata cells (those it has: a ragged row keeps what it carries).
        private IReadOnlyList<KeyValuePair<string, string>> Metadata(string[] cells)
        {
            if (_idColumns <= 1) return _preamble;
            if (cells.Length >= _idColumns)
            {
                var row = (KeyValuePair<string, string>[])_metadataTemplate.Clone();
                for (int i = 1; i < _idColumns; i++) row[_metadataSlots[i]] = new(_metadataNames[i], cells[i]);
                return row;
            }
            var entries = new List<KeyValuePair<string, string>>(_preamble);
            for (int i = 1; i < _idColumns && i < cells.Length; i++) entries.Add(new(_metadataNames[i], cells[i]));
            return Preamble.Merge(entries);
        }
    }
}

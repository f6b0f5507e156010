using System.Text;
using Lumen.Analysis;
using Lumen.Spectra;

namespace Lumen.Formats;

/// <summary>Reads spectrum files in either layout: the one entry point for every command.</summary>
public static class SpectrumFiles
{
    /// <summary>
    /// All records of a file (or standard input for <c>-</c>), streamed. The input is opened and read once: the layout is
    /// detected from the first data line, which is then replayed to the reader, so pipes, FIFOs and process substitution
    /// work. A file that cannot be opened, a folder, or a line too long to be a row of spectra becomes an error record.
    /// </summary>
    /// <param name="path">File path or <c>-</c>.</param>
    /// <param name="unit">Unit when the file declares none.</param>
    /// <param name="stdin">Standard input for <c>-</c>.</param>
    /// <param name="layout">Layout, or null to detect it from the first non-comment row.</param>
    /// <param name="progress">Optional byte counter, advanced as the file is consumed.</param>
    /// <returns>Records in file order.</returns>
    public static IEnumerable<InputRecord> Read(string path, SpectralUnit? unit = null, TextReader? stdin = null, TableLayout? layout = null, ReadProgress? progress = null) =>
        ReadDeferred(path, unit, stdin, layout, progress).Select(parse => parse());

    /// <summary>
    /// As <see cref="Read"/>, but each record is parsed when its item is called: the file is read on the calling thread,
    /// and a row-layout row's numbers can be parsed on any thread (column-layout and TM-27 records come parsed). Calling
    /// the items in order gives exactly <see cref="Read"/>'s records. Call each item once: a row-layout row waits as bytes
    /// in a read buffer that is read into again once its rows are parsed, and a second call throws
    /// <see cref="InvalidOperationException"/>.
    /// </summary>
    /// <param name="path">File path or <c>-</c>.</param>
    /// <param name="unit">Unit when the file declares none.</param>
    /// <param name="stdin">Standard input for <c>-</c>.</param>
    /// <param name="layout">Layout, or null to detect it.</param>
    /// <param name="progress">Optional byte counter.</param>
    /// <returns>One item per record, in file order.</returns>
    public static IEnumerable<Func<InputRecord>> ReadDeferred(string path, SpectralUnit? unit = null, TextReader? stdin = null, TableLayout? layout = null, ReadProgress? progress = null)
    {
        ArgumentNullException.ThrowIfNull(path);
        static IEnumerable<Func<InputRecord>> One(InputRecord r) => [() => r];
        if (path == "-") return ReadOnce(() => (new LineReader(stdin ?? Console.In), null), "-", "stdin", unit, layout, progress);
        if (Directory.Exists(path)) return One(ErrorRecord.ForFile(path, "is a folder; give the folder itself as an input to read the spectrum files in it"));
        if (!File.Exists(path)) return One(ErrorRecord.ForFile(path, "file not found"));
        return ReadOnce(() =>
        {
            var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, bufferSize: 0); // LineReader buffers
            try { return (LineReader.Open(stream), stream); }
            catch { stream.Dispose(); throw; }
        }, path, Path.GetFileNameWithoutExtension(path), unit, layout, progress);
    }

    private static IEnumerable<Func<InputRecord>> ReadOnce(Func<(LineReader Lines, Stream? Stream)> open, string source, string stem, SpectralUnit? unit, TableLayout? layout, ReadProgress? progress)
    {
        LineReader text;
        Stream? stream;
        try { (text, stream) = open(); }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            var e = ErrorRecord.ForFile(source, $"cannot read: {ex.Message}");
            return [() => e];
        }
        return Stream(text, stream, source, stem, unit, layout, progress);
    }

    private static IEnumerable<Func<InputRecord>> Stream(LineReader lines, Stream? stream, string source, string stem, SpectralUnit? unit, TableLayout? layout, ReadProgress? progress)
    {
        using var _ = lines;
        long reported = 0;
        IEnumerator<Func<InputRecord>>? records = null;
        static IEnumerable<Func<InputRecord>> Ready(IEnumerable<InputRecord> all) => all.Select(r => (Func<InputRecord>)(() => r));
        try
        {
            while (true)
            {
                Func<InputRecord>? next = null;
                InputRecord? failure = null;
                try
                {
                    if (records is null)
                    {
                        var first = lines.PeekFirstDataLine();
                        if (first is not null && Tm27.Looks(first))
                            records = Ready(Tm27.Read(lines.AsCharacterStream(), source, stem)).GetEnumerator(); // detected by content
                        else
                        {
                            var kind = layout ?? (first is not null ? RowSpectrumReader.DetectLayout(first) : TableLayout.Columns);
                            records = (kind == TableLayout.Rows
                                ? RowSpectrumReader.ReadDeferred(lines, source, stem, unit)
                                : Ready(DelimitedSpectrumReader.Read(lines, source, stem, unit))).GetEnumerator();
                        }
                    }
                    if (records.MoveNext()) next = records.Current;
                }
                catch (LineTooLongException ex)
                {
                    failure = new ErrorRecord(source, 0, Path.GetFileName(source), new ReadDiagnostic(source, ex.Line, 1, ex.Message)) { Line = ex.Line };
                }
                catch (Exception ex) when (ex is IOException or UnauthorizedAccessException or DecoderFallbackException)
                {
                    failure = new ErrorRecord(source, 0, Path.GetFileName(source), new ReadDiagnostic(source, lines.LinesRead + 1, 1, $"reading stopped: {ex.Message}"));
                }
                if (stream is not null && progress is not null)
                {
                    long position = stream.CanSeek ? stream.Position : reported;
                    if (position != reported) { progress.Add(position - reported); reported = position; }
                }
                if (failure is not null) { yield return () => failure; yield break; }
                if (next is null) yield break;
                yield return next;
            }
        }
        finally
        {
            records?.Dispose();
            if (stream is not null && progress is not null && stream.CanSeek)
            {
                try { progress.Add(stream.Length - reported); }
                catch (IOException) { /* the count is only for the progress line */ }
            }
            stream?.Dispose();
        }
    }

    /// <summary>
    /// Expands inputs: a file (or <c>-</c>) stays; a folder becomes its .csv, .tsv, .txt and .spdx files, recursively, in ordinal
    /// order. Folders reached through symbolic links are followed once (by their real path), so a link loop cannot hang
    /// the scan or read a file twice; a folder that cannot be listed, or that holds no spectrum file, becomes an entry with
    /// its problem (read as an error record, so nothing is silently lost). Files in <paramref name="exclude"/> (the run's
    /// own outputs) and Lumen's temporary and partial files are skipped in folder scans.
    /// </summary>
    /// <param name="inputs">Files, folders or <c>-</c>, as the user gave them.</param>
    /// <param name="exclude">Full paths to leave out of folder scans (this run's outputs); may be null.</param>
    /// <returns>The files in order, each with its problem or none.</returns>
    public static IReadOnlyList<InputFile> Expand(IEnumerable<string> inputs, IReadOnlyCollection<string>? exclude = null)
    {
        ArgumentNullException.ThrowIfNull(inputs);
        var skip = new HashSet<string>((exclude ?? []).Select(Path.GetFullPath), StringComparer.Ordinal);
        var files = new List<InputFile>();
        var seenFolders = new HashSet<string>(StringComparer.Ordinal);
        foreach (var input in inputs)
        {
            if (input != "-" && Directory.Exists(input))
            {
                int before = files.Count;
                Scan(input, files, seenFolders, skip);
                if (files.Count == before) files.Add(new InputFile(input, "folder holds no .csv, .tsv, .txt or .spdx file"));
            }
            else files.Add(new InputFile(input));
        }
        return files;
    }

    private static bool IsSpectrumFile(string f) =>
        f.EndsWith(".csv", StringComparison.OrdinalIgnoreCase) || f.EndsWith(".tsv", StringComparison.OrdinalIgnoreCase) || f.EndsWith(".txt", StringComparison.OrdinalIgnoreCase)
        || f.EndsWith(".spdx", StringComparison.OrdinalIgnoreCase);

    private static void Scan(string folder, List<InputFile> files, HashSet<string> seenFolders, HashSet<string> skip)
    {
        string real;
        try
        {
            var info = new DirectoryInfo(folder);
            real = info.LinkTarget is null ? info.FullName : (info.ResolveLinkTarget(returnFinalTarget: true)?.FullName ?? info.FullName);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            files.Add(new InputFile(folder, $"cannot read folder: {ex.Message}"));
            return;
        }
        if (!seenFolders.Add(real)) return; // reached again through a link: already scanned
        string[] entries, subfolders;
        try
        {
            entries = Directory.GetFiles(folder);
            subfolders = Directory.GetDirectories(folder);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            files.Add(new InputFile(folder, $"cannot read folder: {ex.Message}"));
            return;
        }
        var here = new List<(string Path, bool Folder)>();
        here.AddRange(entries.Where(f => IsSpectrumFile(f) && !skip.Contains(Path.GetFullPath(f))).Select(f => (f, false)));
        here.AddRange(subfolders.Select(f => (f, true)));
        foreach (var (path, isFolder) in here.OrderBy(e => e.Path, StringComparer.Ordinal))
        {
            if (isFolder) Scan(path, files, seenFolders, skip);
            else files.Add(new InputFile(path));
        }
    }

    /// <summary>
    /// The metadata keys a file's records carry — its preamble keys, then the row layout's metadata column names — read
    /// from the lines up to its header (every record of a file has the same keys). Empty for standard input, pipes and
    /// anything else that cannot be read twice (reading their first lines here would take them from the real read), and
    /// for files that cannot be read.
    /// </summary>
    /// <param name="path">File path.</param>
    /// <param name="layout">Layout, or null to detect it.</param>
    /// <returns>Keys in file order, unique.</returns>
    public static IReadOnlyList<string> MetadataKeys(string path, TableLayout? layout = null)
    {
        ArgumentNullException.ThrowIfNull(path);
        if (path == "-" || !File.Exists(path)) return [];
        var keys = new List<string>();
        try
        {
            // A named pipe reports no length and is not even opened: opening it here and closing it would end its writer's
            // stream before the real read. An empty file has no keys either.
            if (new FileInfo(path).Length == 0) return [];
            using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, bufferSize: 0);
            if (!stream.CanSeek) return []; // a pipe (process substitution, a FIFO): its lines are the real read's
            using var reader = LineReader.Open(stream);
            string? line;
            while ((line = reader.ReadLine()) is not null)
            {
                var t = line.Trim().TrimStart('\uFEFF');
                if (t.Length == 0) continue;
                if (t[0] == '#')
                {
                    if (Preamble.TryParse(t, out var key, out _)) keys.Add(key);
                    continue;
                }
                if ((layout ?? RowSpectrumReader.DetectLayout(t)) == TableLayout.Rows) keys.AddRange(RowSpectrumReader.MetadataNames(t));
                break;
            }
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException or LineTooLongException or DecoderFallbackException)
        {
            return []; // the read itself reports the problem as an error record
        }
        return keys.Distinct(StringComparer.Ordinal).ToArray();
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

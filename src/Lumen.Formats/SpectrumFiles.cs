using Lumen.Analysis;
using Lumen.Spectra;

namespace Lumen.Formats;

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
    public static IEnumerable<InputRecord> Read(string path, SpectralUnit? unit = null, TextReader? stdin = null, TableLayout? layout = null, ReadProgress? progress = null)
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
        if (!File.Exists(path)) return [new ErrorRecord(path, 0, Path.GetFileName(path), new ReadDiagnostic(path, 0, 0, "file not found"))];
        TableLayout k;
        using (var probe = new StreamReader(path, detectEncodingFromByteOrderMarks: true)) k = layout ?? Detect(probe);
        return k == TableLayout.Columns ? Counted(DelimitedSpectrumReader.ReadFile(path, unit), new FileInfo(path).Length, progress) : StreamRows(path, unit, progress);
    }

    private static IEnumerable<InputRecord> Counted(IReadOnlyList<InputRecord> records, long bytes, ReadProgress? progress)
    {
        progress?.Add(bytes);
        return records;
    }

    private static IEnumerable<InputRecord> StreamRows(string path, SpectralUnit? unit, ReadProgress? progress)
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

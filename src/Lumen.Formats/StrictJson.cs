using System.Text.Json;
using Lumen.Analysis;

namespace Lumen.Formats;

/// <summary>
/// Strict JSON for the files users write by hand (specifications, uncertainty models): UTF-8 only, duplicate keys
/// refused, comments and trailing commas allowed, and every key's line and column kept so that each problem can be
/// located.
/// </summary>
internal static class StrictJson
{
    /// <summary>Reads a hand-written file whole: refuses a folder, a missing file and one larger than
    /// <paramref name="maxBytes"/> (a wrong file, most likely), with a message naming <paramref name="what"/>.</summary>
    /// <param name="path">The path.</param>
    /// <param name="maxBytes">Largest size accepted.</param>
    /// <param name="what">What the file should be, for messages ("specification", "uncertainty model").</param>
    /// <param name="bytes">The content.</param>
    /// <param name="error">Why it could not be read, or null.</param>
    /// <returns>True when read.</returns>
    public static bool TryReadFile(string path, int maxBytes, string what, out byte[] bytes, out ReadDiagnostic? error)
    {
        ArgumentNullException.ThrowIfNull(path);
        bytes = [];
        error = null;
        if (Directory.Exists(path)) { error = new ReadDiagnostic(path, 0, 0, $"is a folder; expected a {what} file (JSON)"); return false; }
        if (!File.Exists(path)) { error = new ReadDiagnostic(path, 0, 0, $"{what} file not found"); return false; }
        try
        {
            using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read);
            if (stream.CanSeek && stream.Length > maxBytes) { error = new ReadDiagnostic(path, 0, 0, $"the {what} is larger than {maxBytes / 1024} KiB; is this the right file?"); return false; }
            using var ms = new MemoryStream();
            stream.CopyTo(ms);
            bytes = ms.ToArray();
            return true;
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            error = new ReadDiagnostic(path, 0, 0, $"cannot read the {what}: {ex.Message}");
            return false;
        }
    }

    /// <summary>Parses a document, adding located diagnostics to <paramref name="list"/> on failure.</summary>
    /// <param name="utf8">The bytes (a UTF-8 byte-order mark is skipped).</param>
    /// <param name="source">Name for messages.</param>
    /// <param name="list">Diagnostics.</param>
    /// <param name="positions">JSON pointer of each key → its line and column.</param>
    /// <returns>The document (dispose it), or null.</returns>
    public static JsonDocument? Parse(byte[] utf8, string source, List<ReadDiagnostic> list, out Dictionary<string, (int Line, int Column)> positions)
    {
        ArgumentNullException.ThrowIfNull(utf8);
        ArgumentNullException.ThrowIfNull(list);
        positions = [];
        int bom = utf8.Length >= 3 && utf8[0] == 0xEF && utf8[1] == 0xBB && utf8[2] == 0xBF ? 3 : 0;
        var bytes = utf8.AsMemory(bom);
        if (!System.Text.Unicode.Utf8.IsValid(bytes.Span))
        {
            int bad = FirstInvalidUtf8(bytes.Span);
            int line = 1, col = 1;
            for (int i = 0; i < bad; i++) { if (bytes.Span[i] == (byte)'\n') { line++; col = 1; } else if ((bytes.Span[i] & 0xC0) != 0x80) col++; }
            list.Add(new ReadDiagnostic(source, line, col, "not valid UTF-8 text; save the file as UTF-8"));
            return null;
        }
        JsonDocument doc;
        try
        {
            positions = Positions(bytes.Span, out var duplicates);
            foreach (var (dupPath, line, col) in duplicates)
                list.Add(new ReadDiagnostic(source, line, col, $"duplicate key '{dupPath[(dupPath.LastIndexOf('/') + 1)..]}'; each key may appear once (a second one would silently replace the first)"));
            if (list.Count > 0) return null;
            doc = JsonDocument.Parse(bytes, new JsonDocumentOptions { CommentHandling = JsonCommentHandling.Skip, AllowTrailingCommas = true });
        }
        catch (JsonException ex)
        {
            list.Add(new ReadDiagnostic(source, (int)(ex.LineNumber ?? 0) + 1, (int)(ex.BytePositionInLine ?? 0) + 1, $"not valid JSON: {ex.Message}"));
            return null;
        }
        return doc;
    }

    private static int FirstInvalidUtf8(ReadOnlySpan<byte> bytes)
    {
        int i = 0;
        while (i < bytes.Length)
        {
            var status = System.Text.Rune.DecodeFromUtf8(bytes[i..], out _, out int consumed);
            if (status != System.Buffers.OperationStatus.Done) return i;
            i += consumed;
        }
        return bytes.Length;
    }

    /// <summary>Line and column (one-based) of every value, keyed by JSON pointer (e.g. /limits/1/field).</summary>
    internal static Dictionary<string, (int Line, int Column)> Positions(ReadOnlySpan<byte> json, out List<(string Path, int Line, int Column)> duplicates)
    {
        var result = new Dictionary<string, (int, int)>(StringComparer.Ordinal);
        duplicates = [];
        var reader = new Utf8JsonReader(json, new JsonReaderOptions { CommentHandling = JsonCommentHandling.Skip, AllowTrailingCommas = true });
        var stack = new Stack<(bool IsArray, int Index, string Path)>();
        string? pendingName = null;
        var lineStarts = new List<int> { 0 };
        for (int i = 0; i < json.Length; i++) if (json[i] == (byte)'\n') lineStarts.Add(i + 1);
        (int, int) At(long offset)
        {
            int idx = lineStarts.BinarySearch((int)offset);
            if (idx < 0) idx = ~idx - 1;
            return (idx + 1, (int)offset - lineStarts[idx] + 1);
        }
        string CurrentPath()
        {
            if (stack.Count == 0) return "";
            var top = stack.Peek();
            return top.IsArray ? $"{top.Path}/{top.Index}" : $"{top.Path}/{pendingName}";
        }
        void AfterValue()
        {
            if (stack.Count > 0 && stack.Peek().IsArray) { var t = stack.Pop(); stack.Push((true, t.Index + 1, t.Path)); }
        }
        while (reader.Read())
        {
            switch (reader.TokenType)
            {
                case JsonTokenType.PropertyName:
                    pendingName = reader.GetString();
                    string key = $"{stack.Peek().Path}/{pendingName}";
                    var at = At(reader.TokenStartIndex);
                    if (!result.TryAdd(key, at)) duplicates.Add((key, at.Item1, at.Item2));
                    break;
                case JsonTokenType.StartObject:
                case JsonTokenType.StartArray:
                    string path = CurrentPath();
                    if (!result.ContainsKey(path)) result[path] = At(reader.TokenStartIndex);
                    stack.Push((reader.TokenType == JsonTokenType.StartArray, 0, path));
                    break;
                case JsonTokenType.EndObject:
                case JsonTokenType.EndArray:
                    stack.Pop();
                    AfterValue();
                    break;
                default:
                    string vp = CurrentPath();
                    if (!result.ContainsKey(vp)) result[vp] = At(reader.TokenStartIndex);
                    AfterValue();
                    break;
            }
        }
        return result;
    }
}

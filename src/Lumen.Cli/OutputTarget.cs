using System.CommandLine;
using System.Text;

namespace Lumen.Cli;

/// <summary>
/// Where a verb's result goes: standard output (no <c>-o</c>, or <c>-o -</c>) or a file written atomically — to a
/// temporary file beside the target, renamed over it only when everything was written, so the target never holds a torn
/// file. An output that is the same file as an input is refused.
/// </summary>
internal static class OutputTarget
{
    /// <summary>The shared <c>-o/--out</c> option.</summary>
    public static Option<string?> Option(string description, bool required = false, params string[] aliases) =>
        new("--out", ["-o", .. aliases]) { Description = description + " '-' means standard output.", Required = required };

    /// <summary>True for standard output.</summary>
    public static bool IsStdout(string? path) => path is null || path == "-";

    /// <summary>Refuses an output path that names one of the inputs (it would destroy the data being read).</summary>
    public static string? ConflictWithInputs(string? path, IEnumerable<string> inputs)
    {
        if (IsStdout(path)) return null;
        string target = Path.GetFullPath(path!);
        foreach (var input in inputs)
        {
            if (input == "-") continue;
            if (string.Equals(Path.GetFullPath(input), target, StringComparison.Ordinal))
                return $"the output '{path}' is also an input; choose another output file";
        }
        return null;
    }

    /// <summary>Writes text to standard output or atomically to a file.</summary>
    /// <returns>Null on success, else the reason it could not be written.</returns>
    public static string? WriteText(string? path, TextWriter stdout, Action<TextWriter> write, Func<bool>? partial = null)
    {
        if (IsStdout(path))
        {
            try
            {
                write(stdout);
                stdout.Flush();
                return null;
            }
            catch (IOException ex)
            {
                return $"cannot write standard output: {ex.Message}";
            }
        }
        return WriteFile(path!, stream =>
        {
            using var w = new StreamWriter(stream, new UTF8Encoding(false), 1 << 16, leaveOpen: true);
            write(w);
        }, partial);
    }

    /// <summary>Writes bytes atomically to a file.</summary>
    /// <returns>Null on success, else the reason it could not be written.</returns>
    public static string? WriteBytes(string path, byte[] bytes) => WriteFile(path, s => s.Write(bytes));

    /// <summary>The name an interrupted run's output gets: the target's name with <c>.partial</c> appended.</summary>
    public static string PartialPath(string path) => path + ".partial";

    /// <summary>
    /// Writes a file through a temporary file in the same folder, then renames it over the target — or, when
    /// <paramref name="partial"/> says the run was interrupted, to <see cref="PartialPath"/>, leaving the target as it was.
    /// </summary>
    /// <returns>Null on success, else the reason it could not be written.</returns>
    public static string? WriteFile(string path, Action<Stream> write, Func<bool>? partial = null)
    {
        string full, temp;
        try
        {
            full = Path.GetFullPath(path);
            if (Directory.Exists(full)) return $"cannot write '{path}': it is a folder";
            temp = Path.Combine(Path.GetDirectoryName(full) ?? ".", $".{Path.GetFileName(full)}.{Environment.ProcessId}.lumen-tmp");
        }
        catch (Exception ex) when (ex is ArgumentException or NotSupportedException or PathTooLongException)
        {
            return $"cannot write '{path}': {ex.Message}";
        }
        if (IsDevice(full)) return WriteInPlace(path, full, write);
        try
        {
            using (var file = new FileStream(temp, FileMode.Create, FileAccess.Write, FileShare.None, 1 << 16))
            using (var stream = new EarlyWriteback(file))
            {
                write(stream);
                stream.Complete(); // on disk before it replaces the target
            }
            File.Move(temp, partial?.Invoke() == true ? PartialPath(full) : full, overwrite: true);
            return null;
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            TryDelete(temp);
            return $"cannot write '{path}': {ex.Message}";
        }
        catch
        {
            TryDelete(temp);
            throw;
        }
    }

    /// <summary>
    /// True for an existing device or process path (<c>/dev/…</c>, <c>/proc/…</c>: /dev/null, /dev/full, /dev/stdout,
    /// a terminal, a process-substitution pipe). Renaming a temporary file over such a path would replace the device with
    /// a plain file (as root it succeeds), so these are written in place; there is no file content to keep intact.
    /// .NET's public file API does not tell a device from a regular file, hence the path test.
    /// </summary>
    internal static bool IsDevice(string full) =>
        !OperatingSystem.IsWindows() && File.Exists(full)
        && (full.StartsWith("/dev/", StringComparison.Ordinal) || full.StartsWith("/proc/", StringComparison.Ordinal));

    private static string? WriteInPlace(string path, string full, Action<Stream> write)
    {
        try
        {
            using var stream = new FileStream(full, FileMode.Open, FileAccess.Write, FileShare.ReadWrite, 1 << 16);
            write(stream);
            stream.Flush();
            return null;
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            return $"cannot write '{path}': {ex.Message}";
        }
    }

    private static void TryDelete(string path)
    {
        try { File.Delete(path); }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException) { /* best effort: the target is untouched either way */ }
    }
}

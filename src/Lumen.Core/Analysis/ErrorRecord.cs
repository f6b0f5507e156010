namespace Lumen.Analysis;

/// <summary>An input record that could not be read or computed, with the reason located by line and column.</summary>
/// <param name="Source">File path as given, or <c>-</c>.</param>
/// <param name="Column">One-based file column (column layout), or 0.</param>
/// <param name="Name">Record name (header text, ID, or the file name when the whole file failed).</param>
/// <param name="Error">What went wrong and where.</param>
public sealed record ErrorRecord(string Source, int Column, string Name, ReadDiagnostic Error) : InputRecord(Source, Column, Name)
{
    /// <summary>An error that concerns a whole file (line and column 0), named after the file.</summary>
    /// <param name="path">File path as given.</param>
    /// <param name="message">What went wrong.</param>
    /// <returns>The record.</returns>
    public static ErrorRecord ForFile(string path, string message)
    {
        ArgumentNullException.ThrowIfNull(path);
        return new ErrorRecord(path, 0, Path.GetFileName(path), new ReadDiagnostic(path, 0, 0, message));
    }
}

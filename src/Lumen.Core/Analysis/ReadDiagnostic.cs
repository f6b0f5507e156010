namespace Lumen.Analysis;

/// <summary>A problem in a user's input, located by file, line and column.</summary>
/// <param name="Source">File path as the user gave it, or <c>-</c> for standard input.</param>
/// <param name="Line">One-based line number; 0 when the problem concerns the whole file.</param>
/// <param name="Column">One-based column (cell) number; 0 when the problem concerns a whole line or file.</param>
/// <param name="Message">What was found and what was expected, in plain words.</param>
public sealed record ReadDiagnostic(string Source, int Line, int Column, string Message)
{
    /// <inheritdoc/>
    public override string ToString() => $"{Source}:{Line}:{Column}: {Message}";
}

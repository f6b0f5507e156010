namespace Lumen.Analysis;

/// <summary>A problem in a user's input, located by file, line and column.</summary>
/// <param name="Source">File path as the user gave it, or <c>-</c> for standard input.</param>
/// <param name="Line">One-based line number; 0 when the problem concerns the whole file.</param>
/// <param name="Column">One-based column (cell) number; 0 when the problem concerns a whole line or file.</param>
/// <param name="Message">What was found and what was expected, in plain words.</param>
public sealed record ReadDiagnostic(string Source, int Line, int Column, string Message)
{
    /// <summary>
    /// <c>file:line:column: message</c>, the location as precise as it is known: <c>file:line: message</c> for a whole
    /// line and <c>file: message</c> for a whole file (never a line or column 0, which no editor can go to).
    /// </summary>
    /// <returns>The located message.</returns>
    public override string ToString() => Line <= 0 ? $"{Source}: {Message}" : Column <= 0 ? $"{Source}:{Line}: {Message}" : $"{Source}:{Line}:{Column}: {Message}";
}

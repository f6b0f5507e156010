namespace Lumen.Graphics;

/// <summary>One input file of a report, identified so a reader can check they hold the same data.</summary>
/// <param name="Path">The path as given (or <c>-</c> for standard input).</param>
/// <param name="Bytes">Size in bytes; -1 when unknown (standard input).</param>
/// <param name="Sha256">SHA-256 of the file's bytes as lowercase hex; null when it could not be computed (standard input).</param>
public sealed record ReportInput(string Path, long Bytes, string? Sha256);

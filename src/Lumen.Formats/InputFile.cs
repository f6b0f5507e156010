namespace Lumen.Formats;

/// <summary>One input after folder expansion: a file to read, or a path with the problem that stops it being read.</summary>
/// <param name="Path">The path (or <c>-</c>).</param>
/// <param name="Problem">Why it cannot be read (a folder that cannot be listed or holds no spectrum file), or null.</param>
public sealed record InputFile(string Path, string? Problem = null);

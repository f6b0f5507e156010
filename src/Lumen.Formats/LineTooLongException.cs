namespace Lumen.Formats;

/// <summary>A line of an input is longer than <see cref="LineReader.MaxLineChars"/>; reading stops at that line.</summary>
/// <param name="line">The one-based line number.</param>
public sealed class LineTooLongException(int line)
    : IOException($"line {line} is longer than {LineReader.MaxLineChars:N0} characters; is this a text file of spectra?")
{
    /// <summary>The one-based line number.</summary>
    public int Line { get; } = line;
}

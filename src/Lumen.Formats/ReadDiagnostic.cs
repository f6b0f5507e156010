using Lumen.Spectra;

namespace Lumen.Formats;

/// <summary>A problem in a user's file, located by line and column (both one-based).</summary>
/// <param name="Source">File path, or <c>-</c> for standard input.</param>
/// <param name="Line">One-based line number.</param>
/// <param name="Column">One-based column (cell) number.</param>
/// <param name="Message">What was found and what was expected.</param>
public sealed record ReadDiagnostic(string Source, int Line, int Column, string Message)
{
    /// <inheritdoc/>
    public override string ToString() => $"{Source}:{Line}:{Column}: {Message}";
}

/// <summary>
/// One record of an input file: a spectrum, or the error that stopped it. Every data column of every file
/// becomes exactly one record, so that nothing is lost in a batch.
/// </summary>
/// <param name="Source">File path, or <c>-</c>.</param>
/// <param name="Column">One-based file column of the spectrum (0 when the whole file failed).</param>
/// <param name="Name">Spectrum name (header text or <c>stem#k</c>).</param>
/// <param name="Spectrum">The spectrum, when it was read.</param>
/// <param name="Error">The error, when it was not.</param>
public sealed record SpectrumRecord(string Source, int Column, string Name, Spectrum? Spectrum, ReadDiagnostic? Error)
{
    /// <summary>One-based line of the record in its file (row layout), or 0 (column layout).</summary>
    public int Line { get; init; }

    /// <summary>True when the record holds a spectrum.</summary>
    public bool IsOk => Spectrum is not null;
}

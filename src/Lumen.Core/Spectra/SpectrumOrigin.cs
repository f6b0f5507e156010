namespace Lumen.Spectra;

/// <summary>Where a spectrum came from: the source (file name, or <c>-</c> for standard input) and its column.</summary>
/// <param name="Source">File path or other source label.</param>
/// <param name="Column">One-based column in the source, or 0 when not from a table.</param>
public readonly record struct SpectrumOrigin(string Source, int Column)
{
    /// <summary>How the reader found the spectrum in its file (e.g. "column layout", "row layout"), or null when not read from a table.</summary>
    public string? Layout { get; init; }

    /// <summary>An origin for spectra made in code (generated, CIE tables).</summary>
    /// <param name="label">A short label, e.g. <c>CIE illuminant A</c>.</param>
    /// <returns>The origin.</returns>
    public static SpectrumOrigin Generated(string label) => new(label, 0);

    /// <inheritdoc/>
    public override string ToString() => Column > 0 ? $"{Source} (column {Column})" : Source;
}

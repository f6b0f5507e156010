using Lumen.Spectra;

namespace Lumen.Analysis;

/// <summary>An input record that was read: its spectrum.</summary>
/// <param name="Source">File path as given, or <c>-</c>.</param>
/// <param name="Column">One-based file column (column layout), or 0 (row layout).</param>
/// <param name="Name">Spectrum name: header text, row ID or <c>stem#k</c>.</param>
/// <param name="Spectrum">The spectrum that was read, with its grid, values, unit and origin.</param>
public sealed record SpectrumRecord(string Source, int Column, string Name, Spectrum Spectrum) : InputRecord(Source, Column, Name);

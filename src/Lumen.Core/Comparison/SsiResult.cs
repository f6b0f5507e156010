namespace Lumen.Comparison;

/// <summary>Spectral Similarity Index values of a comparison.</summary>
/// <param name="Value">SSI of the other source against the reference (the published rounded integer), or null.</param>
/// <param name="Unrounded">The same before rounding.</param>
/// <param name="SourceToDefaultReference">SSI of the other source against its default reference at its CCT (rounded), or null.</param>
/// <param name="ReferenceToDefaultReference">SSI of the reference against its default reference at its CCT (rounded), or null.</param>
public sealed record SsiResult(int? Value, double Unrounded, int? SourceToDefaultReference, int? ReferenceToDefaultReference);

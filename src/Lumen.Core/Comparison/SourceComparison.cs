using Lumen.Analysis;

namespace Lumen.Comparison;

/// <summary>One source compared with a reference source (docs/methods/compare.md).</summary>
/// <param name="Reference">The reference source's assessment (colorimetry).</param>
/// <param name="Source">The other source's assessment (colorimetry).</param>
/// <param name="DeltaUPrimeVPrime">Δu′v′ between the two (CIE 1976, 2°).</param>
/// <param name="DeltaKelvin">CCT(other) − CCT(reference), K.</param>
/// <param name="DeltaMired">M(other) − M(reference), MK⁻¹.</param>
/// <param name="DeltaDuv">Duv(other) − Duv(reference).</param>
/// <param name="Correction">What brings the other source to the reference.</param>
/// <param name="Filters">Filters (and stacks of two) applied to the other source, smallest residual first.</param>
/// <param name="SampleShift">Object-colour shift after white balance, or null when a source has no visible power.</param>
/// <param name="Ssi">Spectral Similarity Index values.</param>
/// <param name="Warnings">Where the comparison is weak, in plain words.</param>
public sealed record SourceComparison(Assessment Reference, Assessment Source, double DeltaUPrimeVPrime, double DeltaKelvin, double DeltaMired,
    double DeltaDuv, Correction Correction, IReadOnlyList<FilterResult> Filters, SampleShiftResult? SampleShift, SsiResult Ssi, IReadOnlyList<string> Warnings);

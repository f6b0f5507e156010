using Lumen.Assessment;

namespace Lumen.Formats;

/// <summary>One output row: a record's assessment, or its error (never both, never neither).</summary>
/// <param name="Record">The input record.</param>
/// <param name="Result">The assessment, when the record held a spectrum.</param>
public sealed record AnalysisItem(SpectrumRecord Record, Lumen.Assessment.Assessment? Result)
{
    /// <summary>Assesses a record (an error record passes through).</summary>
    /// <param name="record">The record.</param>
    /// <param name="options">Assessment options.</param>
    /// <returns>The item.</returns>
    public static AnalysisItem From(SpectrumRecord record, AssessmentOptions options)
    {
        ArgumentNullException.ThrowIfNull(record);
        return new AnalysisItem(record, record.Spectrum is null ? null : Assessor.Assess(record.Spectrum, options));
    }
}

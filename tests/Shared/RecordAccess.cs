using Lumen.Analysis;
using Lumen.Spectra;

namespace Lumen.Tests;

/// <summary>Test-only shorthands over the closed record type (the product code pattern-matches instead).</summary>
public static class RecordAccess
{
    extension(InputRecord record)
    {
        /// <summary>The spectrum of a <see cref="SpectrumRecord"/>, else null.</summary>
        public Spectrum? Spectrum => (record as SpectrumRecord)?.Spectrum;

        /// <summary>The error of an <see cref="ErrorRecord"/>, else null.</summary>
        public ReadDiagnostic? Error => (record as ErrorRecord)?.Error;

        /// <summary>True for a record that was read.</summary>
        public bool IsOk => record is SpectrumRecord;
    }
}

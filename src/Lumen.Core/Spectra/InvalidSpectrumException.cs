namespace Lumen.Spectra;

/// <summary>A spectrum could not be built from the values given (a user's data problem, not a bug).</summary>
/// <remarks>The message names the spectrum's origin (file and column) and what was expected.</remarks>
public sealed class InvalidSpectrumException : Exception
{
    /// <summary>Creates the exception.</summary>
    /// <param name="message">What is wrong and where.</param>
    /// <param name="index">Zero-based index of the offending sample, or -1 when the whole spectrum is at fault.</param>
    public InvalidSpectrumException(string message, int index = -1) : base(message) => SampleIndex = index;

    /// <summary>Zero-based index of the offending sample, or -1 when no single sample is at fault.</summary>
    public int SampleIndex { get; }
}

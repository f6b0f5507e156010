namespace Lumen.Spectra;

/// <summary>
/// A spectrum on a regular grid of whole nanometres: value k is at <c>StartNm + k·StepNm</c>.
/// </summary>
/// <param name="StartNm">First wavelength, nm (a whole number).</param>
/// <param name="StepNm">Step, nm (1 or 5 for grids the CIE tabulates).</param>
/// <param name="Values">The values (not copied; treat as read-only).</param>
/// <param name="Method">How the samples were obtained (for provenance).</param>
public sealed record RegularSamples(int StartNm, int StepNm, double[] Values, string Method)
{
    /// <summary>Last wavelength, nm.</summary>
    public int EndNm => StartNm + (Values.Length - 1) * StepNm;
}

using Lumen.Spectra;
using Lumen.Blackbody;

namespace Lumen.Synthetic;

/// <summary>Parameters of a phosphor-converted white LED model: a blue pump plus two broad phosphor bands.</summary>
/// <param name="BluePeakNm">Peak wavelength of the blue pump, nm (typically 440–460).</param>
/// <param name="BlueFwhmNm">Full width at half maximum of the pump, nm (typically 18–25).</param>
/// <param name="BlueWeight">Peak height of the pump relative to the green phosphor band.</param>
/// <param name="GreenPeakNm">Peak of the green/yellow phosphor band, nm.</param>
/// <param name="GreenFwhmNm">Width of the green/yellow band, nm.</param>
/// <param name="RedPeakNm">Peak of the red phosphor band, nm.</param>
/// <param name="RedFwhmNm">Width of the red band, nm.</param>
/// <param name="RedWeight">Peak height of the red band relative to the green band.</param>
public readonly record struct PhosphorLedModel(
    double BluePeakNm, double BlueFwhmNm, double BlueWeight,
    double GreenPeakNm, double GreenFwhmNm, double RedPeakNm, double RedFwhmNm, double RedWeight);

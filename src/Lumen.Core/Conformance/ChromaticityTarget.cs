using Lumen.Colorimetry;
using Lumen.Temperature;

namespace Lumen.Conformance;

/// <summary>A chromaticity target.</summary>
/// <param name="Kind">How it is given.</param>
/// <param name="First">Nominal CCT, x, u′ or CCT.</param>
/// <param name="Second">(unused), y, v′ or Duv.</param>
/// <param name="Edition">ANSI C78.377 edition for nominal-CCT targets.</param>
public sealed record ChromaticityTarget(TargetKind Kind, double First, double Second, AnsiEdition Edition = AnsiEdition.Ed2017)
{
    /// <summary>The ANSI category when the target is a nominal CCT.</summary>
    public AnsiCategory? Category => Kind == TargetKind.NominalCct && AnsiC78377.TryGetCategory((int)First, Edition, out var c) ? c : null;

    /// <summary>The centre chromaticity.</summary>
    public Chromaticity Centre => Kind switch
    {
        TargetKind.NominalCct => Category is { } c ? Chromaticity.FromXy(c.Centre.SmallX, c.Centre.SmallY) : Chromaticity.FromXy(double.NaN, double.NaN),
        TargetKind.Xy => Chromaticity.FromXy(First, Second),
        TargetKind.UPrimeVPrime => Chromaticity.FromUPrimeVPrime(First, Second),
        _ => CctSolver.ToChromaticity(First, Second),
    };

    /// <summary>Readable description.</summary>
    public string Description => Kind switch
    {
        TargetKind.NominalCct => $"ANSI C78.377-{(Edition == AnsiEdition.Ed2008 ? "2008" : "2017")} {First:0} K{(Category?.Flexible == true ? " (flexible CCT)" : "")}",
        TargetKind.Xy => $"x {First:0.0000}, y {Second:0.0000}",
        TargetKind.UPrimeVPrime => $"u' {First:0.0000}, v' {Second:0.0000}",
        _ => $"{First:0} K, Duv {Second:+0.0000;-0.0000;0}",
    };
}

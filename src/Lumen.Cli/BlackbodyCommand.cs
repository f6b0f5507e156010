using System.CommandLine;
using Lumen.Blackbody;
using Lumen.Formats;
using Lumen.Spectra;

namespace Lumen.Cli;

/// <summary><c>lumen blackbody T</c>: Planck, Wien and Stefan–Boltzmann quantities of a (grey) blackbody.</summary>
internal sealed class BlackbodyCommand(TextWriter stdout, TextWriter stderr)
{
    public Argument<double> Temperature { get; } = new Argument<double>("temperature") { Description = "Temperature in kelvin (positive)." }.Strict();
    public Option<double> Emissivity { get; } = new Option<double>("--emissivity") { Description = "Emissivity ε in (0, 1] (grey body).", DefaultValueFactory = _ => 1.0 }.Strict();
    public Option<double?> Area { get; } = new Option<double?>("--area") { Description = "Radiating area in m² (gives the net radiated power)." }.Strict();
    public Option<double> Ambient { get; } = new Option<double>("--ambient") { Description = "Temperature of the surroundings in K for the net power.", DefaultValueFactory = _ => 293.15 }.Strict();
    public Option<string?> Export { get; } = new("--export") { Description = "Write the spectral radiance to this file: CSV that 'lumen analyze' reads, or IES TM-27 XML when the name ends in .spdx." };
    public Option<double> From { get; } = new Option<double>("--from") { Description = "First wavelength of the export, nm.", DefaultValueFactory = _ => 360 }.Strict();
    public Option<double> To { get; } = new Option<double>("--to") { Description = "Last wavelength of the export, nm.", DefaultValueFactory = _ => 830 }.Strict();
    public Option<double> Step { get; } = new Option<double>("--step") { Description = "Wavelength step of the export, nm.", DefaultValueFactory = _ => 1 }.Strict();
    public Option<string> Approximation { get; } = new("--approximation") { Description = "Add an approximation and its relative error to the export: none, wien, rayleigh-jeans.", DefaultValueFactory = _ => "none" };
    public Option<string> Format { get; } = CommonOptions.Format("text", "json");
    public Option<string?> Out { get; } = OutputTarget.Option("Write the report to this file instead of standard output.");

    public Command Build()
    {
        Approximation.AcceptOnlyFromAmong("none", "wien", "rayleigh-jeans");
        var cmd = new Command("blackbody", "Planck spectrum, Wien peak, Stefan–Boltzmann exitance, net radiated power and colour of a blackbody or grey body.")
        {
            Temperature, Emissivity, Area, Ambient, Export, From, To, Step, Approximation, Format, Out,
        };
        cmd.SetAction(Execute);
        return cmd;
    }

    private int Execute(ParseResult parse)
    {
        double t = parse.GetValue(Temperature), eps = parse.GetValue(Emissivity), ambient = parse.GetValue(Ambient);
        double? area = parse.GetValue(Area);
        if (!(t > 0 && double.IsFinite(t))) return Fail($"temperature {t} K is not valid; expected a positive number of kelvin.");
        if (!(eps > 0 && eps <= 1)) return Fail($"--emissivity {eps} is not valid; expected a number in (0, 1].");
        if (!(ambient >= 0 && double.IsFinite(ambient))) return Fail($"--ambient {ambient} K is not valid; expected a non-negative, finite temperature.");
        if (area is { } a0 && !(a0 >= 0 && double.IsFinite(a0))) return Fail($"--area {a0} is not valid; expected a non-negative, finite area in m².");
        double from = parse.GetValue(From), to = parse.GetValue(To), step = parse.GetValue(Step);
        if (!(from >= Spectrum.MinWavelengthNm && to > from && to <= Spectrum.MaxWavelengthNm && step >= Spectrum.MinStepNm))
            return Fail("--from, --to, --step must satisfy 100 ≤ from < to ≤ 100000 nm and step ≥ 0.01 nm.");
        if ((to - from) / step + 1 < 3) return Fail("the export needs at least 3 wavelengths: widen --from/--to or reduce --step.");
        if ((to - from) / step > 1_000_000) return Fail("the export would exceed 1,000,000 wavelengths: increase --step.");
        var approx = parse.GetValue(Approximation) switch { "wien" => PlanckApproximation.Wien, "rayleigh-jeans" => PlanckApproximation.RayleighJeans, _ => PlanckApproximation.None };

        var report = BlackbodyReport.Compute(t, eps, area, ambient);
        string? exportPath = parse.GetValue(Export);
        if (exportPath is not null
            && OutputTarget.WriteText(exportPath, stdout, w =>
            {
                var spectrum = Radiator.RadianceSpectrum(t, eps, from, to, step);
                if (exportPath.EndsWith(".spdx", StringComparison.OrdinalIgnoreCase))
                    Tm27.Write(w, spectrum, [new("Description", spectrum.Name), new("DocumentCreator", "Lumen " + LumenApp.Version), new("Comments", FormattableString.Invariant($"Planck's law, T = {t} K, emissivity {eps}; computed, not measured"))]);
                else ThermalWriters.WriteRadianceExport(w, spectrum, t, eps, approx);
            }) is { } exportFailure)
            return CommonOptions.OutputFailed(stderr, exportFailure);
        if (OutputTarget.WriteText(parse.GetValue(Out), stdout, w => ThermalWriters.WriteBlackbody(report, exportPath, parse.GetValue(Format) == "json", w)) is { } failure)
            return CommonOptions.OutputFailed(stderr, failure);
        return ExitCodes.Success;
    }

    private int Fail(string message)
    {
        stderr.WriteLine($"lumen blackbody: {message}");
        return ExitCodes.UsageError;
    }
}

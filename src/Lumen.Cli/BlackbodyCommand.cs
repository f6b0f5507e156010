using System.CommandLine;
using System.Globalization;
using System.Text;
using System.Text.Json;
using Lumen.Blackbody;
using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Temperature;

namespace Lumen.Cli;

/// <summary><c>lumen blackbody T</c>: Planck, Wien and Stefan–Boltzmann quantities of a (grey) blackbody.</summary>
internal sealed class BlackbodyCommand(TextWriter stdout, TextWriter stderr)
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    public Argument<double> Temperature { get; } = new("temperature") { Description = "Temperature in kelvin (positive)." };
    public Option<double> Emissivity { get; } = new("--emissivity") { Description = "Emissivity ε in (0, 1] (grey body).", DefaultValueFactory = _ => 1.0 };
    public Option<double?> Area { get; } = new("--area") { Description = "Radiating area in m² (gives the net radiated power)." };
    public Option<double> Ambient { get; } = new("--ambient") { Description = "Temperature of the surroundings in K for the net power.", DefaultValueFactory = _ => 293.15 };
    public Option<string?> Export { get; } = new("--export") { Description = "Write the spectral radiance to this file (CSV that 'lumen analyze' reads)." };
    public Option<double> From { get; } = new("--from") { Description = "First wavelength of the export, nm.", DefaultValueFactory = _ => 360 };
    public Option<double> To { get; } = new("--to") { Description = "Last wavelength of the export, nm.", DefaultValueFactory = _ => 830 };
    public Option<double> Step { get; } = new("--step") { Description = "Wavelength step of the export, nm.", DefaultValueFactory = _ => 1 };
    public Option<string> Approximation { get; } = new("--approximation") { Description = "Add an approximation and its relative error to the export: none, wien, rayleigh-jeans.", DefaultValueFactory = _ => "none" };
    public Option<string> Format { get; } = new("--format") { Description = "Output format: text or json.", DefaultValueFactory = _ => "text" };

    public const string Caution = "Caution: hot surfaces burn and thermal radiation can harm eyes and skin; these are idealised calculations, not safety assessments — follow local codes and qualified practice.";

    public Command Build()
    {
        Approximation.AcceptOnlyFromAmong("none", "wien", "rayleigh-jeans");
        Format.AcceptOnlyFromAmong("text", "json");
        var cmd = new Command("blackbody", "Planck spectrum, Wien peak, Stefan–Boltzmann exitance, net radiated power and colour of a blackbody or grey body.")
        {
            Temperature, Emissivity, Area, Ambient, Export, From, To, Step, Approximation, Format,
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
        if (!(ambient >= 0)) return Fail($"--ambient {ambient} K is not valid; expected a non-negative temperature.");
        if (area is { } a0 && !(a0 >= 0)) return Fail($"--area {a0} is not valid; expected a non-negative area in m².");
        double from = parse.GetValue(From), to = parse.GetValue(To), step = parse.GetValue(Step);
        if (!(from > 0 && to > from && step > 0)) return Fail("--from, --to, --step must satisfy 0 < from < to and step > 0.");
        if ((to - from) / step + 1 < 3) return Fail("the export needs at least 3 wavelengths: widen --from/--to or reduce --step.");
        if ((to - from) / step > 1_000_000) return Fail("the export would exceed 1,000,000 wavelengths: increase --step.");
        var approx = parse.GetValue(Approximation) switch { "wien" => PlanckApproximation.Wien, "rayleigh-jeans" => PlanckApproximation.RayleighJeans, _ => PlanckApproximation.None };

        var warnings = new List<string>();
        // Chromaticity of the radiator itself (1 nm, 360–830 nm, CIE 15 c2): the Planckian locus point.
        Chromaticity chroma = default;
        CctResult cct = default;
        bool hasColour = t >= 500 && t <= 1e6;
        if (hasColour)
        {
            var p = PlanckianLocus.Cie15.At(t);
            chroma = Chromaticity.FromUv(p.U, p.V);
            cct = CctSolver.Solve(chroma);
        }
        else warnings.Add("Chromaticity and CCT are given for 500 K to 1,000,000 K only.");
        if (t < 800) warnings.Add("Below about 800 K a hot body hardly glows visibly (common practice, the Draper point ≈ 798 K).");

        string? exportPath = parse.GetValue(Export);
        if (exportPath is not null)
        {
            try { File.WriteAllText(exportPath, ExportCsv(t, eps, from, to, step, approx)); }
            catch (Exception ex) when (ex is IOException or UnauthorizedAccessException) { return Fail($"cannot write '{exportPath}': {ex.Message}"); }
        }

        double wien = Radiator.WienPeakNm(t);
        double exitance = Radiator.ExitanceWattsPerSquareMetre(t);
        double? net = area is { } a ? Radiator.NetPowerWatts(t, ambient, a, eps) : null;
        if (parse.GetValue(Format) == "json")
        {
            using var ms = new MemoryStream();
            using (var w = new Utf8JsonWriter(ms, new JsonWriterOptions { Indented = true, Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping }))
            {
                w.WriteStartObject();
                w.WriteNumber("temperatureK", t);
                w.WriteNumber("emissivity", eps);
                w.WriteNumber("wienPeakNm", wien);
                w.WriteNumber("exitanceWPerM2", exitance);
                w.WriteNumber("greyExitanceWPerM2", eps * exitance);
                if (net is { } n) { w.WriteNumber("netPowerW", n); w.WriteNumber("ambientK", ambient); w.WriteNumber("areaM2", area!.Value); }
                if (hasColour)
                {
                    w.WriteStartObject("chromaticity");
                    w.WriteNumber("x", chroma.X); w.WriteNumber("y", chroma.Y); w.WriteNumber("u", chroma.U); w.WriteNumber("v", chroma.V);
                    w.WriteNumber("uPrime", chroma.UPrime); w.WriteNumber("vPrime", chroma.VPrime);
                    w.WriteEndObject();
                    w.WriteStartObject("cct");
                    w.WriteNumber("kelvin", cct.CctKelvin); w.WriteNumber("duv", cct.Duv);
                    w.WriteString("method", CctResult.Describe(cct.Method)); w.WriteString("observer", "2");
                    w.WriteEndObject();
                    w.WriteString("colourName", Radiator.ColourName(t));
                }
                if (exportPath is not null) w.WriteString("export", exportPath);
                w.WriteStartObject("provenance");
                w.WriteString("constants", "CODATA 2018 (h, c, k exact): σ = 5.670374419e-8 W/(m²·K⁴), b = 2.897771955e-3 m·K; chromaticity with c2 = 1.4388e-2 m·K (CIE 15)");
                w.WriteString("netPower", "P = σ·A·ε·(T⁴ − T0⁴): small grey body in large black surroundings");
                w.WriteEndObject();
                w.WriteStartArray("warnings");
                foreach (var x in warnings) w.WriteStringValue(x);
                w.WriteEndArray();
                w.WriteString("caution", Caution);
                w.WriteEndObject();
            }
            stdout.WriteLine(Encoding.UTF8.GetString(ms.ToArray()));
        }
        else
        {
            stdout.WriteLine(string.Create(Inv, $"Blackbody at {t:0.###} K (emissivity {eps:0.###})"));
            stdout.WriteLine(string.Create(Inv, $"  Wien peak (per nm)      {wien:0.0} nm"));
            stdout.WriteLine(string.Create(Inv, $"  Exitance σT⁴            {exitance:0.####e+0} W/m²   (grey body: {eps * exitance:0.####e+0} W/m²)"));
            if (net is { } n) stdout.WriteLine(string.Create(Inv, $"  Net radiated power      {n:0.####e+0} W   (area {area} m², surroundings {ambient:0.##} K)"));
            if (hasColour)
            {
                stdout.WriteLine(string.Create(Inv, $"  Chromaticity            x {chroma.X:0.0000}  y {chroma.Y:0.0000}  u' {chroma.UPrime:0.0000}  v' {chroma.VPrime:0.0000}"));
                stdout.WriteLine(string.Create(Inv, $"  CCT / Duv               {cct.CctKelvin:0} K / {cct.Duv:+0.0000;-0.0000;0.0000}   ({Radiator.ColourName(t)})"));
            }
            if (exportPath is not null) stdout.WriteLine($"  Spectrum written to     {exportPath}");
            foreach (var x in warnings) stdout.WriteLine($"! {x}");
            stdout.WriteLine(Caution);
        }
        return ExitCodes.Success;
    }

    /// <summary>The export: wavelength, ε·L (W/sr/m²/nm) and, with an approximation, its value and relative error.</summary>
    internal static string ExportCsv(double t, double eps, double from, double to, double step, PlanckApproximation approx)
    {
        var spectrum = Radiator.RadianceSpectrum(t, eps, from, to, step);
        var sb = new StringBuilder();
        sb.Append(Inv, $"# Planck spectral radiance of a grey body at {t} K, emissivity {eps} (CODATA 2018 constants), written by lumen blackbody\n");
        sb.Append("# unit: W/sr/m2/nm\n");
        string name = spectrum.Name;
        string approxName = approx == PlanckApproximation.Wien ? "wien" : "rayleigh_jeans";
        sb.Append("wavelength_nm,").Append(name);
        if (approx != PlanckApproximation.None) sb.Append(',').Append(approxName).Append(',').Append(approxName).Append("_relative_error");
        sb.Append('\n');
        for (int i = 0; i < spectrum.Count; i++)
        {
            double wl = spectrum.WavelengthsNm[i], l = spectrum.Values[i];
            sb.Append(wl.ToString("0.###", Inv)).Append(',').Append(l.ToString("R", Inv));
            if (approx != PlanckApproximation.None)
            {
                double la = eps * Radiator.RadianceNm(wl, t, approx);
                sb.Append(',').Append(la.ToString("R", Inv)).Append(',').Append((l > 0 ? la / l - 1 : double.NaN).ToString("R", Inv));
            }
            sb.Append('\n');
        }
        return sb.ToString();
    }

    private int Fail(string message)
    {
        stderr.WriteLine($"lumen blackbody: {message}");
        return ExitCodes.UsageOrInputError;
    }
}

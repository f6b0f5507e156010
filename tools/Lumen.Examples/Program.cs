using System.Globalization;
using System.Text;
using Lumen.Cie;
using Lumen.Colorimetry;
using Lumen.Spectra;
using Lumen.Temperature;
using Lumen.Synthetic;

// Writes the bundled example data (an invented scenario; see examples/README.md).
// Usage: dotnet run --project tools/Lumen.Examples -- [examples-folder]
//        dotnet run --project tools/Lumen.Examples -- batch OUT.csv ROWS [SEED] [--faults]
// Deterministic: every random draw comes from the fixed seeds below.
if (args.Length > 0 && args[0] == "batch")
{
    BatchFile.Write(args[1], int.Parse(args[2], System.Globalization.CultureInfo.InvariantCulture),
        args.Length > 3 && int.TryParse(args[3], out var seed) ? seed : 1, args.Contains("--faults"));
    return;
}
var dir = args.Length > 0 ? args[0] : "examples";
Directory.CreateDirectory(dir);
var inv = CultureInfo.InvariantCulture;
var grid1 = SyntheticSpectra.Grid(380, 780, 1);

// Tune a model to a target CCT and Duv (blue weight sets CCT, red weight sets Duv).
PhosphorLedModel Tune(double cct, double duv, double bluePeak, double greenPeak)
{
    double blue = 0.8, red = 0.6;
    for (int it = 0; it < 60; it++)
    {
        var m = new PhosphorLedModel(bluePeak, 20, blue, greenPeak, 110, 625, 85, red);
        var r = Solve(m);
        blue *= Math.Exp(0.8 * (1e6 / r.CctKelvin - 1e6 / cct) / -250.0 * -1);
        red *= Math.Exp(40 * (r.Duv - duv));
    }
    return new PhosphorLedModel(bluePeak, 20, blue, greenPeak, 110, 625, 85, red);
}

CctResult Solve(PhosphorLedModel m) =>
    CctSolver.Solve(Colorimeter.Relative(SyntheticSpectra.PhosphorLed(m, grid1, "t"), Observer.Cie1931TwoDegree).Chromaticity);

// 1. Six production samples of the 3000 K downlight, 1 nm, comma-separated, with header.
var baseModel = Tune(3000, 0.0005, 451, 552);
var rng = new Random(20261201);
var samples = new List<Spectrum>();
for (int k = 1; k <= 6; k++)
{
    var m = baseModel with
    {
        BluePeakNm = baseModel.BluePeakNm + (rng.NextDouble() - 0.5) * 2,
        BlueWeight = baseModel.BlueWeight * (1 + (rng.NextDouble() - 0.5) * 0.06),
        RedWeight = baseModel.RedWeight * (1 + (rng.NextDouble() - 0.5) * 0.06),
    };
    if (k == 5) m = m with { RedWeight = m.RedWeight * 0.72 }; // one unit drifts greenish
    samples.Add(SyntheticSpectra.WithNoise(SyntheticSpectra.PhosphorLed(m, grid1, $"DL-30-{k:000}"), 0.002, 100 + k));
}
WriteColumns(Path.Combine(dir, "quillfern-downlights-3000K.csv"), samples, ',', "relative",
    "Quillfern Lighting Works (fictional) — DL-30 warm-white downlight, six production samples, 1 nm");

// 2. The venue's existing halogen reference lamp: near-Planckian at 2900 K, 5 nm, semicolon with decimal comma.
var halogen = SyntheticSpectra.WithNoise(SyntheticSpectra.Blackbody(2900, SyntheticSpectra.Grid(380, 780, 5), "stage-halogen"), 0.001, 7);
WriteColumns(Path.Combine(dir, "marrowby-stage-halogen.csv"), [halogen], ';', "relative",
    "Marrowby Civic Hall (fictional) — existing stage halogen reference, 5 nm, semicolon-delimited with decimal comma", decimalComma: true);

// 3. A 4000 K office panel measured with an array spectrometer: irregular 0.7 nm pixels, tab-separated, irradiance.
var pix = new List<double>();
for (double w = 360.3; w <= 830; w += 0.7 + 0.02 * Math.Sin(w / 40)) pix.Add(Math.Round(w, 3));
var panel = SyntheticSpectra.PhosphorLed(Tune(4000, 0.001, 448, 545), pix.ToArray(), "office-panel-4000K").Scale(0.0125);
WriteColumns(Path.Combine(dir, "foyer-panel-4000K.tsv"), [SyntheticSpectra.WithNoise(panel, 0.003, 99)], '\t', "W/m2/nm",
    "Marrowby Civic Hall (fictional) — foyer panel, array spectrometer pixels (irregular grid), spectral irradiance");

Directory.CreateDirectory(Path.Combine(dir, "batch"));
BatchFile.Write(Path.Combine(dir, "batch", "quillfern-dl30-lot-A17.csv"), 240, 17, faults: true);
Console.WriteLine($"wrote {Path.Combine(dir, "batch", "quillfern-dl30-lot-A17.csv")}");

// 5. Matching sources on set: the Marrowby Civic Hall film night (fictional). A tungsten-like key light, an LED panel fill
//    and daylight through the foyer window, 1 nm, 360–830 nm, in one file; and invented correction filters.
Directory.CreateDirectory(Path.Combine(dir, "compare"));
var grid360 = SyntheticSpectra.Grid(360, 830, 1);
var key = SyntheticSpectra.WithNoise(SyntheticSpectra.Blackbody(3150, grid360, "key-tungsten-3150K"), 0.001, 31);
var fill = SyntheticSpectra.WithNoise(SyntheticSpectra.PhosphorLed(Tune(5400, 0.004, 452, 548), grid360, "fill-led-panel"), 0.002, 32);
var daylightValues = Lumen.Rendition.ReferenceIlluminants.Daylight(5900, 360, 1, grid360.Length);
var window = SyntheticSpectra.WithNoise(new Spectrum(grid360, daylightValues, SpectralUnit.Relative, "foyer-window-daylight", SpectrumOrigin.Generated("CIE daylight 5900 K")), 0.003, 33);
WriteColumns(Path.Combine(dir, "compare", "film-night-sources.csv"), [key, fill, window], ',', "relative",
    "Marrowby Civic Hall (fictional) film night — key light, LED fill panel and window daylight, 1 nm");

// Filters: smooth invented curves. A conversion filter of x MK⁻¹ follows exp(−c2·x·10⁻⁶/λ) (the ratio of two Wien
// radiators, so it shifts a thermal source by about x mired), scaled to a peak transmittance of 0.92; tint filters dip
// (or lift) the green. One file is written in percent to show that percent is detected.
var grid5 = SyntheticSpectra.Grid(360, 830, 5);
Spectrum Conversion(string name, double mired) =>
    new(grid5, grid5.Select(w => Math.Exp(-0.014388 * mired / (w * 1e-9) * 1e-6)).Select((t, _) => t).ToArray() is var raw
        ? raw.Select(t => 0.92 * t / raw.Max()).ToArray() : [], SpectralUnit.Relative, name, SpectrumOrigin.Generated(name));
Spectrum Tint(string name, double depth) =>
    new(grid5, grid5.Select(w => 0.9 * (1 - depth * Math.Exp(-Math.Pow((w - 535) / 45.0, 2) / 2))).ToArray(), SpectralUnit.Relative, name, SpectrumOrigin.Generated(name));
var filterDir = Path.Combine(dir, "compare", "filters");
Directory.CreateDirectory(filterDir);
foreach (var f in new[] { Conversion("warm-eighth", 20), Conversion("warm-quarter", 40), Conversion("warm-half", 80), Conversion("warm-full", 160),
             Conversion("cool-quarter", -30), Conversion("cool-half", -65), Tint("magenta-quarter", 0.12), Tint("magenta-half", 0.24), Tint("green-quarter", -0.10) })
    WriteColumns(Path.Combine(filterDir, f.Name + ".csv"), [f], ',', "relative", $"Invented correction filter '{f.Name}' (transmittance, 0–1)");
var pct = Conversion("warm-three-quarter-pct", 120).Scale(100);
WriteColumns(Path.Combine(filterDir, "warm-three-quarter-pct.csv"), [pct], ',', "relative", "Invented correction filter 'warm-three-quarter-pct' (transmittance in percent, 0–100)");

// 6. A five-channel tunable wash for the hall's stage (fictional: Quillfern "TW-5"): red, green, blue, amber and a broad
//    phosphor lime channel, each measured at full output, 1 nm, relative (same scale for all channels).
Directory.CreateDirectory(Path.Combine(dir, "mix"));
Spectrum Emitter(string name, double peak, double width, double height, int seed) =>
    SyntheticSpectra.WithNoise(new Spectrum(grid1, grid1.Select(w => height * Math.Exp(-Math.Pow((w - peak) / width, 2) / 2)).ToArray(), SpectralUnit.Relative, name, SpectrumOrigin.Generated(name)), 0.002, seed);
var limeModel = new PhosphorLedModel(450, 18, 0.08, 552, 95, 610, 70, 0.25);
var tw5 = new[]
{
    Emitter("red", 628, 9.5, 0.95, 41), Emitter("green", 522, 15, 0.75, 42), Emitter("blue", 452, 9, 1.0, 43),
    Emitter("amber", 593, 7.5, 0.55, 44), SyntheticSpectra.WithNoise(SyntheticSpectra.PhosphorLed(limeModel, grid1, "lime").Scale(0.9), 0.002, 45),
};
WriteColumns(Path.Combine(dir, "mix", "quillfern-tw5-channels.csv"), tw5, ',', "relative",
    "Quillfern Lighting Works (fictional) TW-5 tunable wash — five channels measured at full output, 1 nm");

void WriteColumns(string path, IReadOnlyList<Spectrum> spectra, char delim, string unit, string title, bool decimalComma = false)
{
    var sb = new StringBuilder();
    sb.Append("# ").Append(title).Append('\n');
    sb.Append("# Invented demonstration data generated by tools/Lumen.Examples (not a measurement of any real product).\n");
    sb.Append("# unit: ").Append(unit).Append('\n');
    sb.Append("wavelength_nm");
    foreach (var s in spectra) sb.Append(delim).Append(s.Name);
    sb.Append('\n');
    var w = spectra[0].WavelengthsNm;
    for (int i = 0; i < w.Length; i++)
    {
        sb.Append(Fmt(w[i]));
        foreach (var s in spectra) sb.Append(delim).Append(Fmt(s.Values[i]));
        sb.Append('\n');
    }
    File.WriteAllText(path, sb.ToString());
    Console.WriteLine($"wrote {path}");

    string Fmt(double v)
    {
        var t = v.ToString("0.######", inv);
        return decimalComma ? t.Replace('.', ',') : t;
    }
}

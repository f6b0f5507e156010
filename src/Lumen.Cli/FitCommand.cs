using System.CommandLine;
using System.Globalization;
using System.Text;
using System.Text.Json;
using Lumen.Blackbody;
using Lumen.Formats;

namespace Lumen.Cli;

/// <summary><c>lumen fit FILE</c>: grey-body temperature of thermal sources by least squares.</summary>
internal sealed class FitCommand(TextReader stdin, TextWriter stdout, TextWriter stderr)
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    public Argument<string[]> Files { get; } = new("files") { Description = "Spectrum files ('-' for standard input).", Arity = ArgumentArity.OneOrMore };
    public Option<bool> Slope { get; } = new("--emissivity-slope") { Description = "Also fit a slowly varying (linear) emissivity." };
    public Option<string> Format { get; } = new("--format") { Description = "Output format: text or json.", DefaultValueFactory = _ => "text" };

    public const string Caution = "Caution: a temperature from a spectral fit is an estimate of the radiator's distribution temperature, not a surface-temperature measurement; hot surfaces burn — use proper thermometry for safety decisions.";

    public Command Build()
    {
        Format.AcceptOnlyFromAmong("text", "json");
        var cmd = new Command("fit", "Fit a grey body (Planck × constant, optionally × a linear emissivity) to measured spectra and report the temperature with a 95 % interval.")
        {
            Files, Slope, Format,
        };
        cmd.SetAction(Execute);
        return cmd;
    }

    private int Execute(ParseResult parse)
    {
        bool slope = parse.GetValue(Slope);
        var results = new List<(SpectrumRecord Record, GreyBodyFitResult? Fit)>();
        foreach (var f in parse.GetValue(Files) ?? [])
        {
            foreach (var rec in SpectrumFiles.Read(f, null, stdin))
            {
                if (rec.Spectrum is null) { stderr.WriteLine($"lumen: {rec.Error}"); results.Add((rec, null)); continue; }
                results.Add((rec, GreyBodyFit.Fit(rec.Spectrum, slope)));
            }
        }
        if (parse.GetValue(Format) == "json")
        {
            using var ms = new MemoryStream();
            using (var w = new Utf8JsonWriter(ms, new JsonWriterOptions { Indented = true, Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping }))
            {
                w.WriteStartArray();
                foreach (var (rec, fit) in results)
                {
                    w.WriteStartObject();
                    w.WriteString("name", rec.Name);
                    w.WriteString("source", rec.Source);
                    w.WriteNumber("column", rec.Column);
                    if (fit is null)
                    {
                        w.WriteStartObject("error");
                        w.WriteNumber("line", rec.Error!.Line); w.WriteNumber("column", rec.Error.Column); w.WriteString("message", rec.Error.Message);
                        w.WriteEndObject();
                    }
                    else
                    {
                        w.WriteNumber("temperatureK", fit.TemperatureKelvin);
                        w.WriteNumber("temperatureLowK", fit.TemperatureLowKelvin);
                        w.WriteNumber("temperatureHighK", fit.TemperatureHighKelvin);
                        w.WriteNumber("residual", fit.RelativeResidual);
                        w.WriteBoolean("thermal", fit.Thermal);
                        w.WriteNumber("scale", fit.Scale);
                        w.WriteNumber("emissivitySlopePer100Nm", fit.EmissivitySlopePer100Nm);
                        w.WriteStartObject("bandNm"); w.WriteNumber("first", fit.BandFirstNm); w.WriteNumber("last", fit.BandLastNm); w.WriteEndObject();
                        w.WriteString("message", Message(fit));
                    }
                    w.WriteEndObject();
                }
                w.WriteEndArray();
            }
            stdout.WriteLine(Encoding.UTF8.GetString(ms.ToArray()));
        }
        else
        {
            foreach (var (rec, fit) in results)
            {
                if (fit is null) { stdout.WriteLine($"{rec.Name}: ERROR {rec.Error}"); continue; }
                stdout.WriteLine(string.Create(Inv, $"{rec.Name}: {fit.TemperatureKelvin:0} K (95 % interval {fit.TemperatureLowKelvin:0}–{fit.TemperatureHighKelvin:0} K), residual {fit.RelativeResidual * 100:0.0} % — {Message(fit)}"));
            }
            stdout.WriteLine(Caution);
        }
        return results.Any(r => r.Fit is null) ? ExitCodes.UsageOrInputError : ExitCodes.Success;
    }

    private static string Message(GreyBodyFitResult fit) => fit.Thermal
        ? "a grey body describes this spectrum"
        : string.Create(CultureInfo.InvariantCulture, $"NOT a thermal source: the grey body misses the data by {fit.RelativeResidual * 100:0} % RMS (LED, fluorescent or filtered light?), so this temperature is meaningless");
}

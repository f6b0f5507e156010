using System.CommandLine;
using Lumen.Assessment;
using Lumen.Cie;
using Lumen.Formats;
using Lumen.Spectra;

namespace Lumen.Cli;

/// <summary><c>lumen analyze FILE...</c>: colorimetry and CCT/Duv for every spectrum in the files.</summary>
internal sealed class AnalyzeCommand(TextReader stdin, TextWriter stdout, TextWriter stderr)
{
    public Argument<string[]> Files { get; } = new("files")
    {
        Description = "Spectrum files (delimited text: wavelength column in nm, one spectrum per column); '-' reads standard input.",
        Arity = ArgumentArity.OneOrMore,
    };

    public Option<string> ObserverOption { get; } = new("--observer")
    {
        Description = "Observer for XYZ and chromaticity: 2 (CIE 1931) or 10 (CIE 1964). CCT/Duv always use 2°.",
        DefaultValueFactory = _ => "2",
    };

    public Option<string> FormatOption { get; } = new("--format")
    {
        Description = "Output format: text, json or csv.",
        DefaultValueFactory = _ => "text",
    };

    public Option<string?> OutputOption { get; } = new("--output", "-o")
    {
        Description = "Write results to this file instead of standard output.",
    };

    public Option<string?> UnitOption { get; } = new("--unit")
    {
        Description = "Unit of the values when the file does not say: relative, W/m2/nm, W/sr/m2/nm, W/sr/nm or W/nm.",
    };

    public Option<bool> DetailOption { get; } = new("--detail")
    {
        Description = "With text output: every result of each spectrum after the table (R1–R14, hue bins, photometry, CIE S 026, descriptors).",
    };

    public Option<string> C2Option { get; } = new("--c2")
    {
        Description = "Second radiation constant for the Planckian locus: cie15 (1.4388e-2 m·K, default) or codata (CODATA 2018, CCT +16 ppm lower).",
        DefaultValueFactory = _ => "cie15",
    };

    public Option<string> MetricsOption { get; } = new("--metrics")
    {
        Description = "Result groups, comma-separated: colorimetry, cri, fidelity (tm30), photometry, nonvisual, spectral, all. Default: all.",
        DefaultValueFactory = _ => "all",
    };

    /// <summary>Parses a --metrics value.</summary>
    internal static bool TryParseMetrics(string text, out MetricGroups groups, out string? bad)
    {
        groups = MetricGroups.Colorimetry;
        bad = null;
        foreach (var part in text.Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries))
        {
            switch (part.ToLowerInvariant())
            {
                case "all": groups |= MetricGroups.All; break;
                case "colorimetry": case "colourimetry": break;
                case "cri": groups |= MetricGroups.Cri; break;
                case "fidelity": case "tm30": case "cie224": groups |= MetricGroups.Fidelity; break;
                case "photometry": groups |= MetricGroups.Photometry; break;
                case "nonvisual": case "non-visual": case "s026": groups |= MetricGroups.NonVisual; break;
                case "spectral": groups |= MetricGroups.Spectral; break;
                default: bad = part; return false;
            }
        }
        return true;
    }

    public Command Build()
    {
        ObserverOption.AcceptOnlyFromAmong("2", "10");
        FormatOption.AcceptOnlyFromAmong("text", "json", "csv");
        C2Option.AcceptOnlyFromAmong("cie15", "codata");
        var cmd = new Command("analyze", "Chromaticity (XYZ, xy, u'v'), CCT, Duv and colour rendition (Ra, R1–R14, Rf, Rg) of every spectrum in the files.")
        {
            Files, ObserverOption, FormatOption, OutputOption, UnitOption, MetricsOption, C2Option, DetailOption,
        };
        cmd.SetAction(Execute);
        return cmd;
    }

    private int Execute(ParseResult parse)
    {
        var observer = parse.GetValue(ObserverOption) == "10" ? Observer.Cie1964TenDegree : Observer.Cie1931TwoDegree;
        var format = parse.GetValue(FormatOption) switch { "json" => OutputFormat.Json, "csv" => OutputFormat.Csv, _ => OutputFormat.Text };
        SpectralUnit? unit = null;
        var unitText = parse.GetValue(UnitOption);
        if (unitText is not null)
        {
            if (!SpectralUnits.TryParse(unitText, out var u))
            {
                stderr.WriteLine($"lumen: --unit '{unitText}' is not a unit; expected relative, W/m2/nm, W/sr/m2/nm, W/sr/nm or W/nm.");
                return ExitCodes.UsageOrInputError;
            }
            unit = u;
        }
        if (!TryParseMetrics(parse.GetValue(MetricsOption) ?? "all", out var metrics, out var badMetric))
        {
            stderr.WriteLine($"lumen: --metrics: '{badMetric}' is not a metric group; expected colorimetry, cri, fidelity, photometry, nonvisual, spectral or all.");
            return ExitCodes.UsageOrInputError;
        }
        var c2 = parse.GetValue(C2Option) == "codata" ? Lumen.Blackbody.C2Convention.Codata2018 : Lumen.Blackbody.C2Convention.Cie15Its90;
        var options = new AssessmentOptions(observer, new Lumen.Temperature.CctOptions(C2: c2), metrics);
        var items = new List<AnalysisItem>();
        foreach (var file in parse.GetValue(Files) ?? [])
        {
            foreach (var record in SpectrumFiles.Read(file, unit, stdin))
            {
                if (record.Error is not null) stderr.WriteLine($"lumen: {record.Error}");
                items.Add(AnalysisItem.From(record, options));
            }
        }

        var outPath = parse.GetValue(OutputOption);
        if (outPath is null)
        {
            ResultWriters.Write(items, format, stdout, parse.GetValue(DetailOption));
        }
        else
        {
            try
            {
                using var w = new StreamWriter(outPath);
                ResultWriters.Write(items, format, w, parse.GetValue(DetailOption));
            }
            catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
            {
                stderr.WriteLine($"lumen: cannot write '{outPath}': {ex.Message}");
                return ExitCodes.UsageOrInputError;
            }
        }
        return items.Any(i => i.Result is null) ? ExitCodes.UsageOrInputError : ExitCodes.Success;
    }
}

using System.Globalization;
using Lumen.Analysis;
using Lumen.Blackbody;
using Lumen.Temperature;

namespace Lumen.Formats;

/// <summary>Writes <c>lumen blackbody</c> and <c>lumen fit</c> results (fields documented in the README).</summary>
public static class ThermalWriters
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>One fitted record: the input record and its fit, or its error.</summary>
    /// <param name="Record">The input record.</param>
    /// <param name="Fit">The fit, when the record held a spectrum.</param>
    /// <param name="Error">Why there is no fit.</param>
    public sealed record FitOutcome(InputRecord Record, GreyBodyFitResult? Fit, ReadDiagnostic? Error);

    /// <summary>The CSV and table schema of <c>lumen fit</c>.</summary>
    public static ColumnSchema<FitOutcome> FitColumns { get; } = new(
    [
        Column<FitOutcome>.Text("name", o => o.Record.Name, "Name"),
        Column<FitOutcome>.Text("source", o => o.Record.Source),
        Column<FitOutcome>.Number("column", o => o.Record.Column),
        Column<FitOutcome>.Number("temperature_k", o => o.Fit?.TemperatureKelvin, "0", "T (K)"),
        Column<FitOutcome>.Number("temperature_low_k", o => o.Fit?.TemperatureLowKelvin, "0", "95% low"),
        Column<FitOutcome>.Number("temperature_high_k", o => o.Fit?.TemperatureHighKelvin, "0", "95% high"),
        Column<FitOutcome>.Number("residual", o => o.Fit?.RelativeResidual, "0.000", "residual"),
        Column<FitOutcome>.Text("thermal", o => o.Fit is { } f ? (f.Thermal ? "yes" : "no") : null),
        Column<FitOutcome>.Number("scale", o => o.Fit?.Scale, "G4"),
        Column<FitOutcome>.Number("emissivity_slope_per_100nm", o => o.Fit?.EmissivitySlopePer100Nm, "0.000", "slope/100nm"),
        Column<FitOutcome>.Text("message", o => o.Fit?.Message),
        .. AnalysisColumns.ErrorColumns<FitOutcome>(o => o.Error),
    ]);

    /// <summary>Writes fit results.</summary>
    /// <param name="items">Outcomes in input order.</param>
    /// <param name="format">Text, JSON or CSV.</param>
    /// <param name="output">Destination.</param>
    public static void WriteFits(IReadOnlyList<FitOutcome> items, OutputFormat format, TextWriter output)
    {
        ArgumentNullException.ThrowIfNull(items);
        ArgumentNullException.ThrowIfNull(output);
        FormattedOutput.Write(items, format, output, WriteFitJson, FitColumns, WriteFitText);
    }

    private static void WriteFitJson(System.Text.Json.Utf8JsonWriter w, FitOutcome item)
    {
        var (rec, fit, error) = item;
        w.WriteStartObject();
        w.WriteString("name", rec.Name);
        w.WriteString("source", rec.Source);
        w.WriteNumber("column", rec.Column);
        if (fit is null) w.Error(error!);
        else
        {
            w.NumberOrNull("temperatureK", fit.TemperatureKelvin);
            w.NumberOrNull("temperatureLowK", fit.TemperatureLowKelvin);
            w.NumberOrNull("temperatureHighK", fit.TemperatureHighKelvin);
            w.NumberOrNull("residual", fit.RelativeResidual);
            w.WriteBoolean("thermal", fit.Thermal);
            w.NumberOrNull("scale", fit.Scale);
            w.NumberOrNull("emissivitySlopePer100Nm", fit.EmissivitySlopePer100Nm);
            w.WriteStartObject("bandNm"); w.NumberOrNull("first", fit.BandFirstNm); w.NumberOrNull("last", fit.BandLastNm); w.WriteEndObject();
            w.WriteString("message", fit.Message);
            w.StringArray("warnings", fit.Warnings);
        }
        w.WriteEndObject();
    }

    private static void WriteFitText(IReadOnlyList<FitOutcome> items, TextWriter output)
    {
        foreach (var (rec, fit, error) in items)
        {
            if (fit is null) { output.WriteLine($"{rec.Name}: ERROR {error}"); continue; }
            if (!fit.HasSignal) { output.WriteLine($"{rec.Name}: {fit.Message}"); continue; }
            string interval = double.IsFinite(fit.TemperatureLowKelvin) && double.IsFinite(fit.TemperatureHighKelvin)
                ? string.Create(Inv, $"95 % interval {fit.TemperatureLowKelvin:0}–{fit.TemperatureHighKelvin:0} K")
                : "95 % interval not available";
            output.WriteLine(string.Create(Inv, $"{rec.Name}: {fit.TemperatureKelvin:0} K ({interval}), residual {fit.RelativeResidual * 100:0.0} % — {fit.Message}"));
        }
        output.WriteLine(GreyBodyFitResult.Caution);
    }

    /// <summary>Writes a blackbody report as text or JSON.</summary>
    /// <param name="r">The report.</param>
    /// <param name="exportPath">The file the spectrum was exported to, or null.</param>
    /// <param name="json">JSON instead of text.</param>
    /// <param name="output">Destination.</param>
    public static void WriteBlackbody(BlackbodyReport r, string? exportPath, bool json, TextWriter output)
    {
        ArgumentNullException.ThrowIfNull(r);
        ArgumentNullException.ThrowIfNull(output);
        if (json)
        {
            JsonOutput.Write(output, w =>
            {
                w.WriteStartObject();
                w.NumberOrNull("temperatureK", r.TemperatureKelvin);
                w.NumberOrNull("emissivity", r.Emissivity);
                w.NumberOrNull("wienPeakNm", r.WienPeakNm);
                w.NumberOrNull("exitanceWPerM2", r.ExitanceWattsPerSquareMetre);
                w.NumberOrNull("greyExitanceWPerM2", r.GreyExitanceWattsPerSquareMetre);
                if (r.AreaSquareMetres is { } area)
                {
                    w.NumberOrNull("netPowerW", r.NetPowerWatts);
                    w.NumberOrNull("ambientK", r.AmbientKelvin);
                    w.NumberOrNull("areaM2", area);
                }
                if (r.Chromaticity is { } c && r.Cct is { } cct)
                {
                    w.WriteStartObject("chromaticity");
                    w.NumberOrNull("x", c.SmallX); w.NumberOrNull("y", c.SmallY); w.NumberOrNull("u", c.U); w.NumberOrNull("v", c.V);
                    w.NumberOrNull("uPrime", c.UPrime); w.NumberOrNull("vPrime", c.VPrime);
                    w.WriteEndObject();
                    w.WriteStartObject("cct");
                    w.NumberOrNull("kelvin", cct.CctKelvin); w.NumberOrNull("duv", cct.Duv);
                    w.WriteString("method", CctResult.Describe(cct.Method)); w.WriteString("observer", "2");
                    w.WriteEndObject();
                    w.WriteString("colourName", r.ColorName);
                }
                if (exportPath is not null) w.WriteString("export", exportPath);
                w.WriteStartObject("provenance");
                w.WriteString("constants", BlackbodyReport.Constants);
                w.WriteString("netPower", BlackbodyReport.NetPowerModel);
                w.WriteEndObject();
                w.StringArray("warnings", r.Warnings);
                w.WriteString("caution", BlackbodyReport.Caution);
                w.WriteEndObject();
            });
            return;
        }
        static string E(double? v) => v is { } x && double.IsFinite(x) ? x.ToString("0.####e+0", Inv) : "—";
        output.WriteLine(string.Create(Inv, $"Blackbody at {r.TemperatureKelvin:0.###} K (emissivity {r.Emissivity:0.###})"));
        output.WriteLine(double.IsFinite(r.WienPeakNm) ? string.Create(Inv, $"  Wien peak (per nm)      {r.WienPeakNm:0.0} nm") : "  Wien peak (per nm)      —");
        output.WriteLine($"  Exitance σT⁴            {E(r.ExitanceWattsPerSquareMetre)} W/m²   (grey body: {E(r.GreyExitanceWattsPerSquareMetre)} W/m²)");
        if (r.AreaSquareMetres is { } a) output.WriteLine(string.Create(Inv, $"  Net radiated power      {E(r.NetPowerWatts)} W   (area {a} m², surroundings {r.AmbientKelvin:0.##} K)"));
        if (r.Chromaticity is { } ch && r.Cct is { } t)
        {
            output.WriteLine(string.Create(Inv, $"  Chromaticity            x {ch.SmallX:0.0000}  y {ch.SmallY:0.0000}  u' {ch.UPrime:0.0000}  v' {ch.VPrime:0.0000}"));
            output.WriteLine(string.Create(Inv, $"  CCT / Duv               {t.CctKelvin:0} K / {t.Duv:+0.0000;-0.0000;0.0000}   ({r.ColorName})"));
        }
        if (exportPath is not null) output.WriteLine($"  Spectrum written to     {exportPath}");
        foreach (var x in r.Warnings) output.WriteLine($"! {x}");
        output.WriteLine(BlackbodyReport.Caution);
    }

    /// <summary>
    /// Writes a radiance spectrum as a CSV that <c>lumen analyze</c> reads: a comment line, a <c># unit:</c> line, then
    /// wavelength and ε·L(λ, T) in W/(sr·m²·nm) and, with an approximation, its value and relative error against Planck.
    /// </summary>
    /// <param name="output">Destination.</param>
    /// <param name="spectrum">The grey-body radiance spectrum (from <see cref="Radiator.RadianceSpectrum"/>).</param>
    /// <param name="temperatureKelvin">Its temperature, K.</param>
    /// <param name="emissivity">Its emissivity, (0, 1].</param>
    /// <param name="approximation">The approximation to add, or <see cref="PlanckApproximation.None"/>.</param>
    public static void WriteRadianceExport(TextWriter output, Lumen.Spectra.Spectrum spectrum, double temperatureKelvin, double emissivity, PlanckApproximation approximation)
    {
        ArgumentNullException.ThrowIfNull(output);
        ArgumentNullException.ThrowIfNull(spectrum);
        output.Write(string.Create(Inv, $"# Planck spectral radiance of a grey body at {temperatureKelvin} K, emissivity {emissivity} (CODATA 2018 constants), written by lumen blackbody\n"));
        output.Write("# unit: W/sr/m2/nm\n");
        string approxName = approximation == PlanckApproximation.Wien ? "wien" : "rayleigh_jeans";
        output.Write("wavelength_nm," + spectrum.Name);
        if (approximation != PlanckApproximation.None) output.Write($",{approxName},{approxName}_relative_error");
        output.Write('\n');
        for (int i = 0; i < spectrum.Count; i++)
        {
            double wl = spectrum.WavelengthsNm[i], l = spectrum.Values[i];
            output.Write(wl.ToString("0.###", Inv));
            output.Write(',');
            output.Write(l.ToString("R", Inv));
            if (approximation != PlanckApproximation.None)
            {
                double la = emissivity * Radiator.RadianceNm(wl, temperatureKelvin, approximation);
                output.Write(',');
                output.Write(la.ToString("R", Inv));
                output.Write(',');
                output.Write((l > 0 ? la / l - 1 : double.NaN).ToString("R", Inv));
            }
            output.Write('\n');
        }
    }
}

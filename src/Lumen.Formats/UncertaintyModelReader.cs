using System.Text.Json;
using Lumen.Analysis;
using Lumen.Uncertainty;

namespace Lumen.Formats;

/// <summary>
/// Reads an uncertainty model (JSON; README "Measurement uncertainty"): <c>relativeNoise</c>, <c>absoluteNoise</c>,
/// <c>relativeScale</c>, <c>smoothRelative</c> {<c>sigma</c>, <c>correlationLengthNm</c>}, <c>wavelengthShiftNm</c>,
/// <c>bandwidthNm</c> — standard uncertainties (k = 1), each optional — and optional <c>name</c> and
/// <c>description</c> texts. Strict like a specification: unknown keys, wrong types and impossible values are errors
/// naming line and column.
/// </summary>
public static class UncertaintyModelReader
{
    private static readonly HashSet<string> Keys = new(StringComparer.Ordinal) { "name", "description", "relativeNoise", "absoluteNoise", "relativeScale", "smoothRelative", "wavelengthShiftNm", "bandwidthNm" };

    /// <summary>Largest model file accepted, bytes.</summary>
    public const int MaxBytes = 64 * 1024;

    /// <summary>Reads a model file.</summary>
    /// <param name="path">Path.</param>
    /// <param name="errors">Diagnostics (empty on success).</param>
    /// <returns>The model, or null.</returns>
    public static UncertaintyModel? ReadFile(string path, out IReadOnlyList<ReadDiagnostic> errors)
    {
        if (!StrictJson.TryReadFile(path, MaxBytes, "uncertainty model", out var bytes, out var error)) { errors = [error!]; return null; }
        return Read(bytes, path, out errors);
    }

    /// <summary>Reads a model from UTF-8 bytes.</summary>
    /// <param name="utf8">The JSON text.</param>
    /// <param name="source">Name for messages.</param>
    /// <param name="errors">Diagnostics (empty on success).</param>
    /// <returns>The model, or null.</returns>
    public static UncertaintyModel? Read(byte[] utf8, string source, out IReadOnlyList<ReadDiagnostic> errors)
    {
        var list = new List<ReadDiagnostic>();
        errors = list;
        using var doc = StrictJson.Parse(utf8, source, list, out var positions);
        if (doc is null) return null;
        void Error(string path, string message)
        {
            var (line, col) = positions.TryGetValue(path, out var p) ? p : (1, 1);
            list.Add(new ReadDiagnostic(source, line, col, message));
        }
        var root = doc.RootElement;
        if (root.ValueKind != JsonValueKind.Object) { Error("", "expected a JSON object such as {\"relativeNoise\": 0.005, \"wavelengthShiftNm\": 0.1}"); return null; }
        foreach (var p in root.EnumerateObject())
            if (!Keys.Contains(p.Name)) Error("/" + p.Name, $"unknown field '{p.Name}'; expected relativeNoise, absoluteNoise, relativeScale, smoothRelative, wavelengthShiftNm, bandwidthNm, name or description");
        double Number(JsonElement parent, string key, string path)
        {
            if (!parent.TryGetProperty(key, out var v)) return 0;
            if (v.ValueKind != JsonValueKind.Number) { Error(path, $"{key} must be a number (a standard uncertainty, k = 1)"); return 0; }
            double x = v.GetDouble();
            if (!double.IsFinite(x) || x < 0) { Error(path, $"{key} must be a finite number ≥ 0"); return 0; }
            return x;
        }
        foreach (var text in new[] { "name", "description" })
            if (root.TryGetProperty(text, out var t) && t.ValueKind != JsonValueKind.String) Error("/" + text, $"{text} must be a text in quotes");
        double sigma = 0, length = 0;
        if (root.TryGetProperty("smoothRelative", out var smooth))
        {
            if (smooth.ValueKind != JsonValueKind.Object) Error("/smoothRelative", "smoothRelative must be an object {\"sigma\": 0.01, \"correlationLengthNm\": 50}");
            else
            {
                foreach (var p in smooth.EnumerateObject())
                    if (p.Name is not ("sigma" or "correlationLengthNm")) Error("/smoothRelative/" + p.Name, $"unknown field '{p.Name}'; expected sigma and correlationLengthNm");
                sigma = Number(smooth, "sigma", "/smoothRelative/sigma");
                length = Number(smooth, "correlationLengthNm", "/smoothRelative/correlationLengthNm");
            }
        }
        double? bandwidth = root.TryGetProperty("bandwidthNm", out _) ? Number(root, "bandwidthNm", "/bandwidthNm") : null;
        var model = new UncertaintyModel(Number(root, "relativeNoise", "/relativeNoise"), Number(root, "absoluteNoise", "/absoluteNoise"), Number(root, "relativeScale", "/relativeScale"),
            sigma, length, Number(root, "wavelengthShiftNm", "/wavelengthShiftNm"), bandwidth);
        if (list.Count > 0) return null;
        foreach (var problem in model.Problems()) Error("", problem);
        if (model.IsZero) Error("", "the model has no uncertainty component; give at least one of relativeNoise, absoluteNoise, relativeScale, smoothRelative, wavelengthShiftNm");
        return list.Count > 0 ? null : model;
    }
}

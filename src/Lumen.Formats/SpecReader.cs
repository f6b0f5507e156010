using Lumen.Analysis;
using System.Text.Json;
using Lumen.Conformance;

namespace Lumen.Formats;

/// <summary>
/// Reads a tolerance specification (JSON; schema in the README and examples/spec-dl30.json). Every problem
/// is a diagnostic naming the line and column.
/// </summary>
public static class SpecReader
{
    private static readonly HashSet<string> TopLevel = new(StringComparer.Ordinal) { "name", "description", "project", "client", "preparedBy", "target", "chromaticity", "limits" };

    /// <summary>Largest specification file accepted, bytes.</summary>
    public const int MaxBytes = 1024 * 1024;

    /// <summary>Reads a spec file.</summary>
    /// <param name="path">Path.</param>
    /// <param name="errors">Diagnostics (empty on success).</param>
    /// <returns>The spec, or null when it has errors.</returns>
    public static ToleranceSpec? ReadFile(string path, out IReadOnlyList<ReadDiagnostic> errors)
    {
        if (!StrictJson.TryReadFile(path, MaxBytes, "specification", out var bytes, out var error)) { errors = [error!]; return null; }
        return Read(bytes, path, out errors);
    }

    /// <summary>Reads a spec from UTF-8 bytes.</summary>
    /// <param name="utf8">The JSON text.</param>
    /// <param name="source">Name for messages.</param>
    /// <param name="errors">Diagnostics (empty on success).</param>
    /// <returns>The spec, or null when it has errors.</returns>
    public static ToleranceSpec? Read(byte[] utf8, string source, out IReadOnlyList<ReadDiagnostic> errors)
    {
        ArgumentNullException.ThrowIfNull(utf8);
        var list = new List<ReadDiagnostic>();
        errors = list;
        var doc = StrictJson.Parse(utf8, source, list, out var positions);
        if (doc is null) return null;
        using (doc)
        {
            void Error(string path, string message)
            {
                var (line, col) = positions.TryGetValue(path, out var p) ? p : (1, 1);
                list.Add(new ReadDiagnostic(source, line, col, message));
            }
            var root = doc.RootElement;
            if (root.ValueKind != JsonValueKind.Object) { Error("", "expected a JSON object with name, target, chromaticity and limits"); return null; }
            foreach (var p in root.EnumerateObject())
                if (!TopLevel.Contains(p.Name)) Error("/" + p.Name, $"unknown field '{p.Name}'; expected name, description, project, client, preparedBy, target, chromaticity or limits");

            string name = "unnamed specification";
            if (root.TryGetProperty("name", out var n))
            {
                if (n.ValueKind == JsonValueKind.String) name = n.GetString()!;
                else Error("/name", "name must be a text in quotes, e.g. \"DL-30 warm white\"");
            }
            if (root.TryGetProperty("description", out var desc) && desc.ValueKind != JsonValueKind.String) Error("/description", "description must be a text in quotes");
            string? Optional(string key)
            {
                if (!root.TryGetProperty(key, out var v)) return null;
                if (v.ValueKind == JsonValueKind.String) return v.GetString();
                Error("/" + key, $"{key} must be a text in quotes");
                return null;
            }
            string? project = Optional("project"), client = Optional("client"), preparedBy = Optional("preparedBy");
            ChromaticityTarget? target = null;
            if (root.TryGetProperty("target", out var t)) target = ReadTarget(t, Error);
            var tolerance = new ChromaticityTolerance(ToleranceKind.None, 0);
            var warnings = new List<string>();
            if (root.TryGetProperty("chromaticity", out var c)) tolerance = ReadTolerance(c, target, Error, (path, message) =>
            {
                var (line, col) = positions.TryGetValue(path, out var pp) ? pp : (1, 1);
                warnings.Add(new ReadDiagnostic(source, line, col, message).ToString());
            });
            var limits = new List<FieldLimit>();
            if (root.TryGetProperty("limits", out var l))
            {
                if (l.ValueKind != JsonValueKind.Array) Error("/limits", "limits must be an array of {\"field\", \"min\", \"max\"} objects");
                else
                {
                    int i = 0;
                    foreach (var item in l.EnumerateArray())
                    {
                        var lim = ReadLimit(item, $"/limits/{i}", Error, positions);
                        if (lim is not null) limits.Add(lim);
                        i++;
                    }
                }
            }
            if (list.Count == 0 && tolerance.Kind == ToleranceKind.None && limits.Count == 0)
                Error("", "the specification checks nothing: give a chromaticity tolerance (with a target) or at least one limit");
            if (list.Count > 0) return null;
            return new ToleranceSpec(name, target, tolerance, limits) { Warnings = warnings, Project = project, Client = client, PreparedBy = preparedBy };
        }
    }

    private static ChromaticityTarget? ReadTarget(JsonElement t, Action<string, string> error)
    {
        if (t.ValueKind != JsonValueKind.Object) { error("/target", "target must be an object: {\"nominalCct\": 3000}, {\"x\": …, \"y\": …}, {\"uPrime\": …, \"vPrime\": …} or {\"cct\": …, \"duv\": …}"); return null; }
        var names = t.EnumerateObject().Select(p => p.Name).ToHashSet(StringComparer.Ordinal);
        double Num(string field)
        {
            if (t.GetProperty(field).ValueKind != JsonValueKind.Number || !double.IsFinite(t.GetProperty(field).GetDouble()))
            { error($"/target/{field}", $"target.{field} must be a number within the range of double precision"); return double.NaN; }
            return t.GetProperty(field).GetDouble();
        }
        if (names.SetEquals(["nominalCct"]) || names.SetEquals(["nominalCct", "edition"]))
        {
            double v = Num("nominalCct");
            var edition = AnsiEdition.Ed2017;
            if (t.TryGetProperty("edition", out var ed))
            {
                string? e = ed.ValueKind == JsonValueKind.String ? ed.GetString() : ed.ValueKind == JsonValueKind.Number ? ed.GetRawText() : null;
                if (e is "2008") edition = AnsiEdition.Ed2008;
                else if (e is not ("2015" or "2017")) { error("/target/edition", "edition must be \"2008\" or \"2017\" (2015 builds like 2017)"); return null; }
            }
            if (!double.IsFinite(v) || v != Math.Floor(v) || !AnsiC78377.TryGetCategory((int)v, edition, out _))
            {
                error("/target/nominalCct", edition == AnsiEdition.Ed2008
                    ? $"no ANSI C78.377-2008 category for {v} K; expected 2700, 3000, 3500, 4000, 4500, 5000, 5700 or 6500"
                    : $"no ANSI C78.377 category for {v} K; expected 2200, 2500, 2700, 3000, 3500, 4000, 4500, 5000, 5700, 6500 or a flexible value 2700–6500 K in 100 K steps");
                return null;
            }
            return new ChromaticityTarget(TargetKind.NominalCct, v, 0, edition);
        }
        if (names.SetEquals(["x", "y"]))
        {
            double x = Num("x"), y = Num("y");
            if (!(x > 0 && x < 1 && y > 0 && y < 1 && x + y < 1)) { error("/target/x", $"target x = {x}, y = {y} is not a chromaticity; expected 0 < x, y and x + y < 1"); return null; }
            return new ChromaticityTarget(TargetKind.Xy, x, y);
        }
        if (names.SetEquals(["uPrime", "vPrime"]))
        {
            double u = Num("uPrime"), v = Num("vPrime");
            if (!(u > 0 && u < 0.7 && v > 0 && v < 0.7)) { error("/target/uPrime", "target u', v' must lie inside the CIE 1976 diagram (0–0.7)"); return null; }
            return new ChromaticityTarget(TargetKind.UPrimeVPrime, u, v);
        }
        if (names.SetEquals(["cct", "duv"]))
        {
            double cct = Num("cct"), duv = Num("duv");
            if (!(cct >= 1000 && cct <= 100000)) { error("/target/cct", $"target cct {cct} K is outside 1000–100000 K"); return null; }
            if (!(Math.Abs(duv) <= 0.05)) { error("/target/duv", $"target duv {duv} is outside ±0.05, where CCT is not meaningful"); return null; }
            return new ChromaticityTarget(TargetKind.CctDuv, cct, duv);
        }
        error("/target", $"target has fields {{{string.Join(", ", names)}}}; expected exactly one of: nominalCct | x, y | uPrime, vPrime | cct, duv");
        return null;
    }

    private static ChromaticityTolerance ReadTolerance(JsonElement c, ChromaticityTarget? target, Action<string, string> error, Action<string, string> warn)
    {
        var none = new ChromaticityTolerance(ToleranceKind.None, 0);
        if (c.ValueKind != JsonValueKind.Object) { error("/chromaticity", "chromaticity must be an object: {\"ellipseSteps\": 3} | {\"quadrangle\": true} | {\"uPrimeVPrimeRadius\": 0.003}"); return none; }
        var props = c.EnumerateObject().ToArray();
        if (props.Length != 1) { error("/chromaticity", "chromaticity needs exactly one of ellipseSteps, quadrangle, uPrimeVPrimeRadius"); return none; }
        var p = props[0];
        if (target is null) { error("/chromaticity", "a chromaticity tolerance needs a target"); return none; }
        switch (p.Name)
        {
            case "quadrangle":
                if (p.Value.ValueKind != JsonValueKind.True) { error("/chromaticity/quadrangle", "quadrangle must be true"); return none; }
                if (target.Kind != TargetKind.NominalCct) { error("/chromaticity/quadrangle", "a quadrangle needs a nominalCct target (ANSI C78.377 category)"); return none; }
                return new ChromaticityTolerance(ToleranceKind.Quadrangle, 0);
            case "ellipseSteps":
                if (p.Value.ValueKind != JsonValueKind.Number || !(p.Value.GetDouble() > 0 && p.Value.GetDouble() <= 20))
                { error("/chromaticity/ellipseSteps", "ellipseSteps must be a number of steps in (0, 20]"); return none; }
                return new ChromaticityTolerance(ToleranceKind.EllipseSteps, p.Value.GetDouble());
            case "uPrimeVPrimeRadius":
            case "duvRadius":
            case "uvRadius":
                if (p.Name != "uPrimeVPrimeRadius")
                    warn($"/chromaticity/{p.Name}", $"'{p.Name}' is deprecated (it is a Δu'v' radius, not a Duv); write 'uPrimeVPrimeRadius' instead");
                if (p.Value.ValueKind != JsonValueKind.Number || !(p.Value.GetDouble() > 0 && p.Value.GetDouble() <= 0.05))
                { error($"/chromaticity/{p.Name}", $"{p.Name} must be a Δu'v' radius in (0, 0.05]"); return none; }
                return new ChromaticityTolerance(ToleranceKind.UPrimeVPrimeRadius, p.Value.GetDouble());
            default:
                error($"/chromaticity/{p.Name}", $"unknown chromaticity tolerance '{p.Name}'; expected ellipseSteps, quadrangle or uPrimeVPrimeRadius");
                return none;
        }
    }

    private static FieldLimit? ReadLimit(JsonElement item, string path, Action<string, string> error, Dictionary<string, (int Line, int Column)> positions)
    {
        int line = positions.TryGetValue(path, out var pos) ? pos.Line : 0;
        if (item.ValueKind != JsonValueKind.Object) { error(path, "each limit must be an object {\"field\": …, \"min\": …, \"max\": …}"); return null; }
        foreach (var p in item.EnumerateObject())
            if (p.Name is not ("field" or "min" or "max")) { error($"{path}/{p.Name}", $"unknown key '{p.Name}' in a limit; expected field, min, max"); return null; }
        if (!item.TryGetProperty("field", out var f) || f.ValueKind != JsonValueKind.String) { error(path, "a limit needs \"field\": a path into the analyze JSON, e.g. \"cri.ra\""); return null; }
        string field = f.GetString()!;
        if (field.Contains('[', StringComparison.Ordinal))
        {
            // 0-based index syntax silently checked the wrong quantity (cri.r[9] is R10); fields now number from 1.
            string? meant = ResultFields.FromIndexSyntax(field);
            error($"{path}/field", meant is null
                ? $"'{field}': index syntax is not accepted; fields number from 1 as the trade does, e.g. cri.r9 (R9), fidelity.hueBin1.rcs, fidelity.rfCes5"
                : $"'{field}': index syntax is not accepted (it counted from 0: this was {meant.Replace("cri.r", "R", StringComparison.Ordinal)}); write '{meant}' — fields number from 1 as the trade does");
            return null;
        }
        if (!ResultFields.IsKnown(field))
        {
            var hint = ResultFields.Paths.Where(x => x.StartsWith(field.Split('.')[0], StringComparison.Ordinal)).Take(6);
            error($"{path}/field", $"unknown field '{field}'; expected a numeric path such as cri.ra, cri.r9, fidelity.rf, cct.duv{(hint.Any() ? " (known here: " + string.Join(", ", hint) + ", …)" : "")}");
            return null;
        }
        double? min = null, max = null;
        if (item.TryGetProperty("min", out var mn)) { if (mn.ValueKind != JsonValueKind.Number) { error($"{path}/min", "min must be a number"); return null; } min = mn.GetDouble(); if (!double.IsFinite(min.Value)) { error($"{path}/min", "min is beyond the range of double precision"); return null; } }
        if (item.TryGetProperty("max", out var mx)) { if (mx.ValueKind != JsonValueKind.Number) { error($"{path}/max", "max must be a number"); return null; } max = mx.GetDouble(); if (!double.IsFinite(max.Value)) { error($"{path}/max", "max is beyond the range of double precision"); return null; } }
        if (min is null && max is null) { error(path, $"limit on '{field}' has neither min nor max"); return null; }
        if (min is { } a && max is { } b && a > b) { error(path, $"impossible limit on '{field}': min {a} is above max {b}"); return null; }
        return new FieldLimit(field, min, max, line);
    }
}

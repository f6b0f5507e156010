using System.CommandLine;
using System.Globalization;
using System.Text;
using System.Text.Json;
using Lumen.Conformance;
using Lumen.Formats;

namespace Lumen.Cli;

/// <summary>
/// A tolerance specification from a file (<c>--spec</c>) or from options — a target, a chromaticity tolerance and
/// <c>--min</c>/<c>--max</c> limits — which are turned into the same JSON and read by the same reader, so both ways are
/// checked alike; <c>--print-spec</c> shows that JSON.
/// </summary>
internal sealed class SpecOptions(bool required)
{
    public Option<string?> Spec { get; } = new("--spec") { Description = "Tolerance specification (JSON; see examples/batch/spec-dl30.json)." };
    public Option<int?> NominalCct { get; } = new Option<int?>("--nominal-cct") { Description = "Target: an ANSI C78.377 nominal CCT category, K (e.g. 3000)." }.StrictWhole("3000");
    public Option<string?> TargetXy { get; } = new("--target-xy") { Description = "Target: a CIE 1931 chromaticity 'x,y'." };
    public Option<double?> TargetCct { get; } = new Option<double?>("--target-cct") { Description = "Target: a CCT in K (with --target-duv, default 0)." }.Strict();
    public Option<double> TargetDuv { get; } = new Option<double>("--target-duv") { Description = "Target Duv with --target-cct.", DefaultValueFactory = _ => 0 }.Strict();
    public Option<double?> Steps { get; } = new Option<double?>("--steps") { Description = "Chromaticity tolerance: within N steps of the target's ellipse." }.Strict();
    public Option<bool> Quadrangle { get; } = new("--quadrangle") { Description = "Chromaticity tolerance: inside the ANSI C78.377 quadrangle of --nominal-cct." };
    public Option<double?> Radius { get; } = new Option<double?>("--radius") { Description = "Chromaticity tolerance: within this Δu′v′ of the target." }.Strict();
    public Option<string?> Min { get; } = new("--min") { Description = "Lower limits, e.g. ra=80,r9=0,rf=85 (short names: ra, r1…r14, rf, rg, cct, duv, ler; or any field path)." };
    public Option<string?> Max { get; } = new("--max") { Description = "Upper limits, e.g. duv=0.006." };
    public Option<bool> PrintSpec { get; } = new("--print-spec") { Description = "Print the specification the options make, as JSON, and stop." };

    private static readonly Dictionary<string, string> ShortNames = new(StringComparer.OrdinalIgnoreCase)
    {
        ["ra"] = "cri.ra", ["rf"] = "fidelity.rf", ["rg"] = "fidelity.rg", ["cct"] = "cct.kelvin", ["duv"] = "cct.duv",
        ["ler"] = "photometry.ler", ["mel-der"] = "nonVisual.melanopic.der",
    };

    public void AddTo(Command command)
    {
        foreach (var o in new Option[] { Spec, NominalCct, TargetXy, TargetCct, TargetDuv, Steps, Quadrangle, Radius, Min, Max, PrintSpec }) command.Add(o);
    }

    private bool AnyInline(ParseResult p) =>
        p.GetValue(NominalCct) is not null || p.GetValue(TargetXy) is not null || p.GetValue(TargetCct) is not null || p.GetValue(Steps) is not null
        || p.GetValue(Quadrangle) || p.GetValue(Radius) is not null || p.GetValue(Min) is not null || p.GetValue(Max) is not null;

    /// <summary>
    /// Reads the specification. Returns false on a usage error (written to stderr); <paramref name="spec"/> is null when
    /// none was given (allowed unless the verb requires one); <paramref name="printed"/> is true when --print-spec answered.
    /// </summary>
    public bool TryLoad(ParseResult parse, TextWriter stdout, TextWriter stderr, out PreparedSpec? spec, out bool printed)
    {
        spec = null;
        printed = false;
        bool inline = AnyInline(parse);
        if (parse.GetValue(Spec) is { } path)
        {
            if (inline) { stderr.WriteLine("lumen: give --spec or the specification options (--nominal-cct, --steps, --min, …), not both."); return false; }
            if (parse.GetValue(PrintSpec)) { stderr.WriteLine("lumen: --print-spec prints the specification made from options; the file is already JSON."); return false; }
            return CommonOptions.TryLoadSpec(path, stderr, out spec);
        }
        if (!inline)
        {
            if (required) { stderr.WriteLine("lumen: give a specification: --spec FILE, or a target and limits (e.g. --nominal-cct 3000 --steps 3 --min ra=80,r9=0)."); return false; }
            return true;
        }
        if (!TryBuildJson(parse, stderr, out var json)) return false;
        if (parse.GetValue(PrintSpec)) { stdout.WriteLine(json); printed = true; return true; }
        var s = SpecReader.Read(Encoding.UTF8.GetBytes(json), "(command-line specification)", out var errors);
        if (s is null)
        {
            foreach (var e in errors) stderr.WriteLine($"lumen: {e.Message} (from the specification options; see it with --print-spec)");
            return false;
        }
        spec = new PreparedSpec(s);
        return true;
    }

    private bool TryBuildJson(ParseResult p, TextWriter stderr, out string json)
    {
        json = "";
        using var ms = new MemoryStream();
        using (var w = new Utf8JsonWriter(ms, new JsonWriterOptions { Indented = true }))
        {
            w.WriteStartObject();
            w.WriteString("name", "command-line specification");
            int targets = (p.GetValue(NominalCct) is not null ? 1 : 0) + (p.GetValue(TargetXy) is not null ? 1 : 0) + (p.GetValue(TargetCct) is not null ? 1 : 0);
            if (targets > 1) { stderr.WriteLine("lumen: give one target: --nominal-cct, --target-xy or --target-cct."); return false; }
            if (p.GetValue(NominalCct) is { } n) { w.WriteStartObject("target"); w.WriteNumber("nominalCct", n); w.WriteEndObject(); }
            else if (p.GetValue(TargetXy) is { } xy)
            {
                var parts = xy.Split(',');
                if (parts.Length != 2 || !CommonOptions.TryParseNumber(parts[0].Trim(), out var x) || !CommonOptions.TryParseNumber(parts[1].Trim(), out var y))
                { stderr.WriteLine($"lumen: --target-xy '{xy}' is not 'x,y'."); return false; }
                w.WriteStartObject("target"); w.WriteNumber("x", x); w.WriteNumber("y", y); w.WriteEndObject();
            }
            else if (p.GetValue(TargetCct) is { } t) { w.WriteStartObject("target"); w.WriteNumber("cct", t); w.WriteNumber("duv", p.GetValue(TargetDuv)); w.WriteEndObject(); }
            int tolerances = (p.GetValue(Steps) is not null ? 1 : 0) + (p.GetValue(Quadrangle) ? 1 : 0) + (p.GetValue(Radius) is not null ? 1 : 0);
            if (tolerances > 1) { stderr.WriteLine("lumen: give one chromaticity tolerance: --steps, --quadrangle or --radius."); return false; }
            if (tolerances == 1)
            {
                w.WriteStartObject("chromaticity");
                if (p.GetValue(Steps) is { } st) w.WriteNumber("ellipseSteps", st);
                else if (p.GetValue(Quadrangle)) w.WriteBoolean("quadrangle", true);
                else w.WriteNumber("uPrimeVPrimeRadius", p.GetValue(Radius)!.Value);
                w.WriteEndObject();
            }
            var limits = new SortedDictionary<string, (double? Min, double? Max)>(StringComparer.Ordinal);
            foreach (var (text, isMin) in new[] { (p.GetValue(Min), true), (p.GetValue(Max), false) })
            {
                if (text is null) continue;
                foreach (var item in text.Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries))
                {
                    var kv = item.Split('=');
                    if (kv.Length != 2 || !CommonOptions.TryParseNumber(kv[1].Trim(), out var v))
                    { stderr.WriteLine($"lumen: {(isMin ? "--min" : "--max")} '{item}' is not NAME=NUMBER (e.g. ra=80)."); return false; }
                    string name = kv[0].Trim();
                    string field = ShortNames.TryGetValue(name, out var full) ? full
                        : System.Text.RegularExpressions.Regex.IsMatch(name, "^[rR]([1-9]|1[0-4])$") ? "cri." + name.ToLowerInvariant() : name;
                    var cur = limits.TryGetValue(field, out var c) ? c : (null, null);
                    limits[field] = isMin ? (v, cur.Max) : (cur.Min, v);
                }
            }
            if (limits.Count > 0)
            {
                w.WriteStartArray("limits");
                foreach (var (field, (mn, mx)) in limits)
                {
                    w.WriteStartObject();
                    w.WriteString("field", field);
                    if (mn is { } a) w.WriteNumber("min", a);
                    if (mx is { } b) w.WriteNumber("max", b);
                    w.WriteEndObject();
                }
                w.WriteEndArray();
            }
            w.WriteEndObject();
        }
        json = Encoding.UTF8.GetString(ms.ToArray());
        return true;
    }
}

using System.CommandLine;
using Lumen.Analysis;
using Lumen.Formats;

namespace Lumen.Cli;

/// <summary>Option factories and small helpers that several verbs share.</summary>
internal static class CommonOptions
{
    /// <summary>The --threads option: computing threads, the main one included; default all cores; 1 computes on the main thread alone.</summary>
    /// <returns>A new option.</returns>
    public static Option<int> Threads() => new Option<int>("--threads") { Description = "Computing threads, the main one included (default: all cores); 1 runs everything on one thread.", DefaultValueFactory = _ => Environment.ProcessorCount }.Strict("4");

    /// <summary>A <c>--format</c> option accepting <paramref name="formats"/> (the first is the default).</summary>
    public static Option<string> Format(params string[] formats)
    {
        var o = new Option<string>("--format") { Description = $"Output format: {string.Join(", ", formats)}.", DefaultValueFactory = _ => formats[0] };
        o.AcceptOnlyFromAmong(formats);
        return o;
    }

    /// <summary>
    /// Parses a number the one way Lumen accepts on the command line, whatever the machine's locale: invariant culture,
    /// '.' as the decimal point, an optional exponent, no thousands separators ("3000,5" is an error, not 30005), and
    /// within the range of double precision ("1e400" is an error, not infinity).
    /// </summary>
    public static bool TryParseNumber(string text, out double value) =>
        double.TryParse(text, System.Globalization.NumberStyles.Float, System.Globalization.CultureInfo.InvariantCulture, out value)
        && double.IsFinite(value);

    private static double ParseNumber(System.CommandLine.Parsing.ArgumentResult r)
    {
        var token = r.Tokens.Count > 0 ? r.Tokens[^1].Value : "";
        if (TryParseNumber(token, out double v)) return v;
        string what = r.Parent is System.CommandLine.Parsing.OptionResult o ? o.Option.Name : r.Argument.Name;
        r.AddError($"{what}: '{token}' is not a number; expected digits with '.' as the decimal point, e.g. 2856.5 or 1e-3 (no thousands separators).");
        return default;
    }

    /// <summary>Makes a numeric option parse with <see cref="TryParseNumber"/>.</summary>
    public static Option<double> Strict(this Option<double> option)
    {
        option.CustomParser = ParseNumber;
        return option;
    }

    /// <summary>Makes an optional numeric option parse with <see cref="TryParseNumber"/>.</summary>
    public static Option<double?> Strict(this Option<double?> option)
    {
        option.CustomParser = r => ParseNumber(r);
        return option;
    }

    private static T ParseWhole<T>(System.CommandLine.Parsing.ArgumentResult r, string example) where T : struct, System.Numerics.IBinaryInteger<T>
    {
        var token = r.Tokens.Count > 0 ? r.Tokens[^1].Value : "";
        if (T.TryParse(token, System.Globalization.NumberStyles.None, System.Globalization.CultureInfo.InvariantCulture, out T v)) return v;
        string what = r.Parent is System.CommandLine.Parsing.OptionResult o ? o.Option.Name : r.Argument.Name;
        r.AddError($"{what}: '{token}' is not a whole number; expected digits only, e.g. {example}.");
        return default;
    }

    /// <summary>Makes a whole-number option give Lumen's message for a bad value (not the parser's, which names a .NET type).</summary>
    /// <param name="option">The option.</param>
    /// <param name="example">A good value to show.</param>
    public static Option<T> Strict<T>(this Option<T> option, string example) where T : struct, System.Numerics.IBinaryInteger<T>
    {
        option.CustomParser = r => ParseWhole<T>(r, example);
        return option;
    }

    /// <summary>Makes an optional whole-number option give Lumen's message for a bad value.</summary>
    /// <param name="option">The option.</param>
    /// <param name="example">A good value to show.</param>
    public static Option<T?> StrictWhole<T>(this Option<T?> option, string example) where T : struct, System.Numerics.IBinaryInteger<T>
    {
        option.CustomParser = r => ParseWhole<T>(r, example);
        return option;
    }

    /// <summary>Makes a numeric argument parse with <see cref="TryParseNumber"/>.</summary>
    public static Argument<double> Strict(this Argument<double> argument)
    {
        argument.CustomParser = ParseNumber;
        return argument;
    }

    /// <summary>The output format named by a <c>--format</c> value.</summary>
    public static OutputFormat ToOutputFormat(string? text) => text switch { "json" => OutputFormat.Json, "jsonl" => OutputFormat.JsonLines, "csv" => OutputFormat.Csv, _ => OutputFormat.Text };

    /// <summary>Reports an unreadable record on standard error as <c>lumen: file:line:column: message</c>.</summary>
    public static void ReportError(TextWriter stderr, ReadDiagnostic? error)
    {
        if (error is not null) stderr.WriteLine($"lumen: {error}");
    }

    /// <summary>Loads and prepares an optional spec file; false (errors written) when it has problems.</summary>
    public static bool TryLoadSpec(string? path, TextWriter stderr, out Lumen.Conformance.PreparedSpec? spec)
    {
        spec = null;
        if (path is null) return true;
        var s = SpecReader.ReadFile(path, out var errors);
        if (s is null)
        {
            foreach (var e in errors) stderr.WriteLine($"lumen: {e}");
            return false;
        }
        foreach (var w in s.Warnings) stderr.WriteLine($"lumen: warning: {w}");
        spec = new Lumen.Conformance.PreparedSpec(s);
        return true;
    }

    /// <summary>Writes a failure message and returns the output-error code.</summary>
    public static int OutputFailed(TextWriter stderr, string message)
    {
        stderr.WriteLine($"lumen: {message}");
        return ExitCodes.OutputError;
    }
}

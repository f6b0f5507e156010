using System.CommandLine;
using Lumen.Analysis;
using Lumen.Formats;

namespace Lumen.Cli;

/// <summary>Option factories and small helpers that several verbs share.</summary>
internal static class CommonOptions
{
    /// <summary>A <c>--format</c> option accepting <paramref name="formats"/> (the first is the default).</summary>
    public static Option<string> Format(params string[] formats)
    {
        var o = new Option<string>("--format") { Description = $"Output format: {string.Join(", ", formats)}.", DefaultValueFactory = _ => formats[0] };
        o.AcceptOnlyFromAmong(formats);
        return o;
    }

    /// <summary>The output format named by a <c>--format</c> value.</summary>
    public static OutputFormat ToOutputFormat(string? text) => text switch { "json" => OutputFormat.Json, "csv" => OutputFormat.Csv, _ => OutputFormat.Text };

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

using System.Diagnostics;

namespace Lumen.Cli.Tests;

/// <summary>
/// Lumen's output does not depend on the machine's locale: the built command is run with invariant globalization off
/// under de-DE and tr-TR (a decimal comma; a dotless i) and every output is compared byte for byte with the default run.
/// </summary>
public class CultureTests
{
    private static (int Code, byte[] Out, string Err) RunProcess(string? culture, params string[] args) => RunProcess(culture, null, args);

    /// <summary>Runs the built command in its own process (as a user would), with extra environment variables.</summary>
    internal static (int Code, byte[] Out, string Err) RunProcess(string? culture, IReadOnlyDictionary<string, string>? environment, params string[] args)
    {
        var dll = Path.Combine(AppContext.BaseDirectory, "lumen.dll");
        var psi = new ProcessStartInfo("dotnet") { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        psi.ArgumentList.Add(dll);
        foreach (var a in args) psi.ArgumentList.Add(a);
        foreach (var (key, value) in environment ?? new Dictionary<string, string>()) psi.Environment[key] = value;
        // Reports stamp the date; fix it (the reproducible-output convention) so runs a minute apart compare equal.
        psi.Environment["SOURCE_DATE_EPOCH"] = "1796083200";
        if (culture is not null)
        {
            psi.Environment["DOTNET_SYSTEM_GLOBALIZATION_INVARIANT"] = "0";
            psi.Environment["LC_ALL"] = culture + ".UTF-8";
            psi.Environment["LANG"] = culture + ".UTF-8";
        }
        using var p = Process.Start(psi)!;
        using var ms = new MemoryStream();
        var copy = p.StandardOutput.BaseStream.CopyToAsync(ms);
        string err = p.StandardError.ReadToEnd();
        copy.Wait();
        if (!p.WaitForExit(120_000)) { p.Kill(true); throw new TimeoutException("lumen did not finish"); }
        return (p.ExitCode, ms.ToArray(), err);
    }

    public static TheoryData<string> Cultures => new() { "de_DE", "tr_TR" };

    [Theory]
    [MemberData(nameof(Cultures))]
    public void Every_output_is_byte_for_byte_the_same_under_another_locale(string culture)
    {
        string ex(string f) => Path.Combine(CliTests.RepoRoot, "examples", f);
        var commands = new[]
        {
            new[] { "analyze", ex("quillfern-downlights-3000K.csv"), ex("foyer-panel-4000K.tsv"), "--detail" },
            new[] { "analyze", ex("quillfern-downlights-3000K.csv"), "--format", "json" },
            new[] { "analyze", ex("quillfern-downlights-3000K.csv"), "--format", "csv" },
            new[] { "batch", ex("batch"), "--spec", ex("batch/spec-dl30.json"), "-o", "-" },
            new[] { "blackbody", "2856.5", "--emissivity", "0.9", "--area", "0.01" },
            new[] { "fit", ex("marrowby-stage-halogen.csv"), "--format", "json" },
            new[] { "plot", "locus", ex("quillfern-downlights-3000K.csv"), "--spec", ex("batch/spec-dl30.json"), "-o", "-" },
            new[] { "report", ex("quillfern-downlights-3000K.csv"), "-o", "-" },
        };
        foreach (var args in commands)
        {
            var plain = RunProcess(null, args);
            var local = RunProcess(culture, args);
            Assert.Equal(plain.Code, local.Code);
            Assert.True(plain.Out.Length > 0, string.Join(' ', args));
            Assert.True(plain.Out.AsSpan().SequenceEqual(local.Out), $"{culture}: output of 'lumen {string.Join(' ', args)}' differs");
            Assert.Equal(plain.Err, local.Err);
        }
    }

    [Fact]
    public void A_decimal_comma_argument_is_an_error_under_a_comma_locale()
    {
        var (code, _, err) = RunProcess("de_DE", "blackbody", "2856,5");
        Assert.Equal(ExitCodes.UsageError, code);
        Assert.Contains("is not a number", err, StringComparison.Ordinal);
    }
}

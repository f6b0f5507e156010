using System.Diagnostics;
using Lumen.Cli;

namespace Lumen.Cli.Tests;

/// <summary>Lumen as a .NET tool: the packed tool installs into a clean tool path and runs from any folder (issue 15).</summary>
public sealed class PackageTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), $"lumen-pack-{Guid.NewGuid():N}");

    public PackageTests() => Directory.CreateDirectory(_dir);

    public void Dispose() => Directory.Delete(_dir, true);

    private static (int Code, string Out) Run(string file, string args, string cwd)
    {
        var psi = new ProcessStartInfo(file, args) { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false, WorkingDirectory = cwd };
        psi.Environment["DOTNET_NOLOGO"] = "1";
        psi.Environment["DOTNET_CLI_TELEMETRY_OPTOUT"] = "1";
        using var p = Process.Start(psi)!;
        var o = p.StandardOutput.ReadToEndAsync();
        var e = p.StandardError.ReadToEndAsync();
        if (!p.WaitForExit(300_000)) { p.Kill(true); throw new TimeoutException($"{file} {args} did not finish in 5 minutes"); }
        return (p.ExitCode, o.Result + e.Result);
    }

    [Fact]
    public void A_build_for_one_platform_is_precompiled_and_the_tool_package_is_not()
    {
        // Issue 16: publishing for a runtime identifier (the single-file binary) turns ReadyToRun on; the platform-neutral
        // tool package cannot carry precompiled code for every platform, so it must stay off there.
        string project = Path.Combine(CliTests.RepoRoot, "src", "Lumen.Cli", "Lumen.Cli.csproj");
        var forPlatform = Run("dotnet", $"msbuild \"{project}\" -getProperty:PublishReadyToRun -p:RuntimeIdentifier=linux-x64", CliTests.RepoRoot);
        Assert.True(forPlatform.Code == 0, forPlatform.Out);
        Assert.Equal("true", forPlatform.Out.Trim());
        var neutral = Run("dotnet", $"msbuild \"{project}\" -getProperty:PublishReadyToRun", CliTests.RepoRoot);
        Assert.True(neutral.Code == 0, neutral.Out);
        Assert.NotEqual("true", neutral.Out.Trim());
    }

    [Fact]
    public void The_packed_tool_installs_and_runs_in_a_clean_folder()
    {
        string packages = Path.Combine(_dir, "packages"), tools = Path.Combine(_dir, "tools"), work = Path.Combine(_dir, "elsewhere");
        Directory.CreateDirectory(work);
        // --no-restore: the test build has restored the projects; the pack builds Release beside it.
        var pack = Run("dotnet", $"pack \"{Path.Combine(CliTests.RepoRoot, "src", "Lumen.Cli")}\" -c Release --no-restore -o \"{packages}\"", CliTests.RepoRoot);
        Assert.True(pack.Code == 0, pack.Out);
        Assert.Single(Directory.GetFiles(packages, "Lumen.Cli.*.nupkg"));
        var install = Run("dotnet", $"tool install Lumen.Cli --tool-path \"{tools}\" --add-source \"{packages}\" --version {LumenApp.Version}", work);
        Assert.True(install.Code == 0, install.Out);
        string lumen = Path.Combine(tools, OperatingSystem.IsWindows() ? "lumen.exe" : "lumen");
        var version = Run(lumen, "--version", work);
        Assert.Equal(0, version.Code);
        Assert.StartsWith(LumenApp.Version, version.Out.Trim(), StringComparison.Ordinal);
        var analysis = Run(lumen, $"analyze \"{Path.Combine(CliTests.RepoRoot, "examples", "quillfern-downlights-3000K.csv")}\" --format csv", work);
        Assert.Equal(0, analysis.Code);
        Assert.StartsWith("name,", analysis.Out, StringComparison.Ordinal);
        Assert.Equal(7, analysis.Out.Split('\n', StringSplitOptions.RemoveEmptyEntries).Length); // header + 6 spectra
    }
}

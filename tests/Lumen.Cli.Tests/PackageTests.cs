using System.Diagnostics;
using System.Runtime.InteropServices;
using Lumen.Cli;

namespace Lumen.Cli.Tests;

/// <summary>Lumen as a .NET tool: the packed tool installs into a clean tool path and runs from any folder (issue 15).</summary>
public sealed class PackageTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), $"lumen-pack-{Guid.NewGuid():N}");

    public PackageTests() => Directory.CreateDirectory(_dir);

    public void Dispose() => Directory.Delete(_dir, true);

    /// <summary>Runs a process to its end (at most 5 minutes) and returns its exit code, standard output and error.</summary>
    private static (int Code, string Out, string Err) Run(string file, IEnumerable<string> args, string? cwd = null)
    {
        var psi = new ProcessStartInfo(file, args) { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false, WorkingDirectory = cwd ?? "" };
        psi.Environment["DOTNET_NOLOGO"] = "1";
        psi.Environment["DOTNET_CLI_TELEMETRY_OPTOUT"] = "1";
        using var p = Process.Start(psi)!;
        var o = p.StandardOutput.ReadToEndAsync();
        var e = p.StandardError.ReadToEndAsync();
        if (!p.WaitForExit(300_000)) { p.Kill(true); throw new TimeoutException($"{file} {string.Join(' ', args)} did not finish in 5 minutes"); }
        return (p.ExitCode, o.Result, e.Result);
    }

    [Fact]
    public void A_build_for_one_platform_is_precompiled_and_the_tool_package_is_not()
    {
        // Issue 16: publishing for a runtime identifier (the single-file binary) turns ReadyToRun on; the platform-neutral
        // tool package cannot carry precompiled code for every platform, so it must stay off there.
        string project = Path.Combine(CliTests.RepoRoot, "src", "Lumen.Cli", "Lumen.Cli.csproj");
        var forPlatform = Run("dotnet", ["msbuild", project, "-getProperty:PublishReadyToRun", "-p:RuntimeIdentifier=linux-x64"], CliTests.RepoRoot);
        Assert.True(forPlatform.Code == 0, forPlatform.Out + forPlatform.Err);
        Assert.Equal("true", forPlatform.Out.Trim());
        var neutral = Run("dotnet", ["msbuild", project, "-getProperty:PublishReadyToRun"], CliTests.RepoRoot);
        Assert.True(neutral.Code == 0, neutral.Out + neutral.Err);
        Assert.NotEqual("true", neutral.Out.Trim());
        // The native build (NativeAOT) replaces ReadyToRun, and on x64 targets x86-64-v3 unless told otherwise.
        var native = Run("dotnet", ["msbuild", project, "-getProperty:PublishReadyToRun", "-getProperty:IlcInstructionSet", "-p:RuntimeIdentifier=linux-x64", "-p:PublishAot=true"], CliTests.RepoRoot);
        Assert.True(native.Code == 0, native.Out + native.Err);
        Assert.Contains("\"IlcInstructionSet\": \"x86-64-v3\"", native.Out, StringComparison.Ordinal);
        Assert.Contains("\"PublishReadyToRun\": \"\"", native.Out, StringComparison.Ordinal);
    }

    /// <summary>
    /// Issue 16: the native build (<c>dotnet publish -r RID -p:PublishAot=true</c>) runs every verb with the same
    /// output, byte for byte, as the managed build: results, summaries, the Parquet file and an image. Built for this
    /// machine's instruction set (<c>IlcInstructionSet=native</c>) so its vector widths, and so its last digits, match the
    /// JIT's here. Trimming and native compilation drop anything reached only by reflection; this is where that would show.
    /// In this class so it never builds beside the pack test (both write the Release build of the same projects).
    /// </summary>
    [NativeToolchainFact]
    public void The_native_build_gives_the_managed_builds_output_byte_for_byte()
    {
        string output = Path.Combine(_dir, "native");
        var publish = Run("dotnet", ["publish", Path.Combine(CliTests.RepoRoot, "src", "Lumen.Cli"), "-c", "Release", "-r", RuntimeInformation.RuntimeIdentifier, "-p:PublishAot=true", "-p:IlcInstructionSet=native", "-o", output], CliTests.RepoRoot);
        Assert.True(publish.Code == 0, publish.Out + publish.Err);
        string lumen = Path.Combine(output, "lumen");
        string Example(params string[] parts) => Path.Combine([CliTests.RepoRoot, "examples", .. parts]);
        string lot = Example("batch", "quillfern-dl30-lot-A17.csv"), spec = Example("batch", "spec-dl30.json");
        string[][] commands =
        [
            ["analyze", .. CliTests.ExampleFiles()],
            ["analyze", .. CliTests.ExampleFiles(), "--format", "csv"],
            ["analyze", Example("foyer-panel-4000K.tsv"), "--metrics", "all", "--format", "json"],
            ["analyze", Example("tm27", "marrowby-stage-halogen.spdx"), "--format", "json"],
            ["batch", lot, "--spec", spec, "--out", "{out}.csv", "--summary", "{out}.summary.json"],
            ["batch", lot, "--spec", spec, "--out", "{out}.parquet", "--summary", "{out}.summary.txt"],
            ["batch", lot, "--spec", spec, "--uncertainty", Example("uncertainty", "array-spectroradiometer.json"), "--draws", "200", "--decision", "guarded", "--format", "jsonl", "--out", "{out}.jsonl"],
            ["compare", Example("compare", "film-night-sources.csv"), "--filter", Example("compare", "filters"), "--format", "json"],
            ["mix", Example("mix", "quillfern-tw5-channels.csv"), "--cct", "3000"],
            ["blackbody", "3000"],
            ["fit", Example("marrowby-stage-halogen.csv"), "--format", "json"],
            ["plot", "locus", lot, "-o", "{out}.png"],
            ["analyze", Path.Combine(_dir, "missing.csv")],
        ];
        // The native binary alone, without the image library published beside it: analyses still run, and a plot stops
        // with the installation's exit code and a message naming the library, not an internal error.
        string alone = Path.Combine(_dir, "alone");
        Directory.CreateDirectory(alone);
        File.Copy(lumen, Path.Combine(alone, "lumen"));
        var analyzed = Run(Path.Combine(alone, "lumen"), ["analyze", Example("foyer-panel-4000K.tsv"), "--format", "csv"]);
        Assert.True(analyzed.Code == ExitCodes.Success, analyzed.Err);
        var plotted = Run(Path.Combine(alone, "lumen"), ["plot", "locus", Example("foyer-panel-4000K.tsv"), "-o", Path.Combine(alone, "locus.png")]);
        Assert.True(plotted.Code == ExitCodes.Installation, $"exit {plotted.Code}: {plotted.Err}");
        Assert.Contains(LumenApp.NativeImageLibrary, plotted.Err, StringComparison.Ordinal);
        Assert.DoesNotContain("internal error", plotted.Err, StringComparison.Ordinal);
        Assert.Single(plotted.Err.Split('\n', StringSplitOptions.RemoveEmptyEntries)); // one line, not the loader's list of paths
        Assert.False(File.Exists(Path.Combine(alone, "locus.png")));
        for (int i = 0; i < commands.Length; i++)
        {
            // Each build writes its own files; the names differ only in the folder, which no output mentions.
            string managedOut = Path.Combine(_dir, "managed", $"c{i}"), nativeOut = Path.Combine(_dir, "native-out", $"c{i}");
            Directory.CreateDirectory(Path.GetDirectoryName(managedOut)!);
            Directory.CreateDirectory(Path.GetDirectoryName(nativeOut)!);
            string[] managedArgs = commands[i].Select(a => a.Replace("{out}", managedOut, StringComparison.Ordinal)).ToArray();
            string[] nativeArgs = commands[i].Select(a => a.Replace("{out}", nativeOut, StringComparison.Ordinal)).ToArray();
            var managed = CliTests.Run("", managedArgs);
            var native = Run(lumen, nativeArgs);
            string what = string.Join(' ', commands[i]);
            Assert.True(managed.Code == native.Code, $"{what}: exit {managed.Code} managed, {native.Code} native\n{native.Out}{native.Err}");
            Assert.Equal(what + "\n" + managed.Out.Replace(managedOut, "{out}", StringComparison.Ordinal), what + "\n" + native.Out.Replace(nativeOut, "{out}", StringComparison.Ordinal));
            Assert.Equal(what + "\n" + managed.Err.Replace(managedOut, "{out}", StringComparison.Ordinal), what + "\n" + native.Err.Replace(nativeOut, "{out}", StringComparison.Ordinal));
            foreach (var file in Directory.GetFiles(Path.GetDirectoryName(managedOut)!, $"c{i}.*"))
            {
                string twin = Path.Combine(Path.GetDirectoryName(nativeOut)!, Path.GetFileName(file));
                Assert.True(File.Exists(twin), $"{what}: the native build wrote no {Path.GetFileName(file)}");
                Assert.True(File.ReadAllBytes(file).AsSpan().SequenceEqual(File.ReadAllBytes(twin)), $"{what}: {Path.GetFileName(file)} differs");
            }
        }
    }

    [Fact]
    public void The_packed_tool_installs_and_runs_in_a_clean_folder()
    {
        string packages = Path.Combine(_dir, "packages"), tools = Path.Combine(_dir, "tools"), work = Path.Combine(_dir, "elsewhere");
        Directory.CreateDirectory(work);
        // --no-restore: the test build has restored the projects; the pack builds Release beside it.
        var pack = Run("dotnet", ["pack", Path.Combine(CliTests.RepoRoot, "src", "Lumen.Cli"), "-c", "Release", "--no-restore", "-o", packages], CliTests.RepoRoot);
        Assert.True(pack.Code == 0, pack.Out + pack.Err);
        Assert.Single(Directory.GetFiles(packages, "Lumen.Cli.*.nupkg"));
        var install = Run("dotnet", ["tool", "install", "Lumen.Cli", "--tool-path", tools, "--add-source", packages, "--version", LumenApp.Version], work);
        Assert.True(install.Code == 0, install.Out + install.Err);
        string lumen = Path.Combine(tools, OperatingSystem.IsWindows() ? "lumen.exe" : "lumen");
        var version = Run(lumen, ["--version"], work);
        Assert.Equal(0, version.Code);
        Assert.StartsWith(LumenApp.Version, version.Out.Trim(), StringComparison.Ordinal);
        var analysis = Run(lumen, ["analyze", Path.Combine(CliTests.RepoRoot, "examples", "quillfern-downlights-3000K.csv"), "--format", "csv"], work);
        Assert.Equal(0, analysis.Code);
        Assert.StartsWith("name,", analysis.Out, StringComparison.Ordinal);
        Assert.Equal(7, analysis.Out.Split('\n', StringSplitOptions.RemoveEmptyEntries).Length); // header + 6 spectra
    }
}

/// <summary>A fact that needs a native build: skipped (with the reason) where the native compiler cannot link, that is,
/// off Linux or without a C toolchain (clang or gcc), which NativeAOT's link step needs.</summary>
public sealed class NativeToolchainFactAttribute : FactAttribute
{
    /// <summary>Sets Skip where no native build can be made.</summary>
    public NativeToolchainFactAttribute()
    {
        if (!OperatingSystem.IsLinux())
            Skip = "the native build is set up for Linux here (its linker step differs elsewhere).";
        else if (!(Environment.GetEnvironmentVariable("PATH") ?? "").Split(':').Any(d => File.Exists(Path.Combine(d, "clang")) || File.Exists(Path.Combine(d, "gcc"))))
            Skip = "no C toolchain (clang or gcc) on PATH; NativeAOT links with one.";
    }
}

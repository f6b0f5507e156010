using System.CommandLine;
using System.Globalization;

namespace Lumen.Cli;

/// <summary>The <c>lumen</c> command: builds the verbs and runs one command line.</summary>
public static class LumenApp
{
    /// <summary>Lumen's version as <c>--version</c> prints it (without the source revision).</summary>
    public static string Version { get; } =
        (typeof(LumenApp).Assembly.GetCustomAttributes(typeof(System.Reflection.AssemblyInformationalVersionAttribute), false)
            .OfType<System.Reflection.AssemblyInformationalVersionAttribute>().FirstOrDefault()?.InformationalVersion ?? "unknown")
        .Split('+')[0];

    /// <summary>Runs a command line with injected standard streams (tests capture them).</summary>
    /// <param name="args">Arguments.</param>
    /// <param name="stdin">Standard input (for <c>-</c>).</param>
    /// <param name="stdout">Results.</param>
    /// <param name="stderr">Diagnostics.</param>
    /// <param name="stderrIsTerminal">True when standard error is a terminal (progress lines are shown then).</param>
    /// <param name="interrupt">Cancelled on SIGINT or SIGTERM: analyze and batch then stop reading and keep what they computed.</param>
    /// <param name="stdoutIsTerminal">True when standard output is a terminal (a batch then prints a readable verdict table instead of CSV).</param>
    /// <returns>An exit code from <see cref="ExitCodes"/>.</returns>
    public static int Run(string[] args, TextReader stdin, TextWriter stdout, TextWriter stderr, bool stderrIsTerminal = false, CancellationToken interrupt = default, bool stdoutIsTerminal = false)
    {
        ArgumentNullException.ThrowIfNull(stderr);
        // Every number Lumen parses or prints uses the invariant culture, whatever the machine's locale — on this
        // thread and on the worker threads of a batch.
        CultureInfo.DefaultThreadCurrentCulture = CultureInfo.InvariantCulture;
        CultureInfo.DefaultThreadCurrentUICulture = CultureInfo.InvariantCulture;
        CultureInfo.CurrentCulture = CultureInfo.InvariantCulture;
        CultureInfo.CurrentUICulture = CultureInfo.InvariantCulture;
        var root = new RootCommand("lumen — colorimetry, CCT/Duv and colour quality of measured light-source spectra.\n" + ExitCodes.Legend);
        root.Subcommands.Add(new AnalyzeCommand(stdin, stdout, stderr, interrupt).Build());
        root.Subcommands.Add(new BlackbodyCommand(stdout, stderr).Build());
        root.Subcommands.Add(new FitCommand(stdin, stdout, stderr).Build());
        root.Subcommands.Add(new BatchCommand(stdin, stdout, stderr, stderrIsTerminal, interrupt, stdoutIsTerminal).Build());
        root.Subcommands.Add(new PlotCommand(stdin, stdout, stderr).Build());
        root.Subcommands.Add(new ReportCommand(stdin, stdout, stderr).Build());
        root.Subcommands.Add(new CompareCommand(stdin, stdout, stderr).Build());
        root.Subcommands.Add(new MixCommand(stdin, stdout, stderr).Build());
        root.Subcommands.Add(new ExportCommand(stdin, stdout, stderr).Build());
        var parse = root.Parse(args);
        if (parse.Errors.Count > 0)
        {
            foreach (var e in parse.Errors) stderr.WriteLine($"lumen: {e.Message}");
            stderr.WriteLine("Try 'lumen --help'.");
            return ExitCodes.UsageError;
        }
        try
        {
            return parse.Invoke(new InvocationConfiguration { Output = stdout, Error = stderr, EnableDefaultExceptionHandler = false });
        }
        catch (Exception ex) when (MissingNativeLibrary(ex) is { } missing)
        {
            // Not a bug in Lumen: a native library (the image library of plots and reports) is not where the build put it.
            // The loader's message runs to several lines (every path it tried): its first sentence here, all of it when asked for.
            string what = missing.Message.Split('\n')[0].Trim();
            if (what.IndexOf(". ", StringComparison.Ordinal) is > 0 and var end) what = what[..end];
            stderr.WriteLine($"lumen: a native library could not be loaded ({what}); the installation is incomplete: keep the files published with lumen together (for images, {NativeImageLibrary} beside it), or reinstall. Nothing was written.");
            if (Environment.GetEnvironmentVariable("LUMEN_DEBUG") is "1" or "true") stderr.WriteLine(missing.Message);
            return ExitCodes.Installation;
        }
        catch (Exception ex) when (ex is not OutOfMemoryException)
        {
            // A bug in Lumen: one line for the user, the trace only when asked for.
            stderr.WriteLine($"lumen: internal error ({ex.GetType().Name}: {ex.Message}); please report it with the command line and input.");
            if (Environment.GetEnvironmentVariable("LUMEN_DEBUG") is "1" or "true") stderr.WriteLine(ex.ToString());
            return ExitCodes.InternalError;
        }
    }

    /// <summary>The image library's file name on this platform (SkiaSharp's native part).</summary>
    internal static string NativeImageLibrary =>
        OperatingSystem.IsWindows() ? "libSkiaSharp.dll" : OperatingSystem.IsMacOS() ? "libSkiaSharp.dylib" : "libSkiaSharp.so";

    /// <summary>The failure to load a native library behind <paramref name="ex"/> (it may be wrapped, e.g. in the type
    /// initializer that first called into the library), or null when the exception has another cause.</summary>
    /// <param name="ex">What a command threw.</param>
    /// <returns>The load failure, or null.</returns>
    internal static DllNotFoundException? MissingNativeLibrary(Exception ex)
    {
        for (Exception? e = ex; e is not null; e = e.InnerException)
            if (e is DllNotFoundException missing) return missing;
        return null;
    }
}

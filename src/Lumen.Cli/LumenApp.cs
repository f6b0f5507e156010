using System.CommandLine;

namespace Lumen.Cli;

/// <summary>The <c>lumen</c> command: builds the verbs and runs one command line.</summary>
public static class LumenApp
{
    /// <summary>Runs a command line with injected standard streams (tests capture them).</summary>
    /// <param name="args">Arguments.</param>
    /// <param name="stdin">Standard input (for <c>-</c>).</param>
    /// <param name="stdout">Results.</param>
    /// <param name="stderr">Diagnostics.</param>
    /// <returns>An exit code from <see cref="ExitCodes"/>.</returns>
    /// <param name="stderrIsTerminal">True when standard error is a terminal (progress lines are shown then).</param>
    public static int Run(string[] args, TextReader stdin, TextWriter stdout, TextWriter stderr, bool stderrIsTerminal = false)
    {
        var root = new RootCommand("lumen — colorimetry, CCT/Duv and colour quality of measured light-source spectra.");
        root.Subcommands.Add(new AnalyzeCommand(stdin, stdout, stderr).Build());
        root.Subcommands.Add(new BlackbodyCommand(stdout, stderr).Build());
        root.Subcommands.Add(new FitCommand(stdin, stdout, stderr).Build());
        root.Subcommands.Add(new BatchCommand(stdout, stderr, stderrIsTerminal).Build());
        root.Subcommands.Add(new PlotCommand(stdin, stdout, stderr).Build());
        root.Subcommands.Add(new ReportCommand(stdin, stdout, stderr).Build());
        var parse = root.Parse(args);
        if (parse.Errors.Count > 0)
        {
            foreach (var e in parse.Errors) stderr.WriteLine($"lumen: {e.Message}");
            stderr.WriteLine("Try 'lumen --help'.");
            return ExitCodes.UsageOrInputError;
        }
        return parse.Invoke(new InvocationConfiguration { Output = stdout, Error = stderr });
    }
}

/// <summary>Entry point.</summary>
public static class Program
{
    /// <summary>Runs lumen on the process's streams.</summary>
    /// <param name="args">Arguments.</param>
    /// <returns>Exit code.</returns>
    public static int Main(string[] args)
    {
        var stdout = new StreamWriter(Console.OpenStandardOutput()) { AutoFlush = false };
        try
        {
            return LumenApp.Run(args, Console.In, stdout, Console.Error, !Console.IsErrorRedirected);
        }
        finally
        {
            stdout.Flush();
        }
    }
}

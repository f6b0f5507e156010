using System.Runtime.InteropServices;

namespace Lumen.Cli;

/// <summary>Entry point.</summary>
public static class Program
{
    /// <summary>Runs lumen on the process's streams.</summary>
    /// <param name="args">Arguments.</param>
    /// <returns>Exit code (see <see cref="ExitCodes"/>).</returns>
    public static int Main(string[] args)
    {
        var stdout = new StreamWriter(Console.OpenStandardOutput()) { AutoFlush = false };
        using var interrupt = new CancellationTokenSource();
        // SIGINT (Ctrl+C) and SIGTERM ask a running batch to stop cleanly: it writes what it has computed to a .partial
        // file and exits with its own code. A second signal is left to the default handling.
        Console.CancelKeyPress += (_, e) =>
        {
            if (interrupt.IsCancellationRequested) return;
            e.Cancel = true;
            interrupt.Cancel();
        };
        using var sigterm = PosixSignalRegistration.Create(PosixSignal.SIGTERM, ctx =>
        {
            if (interrupt.IsCancellationRequested) return;
            ctx.Cancel = true;
            interrupt.Cancel();
        });
        try
        {
            return LumenApp.Run(args, Console.In, stdout, Console.Error, !Console.IsErrorRedirected, interrupt.Token, !Console.IsOutputRedirected);
        }
        finally
        {
            try { stdout.Flush(); }
            catch (IOException) { /* standard output closed or full: the exit code already tells */ }
        }
    }
}

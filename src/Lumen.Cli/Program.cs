using System.Globalization;

namespace Lumen.Cli;

/// <summary>Entry point.</summary>
public static class Program
{
    /// <summary>Runs lumen on the process's streams.</summary>
    /// <param name="args">Arguments.</param>
    /// <returns>Exit code (see <see cref="ExitCodes"/>).</returns>
    public static int Main(string[] args)
    {
        // Every number Lumen parses or prints uses the invariant culture, whatever the machine's locale.
        CultureInfo.DefaultThreadCurrentCulture = CultureInfo.InvariantCulture;
        CultureInfo.DefaultThreadCurrentUICulture = CultureInfo.InvariantCulture;
        CultureInfo.CurrentCulture = CultureInfo.InvariantCulture;
        CultureInfo.CurrentUICulture = CultureInfo.InvariantCulture;
        var stdout = new StreamWriter(Console.OpenStandardOutput()) { AutoFlush = false };
        try
        {
            return LumenApp.Run(args, Console.In, stdout, Console.Error, !Console.IsErrorRedirected);
        }
        finally
        {
            try { stdout.Flush(); }
            catch (IOException) { /* standard output closed or full: the exit code already tells */ }
        }
    }
}

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

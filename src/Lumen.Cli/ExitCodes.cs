namespace Lumen.Cli;

/// <summary>Process exit codes of <c>lumen</c>: each means one thing (documented in the README and in <c>--help</c>).</summary>
public static class ExitCodes
{
    /// <summary>Everything read, computed and written (and, with a specification, everything passed).</summary>
    public const int Success = 0;

    /// <summary>Every record was read and written, and some results failed the specification.</summary>
    public const int SpecificationFailed = 1;

    /// <summary>A usage error: unknown option, bad option value, a missing or invalid specification. Nothing was computed.</summary>
    public const int UsageError = 2;

    /// <summary>Some input records could not be read or computed; they appear as error rows and every other result was written.</summary>
    public const int InputErrors = 3;

    /// <summary>An output could not be written (full disk, no permission, an output that is also an input); the target keeps its previous content.</summary>
    public const int OutputError = 4;

    /// <summary>An internal error in Lumen (a bug): one line on standard error names what failed; <c>LUMEN_DEBUG=1</c> adds the trace.</summary>
    public const int InternalError = 5;

    /// <summary>Interrupted (SIGINT or SIGTERM): what was computed is in a <c>.partial</c> file beside the output, which keeps its previous content.</summary>
    public const int Interrupted = 6;

    /// <summary>Under guarded acceptance, no result fails but some are too close to a limit to call with the stated
    /// measurement uncertainty (inconclusive); every record was read and written.</summary>
    public const int Inconclusive = 7;

    /// <summary>Lumen's installation is incomplete: a native library it needs could not be loaded (the image library
    /// beside a native build, for plots and reports). Nothing was written; reinstalling, or putting the library back
    /// beside <c>lumen</c>, mends it.</summary>
    public const int Installation = 8;

    /// <summary>One line per code, for <c>--help</c> and messages.</summary>
    public const string Legend = "Exit codes: 0 success; 1 some results fail the specification; 2 usage error; 3 some input records unreadable (error rows written); 4 an output could not be written; 5 internal error; 6 interrupted (partial results in FILE.partial); 7 none fails but some are inconclusive under guarded acceptance; 8 incomplete installation (a native library missing).";
}

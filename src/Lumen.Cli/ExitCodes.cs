namespace Lumen.Cli;

/// <summary>Process exit codes of <c>lumen</c>.</summary>
public static class ExitCodes
{
    /// <summary>Everything read and computed (and, with a spec, everything passed).</summary>
    public const int Success = 0;

    /// <summary>Some results failed a specification (batch QA).</summary>
    public const int SpecificationFailed = 1;

    /// <summary>A usage error, or an input that could not be read (details on stderr).</summary>
    public const int UsageOrInputError = 2;
}

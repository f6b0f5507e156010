namespace Lumen.Tests;

/// <summary>Paths of the repository.</summary>
public static class RepoPaths
{
    /// <summary>The folder holding Lumen.sln.</summary>
    public static string Root { get; } = FindRoot();

    private static string FindRoot()
    {
        var d = new DirectoryInfo(AppContext.BaseDirectory);
        while (d is not null && !File.Exists(System.IO.Path.Combine(d.FullName, "Lumen.sln"))) d = d.Parent;
        return d?.FullName ?? throw new InvalidOperationException("Lumen.sln not found above the test folder.");
    }
}

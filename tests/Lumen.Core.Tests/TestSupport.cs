namespace Lumen.Tests;

/// <summary>Finds ../shared beside the repository (as CI lays it out).</summary>
public static class SharedFolder
{
    /// <summary>Path of the shared folder, or null when absent.</summary>
    public static string? Path { get; } = Find();

    private static string? Find()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null)
        {
            if (File.Exists(System.IO.Path.Combine(dir.FullName, "Lumen.sln")))
            {
                var shared = System.IO.Path.Combine(dir.FullName, "..", "shared");
                return Directory.Exists(shared) ? System.IO.Path.GetFullPath(shared) : null;
            }
            dir = dir.Parent;
        }
        return null;
    }
}

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

/// <summary>A fact that runs only when ../shared/cie exists; skipped with the reason otherwise.</summary>
public sealed class SharedCieFactAttribute : FactAttribute
{
    /// <summary>Sets Skip when the folder is missing.</summary>
    public SharedCieFactAttribute()
    {
        if (SharedFolder.Path is null || !Directory.Exists(System.IO.Path.Combine(SharedFolder.Path, "cie")))
            Skip = "../shared/cie (the CIE's published files) is not beside this checkout; comparison skipped.";
    }
}

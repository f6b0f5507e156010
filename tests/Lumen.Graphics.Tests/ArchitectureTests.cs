namespace Lumen.Graphics.Tests;

/// <summary>The layering of ARCHITECTURE.md, checked on the built assemblies and the sources.</summary>
public class ArchitectureTests
{
    [Fact]
    public void Graphics_depends_on_Core_only_not_on_Formats()
    {
        var refs = typeof(HtmlReport).Assembly.GetReferencedAssemblies().Select(a => a.Name).ToArray();
        Assert.Contains("Lumen.Core", refs);
        Assert.DoesNotContain("Lumen.Formats", refs);
        Assert.DoesNotContain("Lumen.Formats", File.ReadAllText(Path.Combine(GraphicsTests.Root, "src", "Lumen.Graphics", "Lumen.Graphics.csproj")), StringComparison.Ordinal);
    }

    [Fact]
    public void Plots_read_the_reference_illuminants_the_calculators_used_and_never_build_their_own()
    {
        // One reference-illuminant generator: only Lumen.Core's calculators call it.
        foreach (var file in Directory.GetFiles(Path.Combine(GraphicsTests.Root, "src"), "*.cs", SearchOption.AllDirectories)
                     .Where(f => !f.Contains($"{Path.DirectorySeparatorChar}Lumen.Core{Path.DirectorySeparatorChar}", StringComparison.Ordinal)
                              && !f.Contains($"{Path.DirectorySeparatorChar}obj{Path.DirectorySeparatorChar}", StringComparison.Ordinal)))
            Assert.DoesNotContain("ReferenceIlluminants.", File.ReadAllText(file), StringComparison.Ordinal);
    }

    [Fact]
    public void Every_source_file_holds_at_most_one_public_type_named_after_it()
    {
        var decl = new System.Text.RegularExpressions.Regex(@"^public\s+(?:(?:sealed|static|abstract|readonly|partial|record)\s+)*(?:class|record|enum|struct|interface)\s+(\w+)", System.Text.RegularExpressions.RegexOptions.Multiline);
        foreach (var file in Directory.GetFiles(Path.Combine(GraphicsTests.Root, "src"), "*.cs", SearchOption.AllDirectories)
                     .Where(f => !f.Contains($"{Path.DirectorySeparatorChar}obj{Path.DirectorySeparatorChar}", StringComparison.Ordinal)))
        {
            var names = decl.Matches(File.ReadAllText(file)).Select(m => m.Groups[1].Value).ToArray();
            Assert.True(names.Length <= 1, $"{file}: {string.Join(", ", names)}");
            if (names.Length == 1) Assert.Equal(Path.GetFileNameWithoutExtension(file), names[0]);
        }
    }

    [Fact]
    public void Code_comments_cite_only_notes_inside_the_repository()
    {
        foreach (var file in Directory.GetFiles(Path.Combine(GraphicsTests.Root, "src"), "*.cs", SearchOption.AllDirectories)
                     .Where(f => !f.Contains($"{Path.DirectorySeparatorChar}obj{Path.DirectorySeparatorChar}", StringComparison.Ordinal)))
        {
            var text = File.ReadAllText(file);
            Assert.DoesNotContain("shared/", text, StringComparison.Ordinal);
            foreach (System.Text.RegularExpressions.Match m in System.Text.RegularExpressions.Regex.Matches(text, @"docs/methods/([\w-]+\.md)"))
                Assert.True(File.Exists(Path.Combine(GraphicsTests.Root, "docs", "methods", m.Groups[1].Value)), $"{file} cites missing {m.Value}");
        }
    }
}

using System.Reflection;
using System.Text;

namespace Lumen.Core.Tests;

/// <summary>Freezes Lumen.Core's public API: any change must show up as a reviewed diff of the approved file.</summary>
public class PublicApiTests
{
    [Fact]
    public void Public_api_matches_the_approved_file()
    {
        var asm = typeof(Lumen.Spectra.Spectrum).Assembly;
        var sb = new StringBuilder();
        foreach (var t in asm.GetExportedTypes().OrderBy(t => t.FullName, StringComparer.Ordinal))
        {
            sb.Append(Kind(t)).Append(' ').AppendLine(t.FullName);
            var members = t.GetMembers(BindingFlags.Public | BindingFlags.Instance | BindingFlags.Static | BindingFlags.DeclaredOnly)
                .Where(m => m is not MethodInfo mi || !mi.IsSpecialName)
                .Where(m => m.Name is not ("EqualityContract" or "<Clone>$" or "Deconstruct" or "PrintMembers"))
                .Select(Describe).Distinct().OrderBy(s => s, StringComparer.Ordinal);
            foreach (var m in members) sb.Append("    ").AppendLine(m);
        }
        var actual = sb.ToString().Replace("\r\n", "\n", StringComparison.Ordinal);
        var dir = Path.Combine(Lumen.Tests.RepoPaths.Root, "tests", "Lumen.Core.Tests");
        var approvedPath = Path.Combine(dir, "PublicApi.approved.txt");
        var approved = File.Exists(approvedPath) ? File.ReadAllText(approvedPath).Replace("\r\n", "\n", StringComparison.Ordinal) : "";
        if (approved != actual)
        {
            File.WriteAllText(Path.Combine(dir, "PublicApi.received.txt"), actual);
            Assert.Fail("Lumen.Core's public API changed. Review tests/Lumen.Core.Tests/PublicApi.received.txt and, if intended, copy it over PublicApi.approved.txt.");
        }
    }

    private static string Kind(Type t) =>
        t.IsEnum ? "enum" : t.IsValueType ? "struct" : t.IsInterface ? "interface" : t.IsAbstract && t.IsSealed ? "static class" : "class";

    private static string Describe(MemberInfo m) => m switch
    {
        MethodInfo mi => $"{Name(mi.ReturnType)} {mi.Name}({string.Join(", ", mi.GetParameters().Select(p => Name(p.ParameterType)))})",
        ConstructorInfo ci => $".ctor({string.Join(", ", ci.GetParameters().Select(p => Name(p.ParameterType)))})",
        PropertyInfo pi => $"{Name(pi.PropertyType)} {pi.Name} {{ {(pi.GetMethod?.IsPublic == true ? "get; " : "")}{(pi.SetMethod?.IsPublic == true ? "set; " : "")}}}",
        FieldInfo fi => $"{(fi.IsLiteral ? "const " : fi.IsStatic ? "static " : "")}{Name(fi.FieldType)} {fi.Name}",
        Type nt => $"nested {nt.Name}",
        _ => m.ToString() ?? m.Name,
    };

    private static string Name(Type t)
    {
        if (t.IsByRef) return Name(t.GetElementType()!) + "&";
        if (t.IsArray) return Name(t.GetElementType()!) + "[]";
        if (!t.IsGenericType) return t.Name;
        var n = t.Name[..t.Name.IndexOf('`', StringComparison.Ordinal)];
        return $"{n}<{string.Join(", ", t.GetGenericArguments().Select(Name))}>";
    }
}

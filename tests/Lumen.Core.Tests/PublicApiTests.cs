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

    private static readonly NullabilityInfoContext Nullability = new();

    private static string Describe(MemberInfo m) => m switch
    {
        MethodInfo mi => $"{Name(Nullability.Create(mi.ReturnParameter))} {mi.Name}({Params(mi.GetParameters())})",
        ConstructorInfo ci => $".ctor({Params(ci.GetParameters())})",
        PropertyInfo pi => $"{Name(Nullability.Create(pi))} {pi.Name} {{ {(pi.GetMethod?.IsPublic == true ? "get; " : "")}{Setter(pi)}}}",
        FieldInfo fi => $"{(fi.IsLiteral ? "const " : fi.IsStatic ? "static " : "")}{Name(Nullability.Create(fi))} {fi.Name}",
        Type nt => $"nested {nt.Name}",
        _ => m.ToString() ?? m.Name,
    };

    private static string Params(ParameterInfo[] ps) => string.Join(", ", ps.Select(p => Name(Nullability.Create(p))));

    // "init" for init-only setters (marked with the IsExternalInit modifier), "set" for ordinary ones.
    private static string Setter(PropertyInfo pi) =>
        pi.SetMethod?.IsPublic != true ? ""
        : pi.SetMethod.ReturnParameter.GetRequiredCustomModifiers().Contains(typeof(System.Runtime.CompilerServices.IsExternalInit)) ? "init; " : "set; ";

    // Type names with nullability: reference types annotated nullable get "?", Nullable<T> prints as T?.
    private static string Name(NullabilityInfo n)
    {
        var t = n.Type;
        if (t.IsByRef) return Plain(t.GetElementType()!) + "&";
        if (Nullable.GetUnderlyingType(t) is { } u) return Plain(u) + "?";
        string q = !t.IsValueType && n.ReadState == NullabilityState.Nullable ? "?" : "";
        if (t.IsArray) return (n.ElementType is { } e ? Name(e) : Plain(t.GetElementType()!)) + "[]" + q;
        if (!t.IsGenericType) return t.Name + q;
        var baseName = t.Name[..t.Name.IndexOf('`', StringComparison.Ordinal)];
        var args = n.GenericTypeArguments.Length == t.GetGenericArguments().Length
            ? n.GenericTypeArguments.Select(Name)
            : t.GetGenericArguments().Select(Plain);
        return $"{baseName}<{string.Join(", ", args)}>{q}";
    }

    private static string Plain(Type t)
    {
        if (t.IsArray) return Plain(t.GetElementType()!) + "[]";
        if (!t.IsGenericType) return t.Name;
        var n = t.Name[..t.Name.IndexOf('`', StringComparison.Ordinal)];
        return $"{n}<{string.Join(", ", t.GetGenericArguments().Select(Plain))}>";
    }
}

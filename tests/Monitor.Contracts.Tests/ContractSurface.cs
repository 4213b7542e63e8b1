using System.Reflection;
using Monitor.Contracts.V1;

namespace Monitor.Contracts.Tests;

/// <summary>Describes the public surface of the contracts assembly, one line per type and per property.</summary>
internal static class ContractSurface
{
    public static Assembly Assembly => typeof(TradeBooked).Assembly;

    public static IReadOnlyList<string> Describe()
    {
        var nullability = new NullabilityInfoContext();
        var lines = new List<string>();
        foreach (var type in Assembly.GetExportedTypes().OrderBy(t => t.FullName, StringComparer.Ordinal))
        {
            var kind = type.IsEnum ? "enum" : type.IsInterface ? "interface" : type.IsValueType ? "struct" : IsRecord(type) ? "record" : "class";
            lines.Add($"{kind} {type.FullName}");
            foreach (var property in type.GetProperties(BindingFlags.Public | BindingFlags.Instance | BindingFlags.DeclaredOnly)
                         .Where(p => p.Name != "EqualityContract")
                         .OrderBy(p => p.Name, StringComparer.Ordinal))
            {
                var required = property.GetCustomAttributes().Any(a => a.GetType().Name == "RequiredMemberAttribute") ? "required " : "";
                lines.Add($"  {required}{Name(property.PropertyType, nullability.Create(property))} {property.Name}");
            }
        }

        return lines;
    }

    private static bool IsRecord(Type type) => type.GetMethod("<Clone>$") is not null;

    private static string Name(Type type, NullabilityInfo info)
    {
        if (Nullable.GetUnderlyingType(type) is { } underlying)
        {
            return Name(underlying, info) + "?";
        }

        var name = type.IsGenericType
            ? $"{type.Name[..type.Name.IndexOf('`', StringComparison.Ordinal)]}<{string.Join(", ", type.GetGenericArguments().Zip(info.GenericTypeArguments, Name))}>"
            : type.Name;
        return !type.IsValueType && info.ReadState == NullabilityState.Nullable ? name + "?" : name;
    }
}

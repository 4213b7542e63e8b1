namespace Monitor.Contracts.Tests;

// Contracts are shared with any producer or consumer: they may reference the .NET base library only.
public class DependencyTests
{
    [Fact]
    public void Contracts_reference_only_the_base_library()
    {
        var references = ContractSurface.Assembly.GetReferencedAssemblies().Select(a => a.Name!).ToList();
        Assert.NotEmpty(references);
        Assert.All(references, name => Assert.True(
            name.StartsWith("System.", StringComparison.Ordinal) || name is "System" or "netstandard" or "mscorlib",
            $"Monitor.Contracts references '{name}', which is not part of the base library"));
    }

    [Fact]
    public void Contract_types_are_sealed_records_with_init_only_properties()
    {
        foreach (var type in ContractSurface.Assembly.GetExportedTypes())
        {
            Assert.True(type.IsSealed && type.GetMethod("<Clone>$") is not null, $"{type.FullName} is not a sealed record");
            Assert.Equal("Monitor.Contracts.V1", type.Namespace);
            foreach (var property in type.GetProperties())
            {
                var setter = property.SetMethod;
                Assert.True(setter is null || setter.ReturnParameter.GetRequiredCustomModifiers().Any(m => m.Name == "IsExternalInit"),
                    $"{type.Name}.{property.Name} has a mutable setter");
            }

            Assert.DoesNotContain(
                type.GetMethods(System.Reflection.BindingFlags.Public | System.Reflection.BindingFlags.Instance | System.Reflection.BindingFlags.DeclaredOnly),
                m => !m.IsSpecialName && m.Name is not ("Equals" or "GetHashCode" or "ToString" or "Deconstruct" or "<Clone>$" or "PrintMembers"));
        }
    }
}

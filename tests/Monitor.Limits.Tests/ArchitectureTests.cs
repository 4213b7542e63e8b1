using System.Reflection;

namespace Monitor.Limits.Tests;

/// <summary>The pure libraries must stay free of messaging, hosting, logging and configuration (DEVELOPERS.md, "Layout").</summary>
public class ArchitectureTests
{
    private static readonly string[] Forbidden = ["MassTransit", "RabbitMQ", "Serilog", "Microsoft.Extensions", "CsvHelper", "Monitor.Service", "Monitor.Contracts", "Monitor.Files"];

    [Theory]
    [InlineData(typeof(Monitor.Analytics.Curves.NelsonSiegelCurve))]
    [InlineData(typeof(LimitSet))]
    public void Pure_libraries_reference_no_messaging_hosting_or_logging(Type marker)
    {
        var references = marker.Assembly.GetReferencedAssemblies().Select(a => a.Name ?? string.Empty).ToArray();
        var bad = references.Where(r => Forbidden.Any(f => r.StartsWith(f, StringComparison.Ordinal))).ToArray();
        Assert.True(bad.Length == 0, $"{marker.Assembly.GetName().Name} references {string.Join(", ", bad)}");
    }

    [Theory]
    [InlineData(typeof(Monitor.Analytics.Curves.NelsonSiegelCurve))]
    [InlineData(typeof(LimitSet))]
    public void Pure_libraries_have_no_mutable_static_state(Type marker)
    {
        // Books may later be split across instances: no hidden global state (issue "The monitor service").
        var mutable = marker.Assembly.GetTypes()
            .SelectMany(t => t.GetFields(BindingFlags.Static | BindingFlags.Public | BindingFlags.NonPublic | BindingFlags.DeclaredOnly))
            .Where(f => !f.IsInitOnly && !f.IsLiteral && !f.Name.Contains('<', StringComparison.Ordinal))
            .Select(f => $"{f.DeclaringType!.Name}.{f.Name}")
            .ToArray();
        Assert.True(mutable.Length == 0, $"mutable static fields: {string.Join(", ", mutable)}");
    }
}

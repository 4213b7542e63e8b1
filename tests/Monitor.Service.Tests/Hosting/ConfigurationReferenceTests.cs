using System.Reflection;
using Monitor.Service.Hosting;

namespace Monitor.Service.Tests.Hosting;

/// <summary>
/// Issue 11: config/README.md is the one configuration reference. Every property of every options class bound from
/// configuration (a public class of the service with a <c>SectionName</c> constant, and the classes nested in its
/// properties such as <c>Transport:Broker</c>) must appear there as <c>`Section:Key`</c>.
/// </summary>
public sealed class ConfigurationReferenceTests
{
    [Fact]
    public void Every_options_property_is_in_the_configuration_reference()
    {
        var reference = File.ReadAllText(Path.Combine(RepositoryRoot(), "config", "README.md"));
        var sections = typeof(MonitorOptions).Assembly.GetTypes()
            .Where(t => t.IsClass && t.IsPublic && t.GetField("SectionName", BindingFlags.Public | BindingFlags.Static) is { IsLiteral: true })
            .ToArray();
        Assert.Contains(typeof(MonitorOptions), sections);
        Assert.Contains(typeof(TransportOptions), sections);

        var keys = sections.SelectMany(t => Keys((string)t.GetField("SectionName")!.GetRawConstantValue()!, t)).ToArray();
        var missing = keys.Where(k => !reference.Contains($"`{k}`", StringComparison.Ordinal)).ToArray();

        Assert.True(missing.Length == 0, "config/README.md does not list: " + string.Join(", ", missing));
        Assert.Contains("Transport:Broker:PasswordFile", keys);
    }

    /// <summary>The keys of <paramref name="type"/>'s settable properties; a property of another options class of ours is a sub-section.</summary>
    private static IEnumerable<string> Keys(string prefix, Type type)
    {
        foreach (var property in type.GetProperties(BindingFlags.Public | BindingFlags.Instance).Where(p => p.CanWrite))
        {
            var key = prefix + ":" + property.Name;
            if (property.PropertyType.IsClass && property.PropertyType != typeof(string) && property.PropertyType.Assembly == type.Assembly)
            {
                foreach (var inner in Keys(key, property.PropertyType))
                {
                    yield return inner;
                }
            }
            else
            {
                yield return key;
            }
        }
    }

    private static string RepositoryRoot()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            if (File.Exists(Path.Combine(dir.FullName, "Monitor.sln")))
            {
                return dir.FullName;
            }
        }
        throw new DirectoryNotFoundException("no Monitor.sln above " + AppContext.BaseDirectory);
    }
}

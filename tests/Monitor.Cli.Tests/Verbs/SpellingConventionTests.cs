using System.CommandLine;
using System.Reflection;
using System.Text.Json;
using Monitor.Cli.Tests.Support;
using Monitor.Cli.Verbs;
using Monitor.Service.Hosting;

namespace Monitor.Cli.Tests.Verbs;

/// <summary>
/// One spelling per surface on the command line (DEVELOPERS.md, Conventions, "Names on each surface"): option values
/// are lowercase words, the curve model is nelson-siegel / svensson in options, tables and JSON, gate options are the
/// configuration keys' words in kebab case, and required options are marked in help.
/// </summary>
public class SpellingConventionTests
{
    private static readonly string[] OtherModelSpellings = ["NelsonSiegel", "nelsonSiegel", "nelson_siegel", "Nelson Siegel"];

    private static string Help(string verb)
    {
        var root = new RootCommand("monitor (test)");
        foreach (var v in EntryPoint.Verbs())
        {
            root.Subcommands.Add(v);
        }
        using var output = new StringWriter();
        root.Parse([verb, "--help"]).Invoke(new InvocationConfiguration { Output = output, Error = output });
        return output.ToString();
    }

    [Fact]
    public void Curve_model_is_written_one_way_in_help_tables_and_json()
    {
        var texts = new List<string>
        {
            Help("fit"), Help("risk"), Help("explain"), Help("curve"),
            CliRun.Invoke("fit", "--instruments", CliRun.Data("instruments.csv"), "--quotes", CliRun.Data("quotes-close.csv")).Out,
            CliRun.Invoke("fit", "--instruments", CliRun.Data("instruments.csv"), "--quotes", CliRun.Data("quotes-close.csv"), "--model", "svensson", "--json").Out,
            CliRun.Invoke("curve", "--beta0", "4", "--beta1", "-1", "--beta2", "1", "--tau1", "2", "--json").Out,
            File.ReadAllText(Path.Combine(AppContext.BaseDirectory, "Examples", "CLI-README.md")),
        };
        Assert.Contains("nelson-siegel", texts[0], StringComparison.Ordinal);
        Assert.Contains("(nelson-siegel, base)", texts[4], StringComparison.Ordinal);
        Assert.Equal("svensson", JsonDocument.Parse(texts[5]).RootElement.GetProperty("curves")[0].GetProperty("model").GetString());
        Assert.Equal("nelson-siegel", JsonDocument.Parse(texts[6]).RootElement.GetProperty("model").GetString());
        foreach (var text in texts)
        {
            foreach (var other in OtherModelSpellings)
            {
                Assert.DoesNotContain(other, text, StringComparison.Ordinal);
            }
        }
    }

    [Fact]
    public void Option_values_are_lowercase_words_and_any_case_is_accepted()
    {
        foreach (var verb in EntryPoint.Verbs())
        {
            foreach (var option in verb.Options.Where(o => o.HelpName?.Contains('|', StringComparison.Ordinal) == true))
            {
                Assert.True(option.HelpName == option.HelpName!.ToLowerInvariant(), $"{verb.Name} {option.Name} <{option.HelpName}>");
            }
        }
        var load = new RootCommand { LoadVerb.Create() };
        Assert.Empty(load.Parse(["load", "--mode", "bare"]).Errors);
        Assert.Empty(load.Parse(["load", "--mode", "Bare"]).Errors);
        Assert.NotEmpty(load.Parse(["load", "--mode", "sideways"]).Errors);
        Assert.Contains("--mode <service|bare|both>", Help("load"), StringComparison.Ordinal);
    }

    [Fact]
    public void Gate_options_are_the_configuration_keys_in_kebab_case()
    {
        var keys = typeof(MonitorOptions).GetProperties(BindingFlags.Public | BindingFlags.Instance).Select(p => p.Name).ToHashSet(StringComparer.Ordinal);
        var fit = FitVerb.Create();
        var gateOptions = fit.Options.Where(o => o.Name.StartsWith("--base-", StringComparison.Ordinal) || o.Name.StartsWith("--spread-max", StringComparison.Ordinal) || o.Name.StartsWith("--spread-min", StringComparison.Ordinal)).ToArray();
        Assert.Equal(6, gateOptions.Length);
        foreach (var option in gateOptions)
        {
            // --base-min-quotes -> BaseMinQuotes (Monitor:BaseMinQuotes)
            var key = string.Concat(option.Name[2..].Split('-').Select(w => char.ToUpperInvariant(w[0]) + w[1..]));
            Assert.True(keys.Contains(key), $"{option.Name}: no configuration key Monitor:{key}");
        }
        Assert.DoesNotContain(EntryPoint.Verbs().SelectMany(v => v.Options), o => o.Name.Contains("instruments", StringComparison.Ordinal) && o.Name.Contains("min", StringComparison.Ordinal));
    }

    [Fact]
    public void Required_options_are_marked_in_every_verbs_help()
    {
        foreach (var verb in EntryPoint.Verbs())
        {
            foreach (var option in verb.Options)
            {
                // System.CommandLine's own Required gives "Option '--x' is required." without what it wants: not used.
                Assert.False(option.Required, $"{verb.Name} {option.Name}: mark it with CommonOptions.RequiredMark instead");
            }
        }
        foreach (var (verb, option) in new[] { ("risk", "--positions"), ("explain", "--from-quotes"), ("bond", "--settlement-date"), ("curve", "--beta0") })
        {
            var line = Help(verb).Split('\n').Single(l => l.TrimStart().StartsWith(option + " ", StringComparison.Ordinal));
            Assert.Contains("(required)", line, StringComparison.Ordinal);
        }
        var fitHelp = Help("fit").Split('\n').Single(l => l.TrimStart().StartsWith("--quotes ", StringComparison.Ordinal));
        Assert.Contains("(required unless --par-yields)", fitHelp, StringComparison.Ordinal);
    }
}

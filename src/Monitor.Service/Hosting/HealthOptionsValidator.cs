using Microsoft.Extensions.Options;

namespace Monitor.Service.Hosting;

/// <summary>Checks the <c>Health</c> section at start-up; each failure names the key and the fix.</summary>
public sealed class HealthOptionsValidator : IValidateOptions<HealthOptions>
{
    public ValidateOptionsResult Validate(string? name, HealthOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        var failures = options.Validate();
        return failures.Count == 0 ? ValidateOptionsResult.Success : ValidateOptionsResult.Fail(failures);
    }
}

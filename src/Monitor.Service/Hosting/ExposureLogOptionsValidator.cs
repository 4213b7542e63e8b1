using Microsoft.Extensions.Options;
using Monitor.Service.Audit;

namespace Monitor.Service.Hosting;

/// <summary>Checks the <c>ExposureLog</c> section at start-up; each failure names the key and the fix.</summary>
public sealed class ExposureLogOptionsValidator : IValidateOptions<ExposureLogOptions>
{
    public ValidateOptionsResult Validate(string? name, ExposureLogOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        var failures = options.Validate();
        return failures.Count == 0 ? ValidateOptionsResult.Success : ValidateOptionsResult.Fail(failures);
    }
}

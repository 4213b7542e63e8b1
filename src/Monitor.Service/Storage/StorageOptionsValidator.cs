using Microsoft.Extensions.Options;

namespace Monitor.Service.Storage;

/// <summary>Checks the <c>Storage</c> section at start-up; each failure names the key and the fix.</summary>
public sealed class StorageOptionsValidator : IValidateOptions<StorageOptions>
{
    public ValidateOptionsResult Validate(string? name, StorageOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        var failures = options.Validate();
        return failures.Count == 0 ? ValidateOptionsResult.Success : ValidateOptionsResult.Fail(failures);
    }
}

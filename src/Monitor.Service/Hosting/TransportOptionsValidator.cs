using Microsoft.Extensions.Options;

namespace Monitor.Service.Hosting;

/// <summary>Checks the transport section at start-up; each failure names the key, the value and the fix.</summary>
public sealed class TransportOptionsValidator : IValidateOptions<TransportOptions>
{
    private readonly Func<string, string?> _environment;

    public TransportOptionsValidator()
        : this(Environment.GetEnvironmentVariable)
    {
    }

    public TransportOptionsValidator(Func<string, string?> environment) => _environment = environment;

    public ValidateOptionsResult Validate(string? name, TransportOptions options)
    {
        var failures = new List<string>();
        if (!Enum.IsDefined(options.Kind))
        {
            failures.Add($"Transport:Kind: '{options.Kind}' is not a transport; use InMemory or RabbitMq.");
        }
        if (options.ConcurrentMessageLimit is < 1 or > 64)
        {
            failures.Add($"Transport:ConcurrentMessageLimit: {options.ConcurrentMessageLimit} is outside 1..64; use 1 to keep message order.");
        }
        if (options.MaxMessageBytes is < TransportOptions.MinMaxMessageBytes or > TransportOptions.MaxMaxMessageBytes)
        {
            failures.Add($"Transport:MaxMessageBytes: {options.MaxMessageBytes} is outside {TransportOptions.MinMaxMessageBytes}..{TransportOptions.MaxMaxMessageBytes}; use {TransportOptions.DefaultMaxMessageBytes} (64 KiB) unless a message of your own needs more.");
        }
        if (options.ErrorQueueMaxMessages is < 1 or > ErrorQueueLimits.MostMessages)
        {
            failures.Add($"Transport:ErrorQueueMaxMessages: {options.ErrorQueueMaxMessages} is outside 1..{ErrorQueueLimits.MostMessages}; use 10000.");
        }
        if (options.ErrorQueueMaxAge < ErrorQueueLimits.ShortestAge || options.ErrorQueueMaxAge > ErrorQueueLimits.LongestAge)
        {
            failures.Add($"Transport:ErrorQueueMaxAge: {options.ErrorQueueMaxAge} is outside {ErrorQueueLimits.ShortestAge}..{ErrorQueueLimits.LongestAge}; use 7.00:00:00 (7 days).");
        }
        if (options.Kind == TransportKind.RabbitMq)
        {
            var broker = options.Broker;
            if (string.IsNullOrWhiteSpace(broker.Host))
            {
                failures.Add("Transport:Broker:Host: is blank; set the broker's host name, e.g. localhost.");
            }
            if (broker.Port is < 1 or > 65535)
            {
                failures.Add($"Transport:Broker:Port: {broker.Port} is not a TCP port; use 5672 (or 5671 with TLS).");
            }
            if (string.IsNullOrWhiteSpace(broker.VirtualHost))
            {
                failures.Add("Transport:Broker:VirtualHost: is blank; use / for the default virtual host.");
            }
            failures.AddRange(BrokerCredentials.ResolveAll(broker, _environment).Problems);
        }
        return failures.Count == 0 ? ValidateOptionsResult.Success : ValidateOptionsResult.Fail(failures);
    }
}

namespace Monitor.Service.Tests.Broker;

/// <summary>
/// A test that needs a real RabbitMQ broker. Skipped with the reason when none can be found,
/// except where MONITOR_REQUIRE_BROKER=1 (CI): there it runs and fails loudly instead.
/// </summary>
[AttributeUsage(AttributeTargets.Method)]
public sealed class BrokerFactAttribute : FactAttribute
{
    public BrokerFactAttribute()
    {
        if (BrokerLocator.UnavailableReason is { } reason && !BrokerLocator.Required)
        {
            Skip = reason;
        }
    }
}

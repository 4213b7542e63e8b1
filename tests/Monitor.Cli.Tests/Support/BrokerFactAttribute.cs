namespace Monitor.Cli.Tests.Support;

/// <summary>
/// A test that needs the RabbitMQ broker named by MONITOR_TEST_BROKER (an amqp:// URI, as the service tests use).
/// Skipped with the reason when it is not set, except where MONITOR_REQUIRE_BROKER=1 (CI): there it fails instead.
/// </summary>
[AttributeUsage(AttributeTargets.Method)]
public sealed class BrokerFactAttribute : FactAttribute
{
    public BrokerFactAttribute()
    {
        if (Broker is null && Environment.GetEnvironmentVariable("MONITOR_REQUIRE_BROKER") != "1")
        {
            Skip = "MONITOR_TEST_BROKER is not set (source .ci/services.sh to start a local RabbitMQ)";
        }
    }

    public static Uri? Broker => Environment.GetEnvironmentVariable("MONITOR_TEST_BROKER") is { Length: > 0 } uri ? new Uri(uri) : null;
}

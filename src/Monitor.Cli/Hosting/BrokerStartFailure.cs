using Microsoft.Extensions.Configuration;
using Monitor.Service.Hosting;

namespace Monitor.Cli.Hosting;

/// <summary>
/// A start that failed on the broker connection, as one line for stderr: the broker refused the credentials, or could
/// not be reached. MassTransit's exception (RabbitMqConnectionException around RabbitMQ.Client's) carries hundreds of
/// lines of stack that tell an operator nothing more.
/// </summary>
internal static class BrokerStartFailure
{
    /// <summary>The line, or null when <paramref name="exception"/> is not a broker connection failure.</summary>
    public static string? Describe(Exception exception, IConfiguration configuration)
    {
        ArgumentNullException.ThrowIfNull(exception);
        ArgumentNullException.ThrowIfNull(configuration);
        var broker = configuration.GetSection(TransportOptions.SectionName + ":Broker").Get<BrokerOptions>() ?? new BrokerOptions();
        var where = $"{broker.Host}:{broker.Port}, virtual host '{broker.VirtualHost}'";
        if (IsRefusedCredentials(exception))
        {
            return $"monitor run: the broker at {where} refused the user name or password; check {BrokerOptions.UserVariable} and {BrokerOptions.PasswordVariable} " +
                "(or the files named by Transport:Broker:UserFile and PasswordFile) and the user's access to that virtual host.";
        }
        if (IsConnectionFailure(exception))
        {
            return $"monitor run: cannot connect to the broker at {where}: {Innermost(exception).Message} Check Transport:Broker:Host, Port, VirtualHost and UseTls, and that RabbitMQ is running.";
        }
        return null;
    }

    public static bool IsRefusedCredentials(Exception exception) =>
        Any(exception, e => e.GetType().Name == "AuthenticationFailureException" || e.Message.Contains("ACCESS_REFUSED", StringComparison.Ordinal));

    public static bool IsConnectionFailure(Exception exception) =>
        IsRefusedCredentials(exception) || Any(exception, e => e.GetType().Name is "BrokerUnreachableException" or "RabbitMqConnectionException" or "ConnectFailureException"
            || (e.Message.Contains("NOT_ALLOWED", StringComparison.Ordinal) && e.Message.Contains("vhost", StringComparison.OrdinalIgnoreCase)));

    private static bool Any(Exception exception, Func<Exception, bool> test)
    {
        if (test(exception))
        {
            return true;
        }
        if (exception is AggregateException aggregate && aggregate.InnerExceptions.Any(e => Any(e, test)))
        {
            return true;
        }
        return exception.InnerException is { } inner && Any(inner, test);
    }

    private static Exception Innermost(Exception exception)
    {
        while (exception.InnerException is { } inner)
        {
            exception = inner;
        }
        return exception;
    }
}

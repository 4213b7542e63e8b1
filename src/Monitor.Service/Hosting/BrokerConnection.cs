using System.Security.Authentication;
using MassTransit;

namespace Monitor.Service.Hosting;

/// <summary>Points MassTransit at the RabbitMQ broker, with credentials from the environment or secret files and optional TLS.</summary>
public static class BrokerConnection
{
    public static void Configure(IRabbitMqBusFactoryConfigurator cfg, BrokerOptions broker)
    {
        ArgumentNullException.ThrowIfNull(cfg);
        ArgumentNullException.ThrowIfNull(broker);
        var (credentials, problem) = BrokerCredentials.Resolve(broker, Environment.GetEnvironmentVariable);
        if (credentials is null)
        {
            throw new InvalidOperationException(problem);
        }
        cfg.Host(broker.Host, (ushort)broker.Port, broker.VirtualHost, h =>
        {
            h.Username(credentials.User);
            h.Password(credentials.Password);
            // A publish completes only when the broker has confirmed it: the outbox records confirmations by that (its default, set on purpose).
            h.PublisherConfirmation = true;
            if (broker.UseTls)
            {
                h.UseSsl(s =>
                {
                    s.ServerName = broker.TlsServerName ?? broker.Host;
                    s.Protocol = SslProtocols.Tls12 | SslProtocols.Tls13;
                });
            }
        });
    }
}

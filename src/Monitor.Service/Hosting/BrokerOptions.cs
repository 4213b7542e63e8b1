namespace Monitor.Service.Hosting;

/// <summary>Configuration section <c>Transport:Broker</c>: where the RabbitMQ broker is and how to log in.</summary>
public sealed class BrokerOptions
{
    /// <summary>Environment variable read for the user name when <see cref="UserFile"/> is not set.</summary>
    public const string UserVariable = "MONITOR_BROKER_USER";

    /// <summary>Environment variable read for the password when <see cref="PasswordFile"/> is not set.</summary>
    public const string PasswordVariable = "MONITOR_BROKER_PASSWORD";

    /// <summary>Broker host name. Default localhost.</summary>
    public string Host { get; set; } = "localhost";

    /// <summary>AMQP port; 5672 plain, 5671 with TLS by convention.</summary>
    public int Port { get; set; } = 5672;

    public string VirtualHost { get; set; } = "/";

    /// <summary>Path of a file holding only the user name (for example a mounted secret).</summary>
    public string? UserFile { get; set; }

    /// <summary>Path of a file holding only the password (for example a mounted secret).</summary>
    public string? PasswordFile { get; set; }

    /// <summary>Connect with TLS.</summary>
    public bool UseTls { get; set; }

    /// <summary>Name expected on the broker's certificate; defaults to <see cref="Host"/>.</summary>
    public string? TlsServerName { get; set; }
}

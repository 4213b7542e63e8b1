namespace Monitor.Service.Hosting;

/// <summary>Resolves the broker's user name and password from secret files or the environment, never from configuration text.</summary>
public sealed record BrokerCredentials(string User, string Password)
{
    /// <summary>Reads the credentials, or returns the problem in words naming the key and the fix.</summary>
    public static (BrokerCredentials? Credentials, string? Problem) Resolve(BrokerOptions options, Func<string, string?> environment)
    {
        var (credentials, problems) = ResolveAll(options, environment);
        return (credentials, problems.Count == 0 ? null : string.Join(" ", problems));
    }

    /// <summary>Reads the credentials, or returns every problem (user and password both), each naming the key and the fix.</summary>
    public static (BrokerCredentials? Credentials, IReadOnlyList<string> Problems) ResolveAll(BrokerOptions options, Func<string, string?> environment)
    {
        ArgumentNullException.ThrowIfNull(options);
        var (user, userProblem) = Read(options.UserFile, "Transport:Broker:UserFile", BrokerOptions.UserVariable, environment);
        var (password, passwordProblem) = Read(options.PasswordFile, "Transport:Broker:PasswordFile", BrokerOptions.PasswordVariable, environment);
        var problems = new[] { userProblem, passwordProblem }.OfType<string>().ToArray();
        return problems.Length == 0 ? (new BrokerCredentials(user!, password!), problems) : (null, problems);
    }

    /// <summary>The password never appears in logs or exceptions.</summary>
    public override string ToString() => $"BrokerCredentials {{ User = {User}, Password = *** }}";

    private static (string? Value, string? Problem) Read(string? file, string fileKey, string variable, Func<string, string?> environment)
    {
        if (!string.IsNullOrWhiteSpace(file))
        {
            try
            {
                var text = File.ReadAllText(file).Trim();
                return text.Length > 0
                    ? (text, null)
                    : (null, $"{fileKey}: the file '{file}' is empty; put the secret in it or unset the key and set {variable}.");
            }
            catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
            {
                return (null, $"{fileKey}: cannot read '{file}' ({ex.Message}); fix the path or its permissions.");
            }
        }
        var value = environment(variable);
        return string.IsNullOrEmpty(value)
            ? (null, $"RabbitMQ needs credentials: set the environment variable {variable} or the key {fileKey} to a secret file.")
            : (value, null);
    }
}

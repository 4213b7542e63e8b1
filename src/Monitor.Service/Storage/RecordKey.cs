using System.Security.Cryptography;
using System.Text;

namespace Monitor.Service.Storage;

/// <summary>
/// The secret that MACs the exposure log and the trade journal: HMAC-SHA256 (RFC 2104, FIPS 198-1) over a record's
/// canonical bytes. Only the writer (and whoever verifies) holds it, so someone who can write the folders cannot
/// forge a record that verifies. The key is the UTF-8 bytes of a secret text of at least <see cref="MinimumLength"/>
/// characters (e.g. <c>openssl rand -hex 32</c>), read from a secret file or an environment variable, never from
/// configuration text or the record folders.
/// </summary>
public sealed class RecordKey
{
    /// <summary>Environment variable read for the key when no key file is configured.</summary>
    public const string Variable = "MONITOR_RECORD_KEY";

    /// <summary>Fewest characters of key text: 32 (256 bits as 64 hex digits is the suggested form).</summary>
    public const int MinimumLength = 32;

    private readonly byte[] _key;

    private RecordKey(byte[] key) => _key = key;

    /// <summary>Where the key came from (a file path or the variable name), for messages; never the key itself.</summary>
    public string Source { get; private init; } = string.Empty;

    /// <summary>A key from its text (tests, the demo); the text must have at least <see cref="MinimumLength"/> characters.</summary>
    public static RecordKey FromText(string text, string source)
    {
        ArgumentNullException.ThrowIfNull(text);
        var trimmed = text.Trim();
        return trimmed.Length < MinimumLength
            ? throw new ArgumentException($"The record key from {source} has {trimmed.Length} characters; it needs at least {MinimumLength} (e.g. openssl rand -hex 32).", nameof(text))
            : new RecordKey(Encoding.UTF8.GetBytes(trimmed)) { Source = source };
    }

    /// <summary>A key of raw bytes, any length (test vectors only).</summary>
    internal static RecordKey FromBytes(byte[] key, string source) => new((byte[])key.Clone()) { Source = source };

    /// <summary>A fresh random key as text (64 hex digits): the demo's throw-away key.</summary>
    public static string NewText() => Convert.ToHexStringLower(RandomNumberGenerator.GetBytes(32));

    /// <summary>Reads the key from <paramref name="keyFile"/> when set, else from <see cref="Variable"/>; or returns the problem naming the key and the fix.</summary>
    public static (RecordKey? Key, string? Problem) Resolve(string? keyFile, string fileKey, Func<string, string?> environment)
    {
        ArgumentNullException.ThrowIfNull(environment);
        if (!string.IsNullOrWhiteSpace(keyFile))
        {
            string text;
            try
            {
                text = File.ReadAllText(keyFile).Trim();
            }
            catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
            {
                return (null, $"{fileKey}: cannot read the record key file '{keyFile}' ({ex.Message}); fix the path or its permissions.");
            }
            return text.Length >= MinimumLength
                ? (new RecordKey(Encoding.UTF8.GetBytes(text)) { Source = keyFile }, null)
                : (null, $"{fileKey}: the record key file '{keyFile}' holds {text.Length} characters; put a secret of at least {MinimumLength} in it (e.g. openssl rand -hex 32 > '{keyFile}').");
        }
        var value = environment(Variable)?.Trim();
        if (string.IsNullOrEmpty(value))
        {
            return (null, $"The exposure log and the trade journal need a record key: set the environment variable {Variable} or the key {fileKey} to a secret file (at least {MinimumLength} characters, e.g. openssl rand -hex 32), kept outside the log and journal folders.");
        }
        return value.Length >= MinimumLength
            ? (new RecordKey(Encoding.UTF8.GetBytes(value)) { Source = Variable }, null)
            : (null, $"{Variable} holds {value.Length} characters; the record key needs at least {MinimumLength} (e.g. openssl rand -hex 32).");
    }

    /// <summary>Lowercase hex HMAC-SHA256 of <paramref name="bytes"/> under this key: 64 hex digits.</summary>
    public string Mac(ReadOnlySpan<byte> bytes) => Convert.ToHexStringLower(HMACSHA256.HashData(_key, bytes));

    /// <summary>Constant-time comparison of two MACs in hex.</summary>
    public static bool SameMac(string a, string b) =>
        CryptographicOperations.FixedTimeEquals(Encoding.ASCII.GetBytes(a), Encoding.ASCII.GetBytes(b));

    /// <summary>The key never appears in logs or exceptions.</summary>
    public override string ToString() => $"RecordKey {{ Source = {Source} }}";
}

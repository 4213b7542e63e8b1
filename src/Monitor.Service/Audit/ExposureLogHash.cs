using System.Security.Cryptography;

namespace Monitor.Service.Audit;

/// <summary>The chain's hash: SHA-256 (FIPS 180-4) as 64 lowercase hex digits.</summary>
internal static class ExposureLogHash
{
    /// <summary>prevHash of the first record of a log: 64 zeros.</summary>
    public static readonly string Genesis = new('0', 64);

    public static string Compute(ReadOnlySpan<byte> bytes) => Convert.ToHexStringLower(SHA256.HashData(bytes));

    /// <summary>True for exactly 64 characters 0-9a-f.</summary>
    public static bool IsWellFormed(string? hash)
    {
        if (hash is null || hash.Length != 64)
        {
            return false;
        }

        foreach (var c in hash)
        {
            if (!char.IsAsciiDigit(c) && c is not (>= 'a' and <= 'f'))
            {
                return false;
            }
        }

        return true;
    }
}

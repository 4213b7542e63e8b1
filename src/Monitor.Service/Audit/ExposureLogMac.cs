namespace Monitor.Service.Audit;

/// <summary>The chain's MAC as text: HMAC-SHA256 (RFC 2104) under the record key, 64 lowercase hex digits.</summary>
internal static class ExposureLogMac
{
    /// <summary>prevMac of the first record of a log: 64 zeros.</summary>
    public static readonly string Genesis = new('0', 64);

    /// <summary>True for exactly 64 characters 0-9a-f.</summary>
    public static bool IsWellFormed(string? mac)
    {
        if (mac is null || mac.Length != 64)
        {
            return false;
        }

        foreach (var c in mac)
        {
            if (!char.IsAsciiDigit(c) && c is not (>= 'a' and <= 'f'))
            {
                return false;
            }
        }

        return true;
    }
}

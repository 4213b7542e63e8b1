using System.Globalization;

namespace Monitor.Service.Storage;

/// <summary>A store whose writes are failing: where, why (the operating system's words), since when, and how many attempts failed.</summary>
/// <param name="Store">The store's name (<see cref="StorageFaultGate.ExposureLog"/>, <see cref="StorageFaultGate.TradeJournal"/>).</param>
/// <param name="Path">The file or folder the last failed write went to ("unknown" when the error did not say).</param>
/// <param name="Reason">The last failure: exception type and message, e.g. "IOException: No space left on device".</param>
/// <param name="Since">When the first write of this outage failed.</param>
/// <param name="FailedAttempts">Failed attempts since then.</param>
public sealed record StorageFault(string Store, string Path, string Reason, DateTimeOffset Since, int FailedAttempts)
{
    public override string ToString() => string.Create(
        CultureInfo.InvariantCulture,
        $"{Store}: writes to '{Path}' failing since {Since.UtcDateTime:yyyy-MM-ddTHH:mm:ss.fff}Z ({FailedAttempts} failed attempts): {Reason}");
}

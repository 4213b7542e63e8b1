using Monitor.Service.Engine;
using Monitor.Service.Pipeline;

namespace Monitor.Service.Storage;

/// <summary>Runs <see cref="DayFileRetention"/> at each business-day roll, for the day the roll opened.</summary>
public sealed class RetentionAtDayClose(DayFileRetention retention, BusinessDayRoll roll) : IDayCloseListener
{
    public Task OnDayClosedAsync(DayClose close, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(close);
        retention.Apply(roll.BusinessDateOf(close.ClosedAt));
        return Task.CompletedTask;
    }
}

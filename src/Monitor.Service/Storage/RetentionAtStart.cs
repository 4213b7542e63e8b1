using Microsoft.Extensions.Hosting;
using Monitor.Service.Engine;

namespace Monitor.Service.Storage;

/// <summary>Runs <see cref="DayFileRetention"/> once at start for the current business day (of the configured day roll, <c>Monitor:BusinessDay</c>).</summary>
public sealed class RetentionAtStart(DayFileRetention retention, TimeProvider time, BusinessDayRoll roll) : IHostedService
{
    public Task StartAsync(CancellationToken cancellationToken)
    {
        retention.Apply(roll.BusinessDateOf(time.GetUtcNow()));
        return Task.CompletedTask;
    }

    public Task StopAsync(CancellationToken cancellationToken) => Task.CompletedTask;
}

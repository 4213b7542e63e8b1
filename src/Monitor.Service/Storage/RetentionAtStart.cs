using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Options;
using Monitor.Service.Audit;

namespace Monitor.Service.Storage;

/// <summary>Runs <see cref="DayFileRetention"/> once at start for the current business day (of the exposure log's day offset).</summary>
public sealed class RetentionAtStart(DayFileRetention retention, TimeProvider time, IOptions<ExposureLogOptions> log) : IHostedService
{
    public Task StartAsync(CancellationToken cancellationToken)
    {
        retention.Apply(ExposureLogFiles.DayOf(time.GetUtcNow(), log.Value.BusinessDayUtcOffset));
        return Task.CompletedTask;
    }

    public Task StopAsync(CancellationToken cancellationToken) => Task.CompletedTask;
}

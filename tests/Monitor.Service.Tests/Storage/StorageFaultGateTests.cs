using System.Threading.Channels;
using Microsoft.Extensions.Diagnostics.HealthChecks;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Options;
using Microsoft.Extensions.Time.Testing;
using Monitor.Service.Audit;
using Monitor.Service.Journal;
using Monitor.Service.Storage;
using Monitor.Service.Tests.Support;
using static Monitor.Service.Tests.Audit.ExposureLogTestData;

namespace Monitor.Service.Tests.Storage;

/// <summary>
/// The storage-fault gate on a fake clock: storage failures are held and retried with doubling waits up to the cap,
/// the store is unhealthy meanwhile and healthy after the first success; other failures and cancellation pass through.
/// The backoff (1 s doubling to a 5 s cap) is the service's own rule (common practice, no source).
/// </summary>
public sealed class StorageFaultGateTests
{
    private static readonly TimeSpan WaitForAttempt = TimeSpan.FromSeconds(30); // a safety net against a hang, not a speed check

    [Fact]
    public async Task A_write_failing_for_storage_reasons_is_retried_with_doubling_waits_up_to_the_cap_until_it_succeeds()
    {
        var time = new WaitSignallingClock(Day1Morning);
        var gate = Gate(time);
        var attempts = Channel.CreateUnbounded<DateTimeOffset>();
        var failuresLeft = 6;
        var run = gate.RunAsync(StorageFaultGate.ExposureLog, () =>
        {
            attempts.Writer.TryWrite(time.GetUtcNow());
            if (failuresLeft-- > 0)
            {
                throw new ExposureLogWriteException("/logs/exposures-2026-12-01.jsonl", "IOException: No space left on device", null);
            }
        }, CancellationToken.None);

        var times = new List<DateTimeOffset> { await Next(attempts) };
        var waits = new List<TimeSpan> { await time.NextWaitAsync() };
        Assert.True(gate.IsFailing);
        var fault = Assert.Single(gate.Faults);
        Assert.Equal((StorageFaultGate.ExposureLog, "/logs/exposures-2026-12-01.jsonl"), (fault.Store, fault.Path));
        Assert.Contains("No space left on device", fault.Reason, StringComparison.Ordinal);
        var health = await new StorageHealthCheck(gate).CheckHealthAsync(new HealthCheckContext());
        Assert.Equal(HealthStatus.Unhealthy, health.Status);
        Assert.Contains("/logs/exposures-2026-12-01.jsonl", health.Description, StringComparison.Ordinal);

        for (var retry = 1; retry <= 6; retry++)
        {
            time.Advance(waits[^1] - TimeSpan.FromMilliseconds(1));
            Assert.False(attempts.Reader.TryRead(out _), $"retry {retry} ran before its wait of {waits[^1]} was over");
            time.Advance(TimeSpan.FromMilliseconds(1));
            times.Add(await Next(attempts));
            if (retry < 6)
            {
                waits.Add(await time.NextWaitAsync());
            }
        }
        await run.WaitAsync(WaitForAttempt);

        Assert.Equal([1.0, 2, 4, 5, 5, 5], waits.Select(w => w.TotalSeconds));
        Assert.Equal([1.0, 2, 4, 5, 5, 5], times.Zip(times.Skip(1), (a, b) => (b - a).TotalSeconds));
        Assert.False(gate.IsFailing);
        Assert.Empty(gate.Faults);
        Assert.Equal(HealthStatus.Healthy, (await new StorageHealthCheck(gate).CheckHealthAsync(new HealthCheckContext())).Status);
    }

    [Fact]
    public async Task A_failure_that_is_not_the_storage_s_is_thrown_at_once_and_leaves_the_gate_healthy()
    {
        var gate = Gate(new WaitSignallingClock(Day1Morning));
        var calls = 0;

        var ex = await Assert.ThrowsAsync<ArgumentException>(() => gate.RunAsync(StorageFaultGate.ExposureLog, () =>
        {
            calls++;
            throw new ArgumentException("payload is a JSON Array: it must be a JSON object.");
        }, CancellationToken.None));

        Assert.Contains("payload", ex.Message, StringComparison.Ordinal);
        Assert.Equal(1, calls);
        Assert.False(gate.IsFailing);
    }

    [Fact]
    public async Task Cancelling_a_held_write_throws_with_the_caller_s_token_and_the_store_stays_unhealthy()
    {
        var time = new WaitSignallingClock(Day1Morning);
        var gate = Gate(time);
        using var shutdown = new CancellationTokenSource();
        var attempts = Channel.CreateUnbounded<DateTimeOffset>();
        var run = gate.RunAsync(StorageFaultGate.TradeJournal, _ =>
        {
            attempts.Writer.TryWrite(time.GetUtcNow());
            throw new JournalWriteException("/journal/journal-2026-12-01.jsonl", "No space left on device", null);
        }, shutdown.Token);
        await Next(attempts);
        await time.NextWaitAsync();

        await shutdown.CancelAsync();
        var ex = await Assert.ThrowsAnyAsync<OperationCanceledException>(() => run);

        // MassTransit returns a delivery to its queue (no error queue) only when the exception carries the consume context's own token.
        Assert.Equal(shutdown.Token, ex.CancellationToken);
        Assert.True(gate.IsFailing, "nothing was written: the store must still report its fault");
    }

    [Fact]
    public async Task Stores_are_judged_apart_a_good_journal_write_does_not_clear_a_failing_log()
    {
        var time = new WaitSignallingClock(Day1Morning);
        var gate = Gate(time);
        var attempts = Channel.CreateUnbounded<DateTimeOffset>();
        var logFailing = true;
        var log = gate.RunAsync(StorageFaultGate.ExposureLog, () =>
        {
            attempts.Writer.TryWrite(time.GetUtcNow());
            if (logFailing)
            {
                throw new UnauthorizedAccessException("Access to the path '/logs' is denied.");
            }
        }, CancellationToken.None);
        await Next(attempts);
        await time.NextWaitAsync();

        await gate.RunAsync(StorageFaultGate.TradeJournal, () => { }, CancellationToken.None);

        var fault = Assert.Single(gate.Faults);
        Assert.Equal(StorageFaultGate.ExposureLog, fault.Store);
        Assert.Contains("Access to the path '/logs' is denied", fault.Reason, StringComparison.Ordinal);
        logFailing = false;
        time.Advance(TimeSpan.FromSeconds(1));
        await log.WaitAsync(WaitForAttempt);
        Assert.False(gate.IsFailing);
    }

    [Fact]
    public async Task An_exposure_log_append_held_through_a_failing_stream_is_written_once_and_the_chain_verifies()
    {
        using var folder = new TempFolder();
        var time = new WaitSignallingClock(Day1Morning);
        var gate = Gate(time);
        var failing = false;
        var attempts = Channel.CreateUnbounded<DateTimeOffset>();
        using (var writer = new ExposureLogWriter(TestKey.Value, Options(folder.Path), time, s => new FaultyStream(s, () => failing)))
        {
            writer.Append(ExposureLogKinds.Snapshot, time.GetUtcNow(), Cause(1), Figures(1));
            failing = true; // each attempt writes half the line, then fails with ENOSPC
            var held = gate.RunAsync(StorageFaultGate.ExposureLog, () =>
            {
                attempts.Writer.TryWrite(time.GetUtcNow());
                writer.Append(ExposureLogKinds.Snapshot, time.GetUtcNow(), Cause(2), Figures(2));
            }, CancellationToken.None);
            await Next(attempts);
            time.Advance(await time.NextWaitAsync());
            await Next(attempts);
            var wait = await time.NextWaitAsync();
            Assert.Equal(1, writer.LastSeq);
            Assert.True(gate.IsFailing);

            failing = false; // space is back
            time.Advance(wait);
            await Next(attempts);
            await held.WaitAsync(WaitForAttempt);
            writer.Append(ExposureLogKinds.Snapshot, time.GetUtcNow(), Cause(3), Figures(3));
            Assert.Equal(3, writer.LastSeq);
        }

        var result = ExposureLogVerifier.VerifyFolder(TestKey.Value, folder.Path);
        Assert.True(result.Intact, string.Join("; ", result.Problems));
        Assert.Equal(3, result.Records);
        Assert.False(gate.IsFailing);
    }

    [Theory]
    [InlineData(0, 5, "Storage:RetryFirstDelay")]
    [InlineData(2, 1, "Storage:RetryMaxDelay")]
    public void Bad_retry_options_are_refused_naming_the_key(int firstSeconds, int maxSeconds, string key)
    {
        var options = new StorageOptions { RetryFirstDelay = TimeSpan.FromSeconds(firstSeconds), RetryMaxDelay = TimeSpan.FromSeconds(maxSeconds) };

        var ex = Assert.Throws<ArgumentException>(() => new StorageFaultGate(Microsoft.Extensions.Options.Options.Create(options), TimeProvider.System, NullLogger<StorageFaultGate>.Instance));

        Assert.Contains(key, ex.Message, StringComparison.Ordinal);
    }

    private static StorageFaultGate Gate(TimeProvider time) =>
        new(Microsoft.Extensions.Options.Options.Create(new StorageOptions()), time, NullLogger<StorageFaultGate>.Instance);

    private static async Task<DateTimeOffset> Next(Channel<DateTimeOffset> attempts) =>
        await attempts.Reader.ReadAsync().AsTask().WaitAsync(WaitForAttempt);
}

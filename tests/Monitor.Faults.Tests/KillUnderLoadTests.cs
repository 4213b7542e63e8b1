using System.Diagnostics;
using Monitor.Faults.Tests.Support;
using Xunit.Abstractions;

namespace Monitor.Faults.Tests;

/// <summary>
/// Kill -9 under load: the service is SIGKILLed while it works through a backlog, restarted on the same folders,
/// and must end with exactly the positions the stream implies (the journal makes each trade durable before the
/// books change and before the ack; an unacknowledged message is redelivered and counted once by version).
/// </summary>
[Trait("Category", "Fault")]
public sealed class KillUnderLoadTests(ITestOutputHelper output)
{
    private static readonly TimeSpan StartTimeout = TimeSpan.FromSeconds(40);
    private static readonly TimeSpan DrainTimeout = TimeSpan.FromSeconds(90);
    private const int KillAfterTrades = 400;

    [Fact]
    public async Task Kill9MidStreamThenRestartLosesAndDuplicatesNothing()
    {
        await using var rig = await FaultRig.CreateAsync();
        var stream = TradeStream.Generate(seed: 20261201, trades: 1200, rig.DataFolder, DateTimeOffset.UtcNow);
        using var cts = new CancellationTokenSource(TimeSpan.FromMinutes(3));

        ServiceProcess? first = null;
        ServiceProcess? second = null;
        try
        {
            first = rig.StartService();
            await using var publisher = await Publisher.ConnectAsync(rig.VirtualHost);
            await FaultRig.WaitForQueuesAsync(publisher, first, StartTimeout);
            // Publishing runs on while the service works, is killed, and is down.
            var publishing = Task.Run(async () =>
            {
                foreach (var message in stream.Messages)
                {
                    await publisher.PublishAsync(message, cts.Token);
                }
            });

            // Kill once the service has journalled a few hundred trades, with the rest still to come.
            var clock = Stopwatch.StartNew();
            while (rig.JournalFiles().Sum(f => f.Trades.Count) < KillAfterTrades)
            {
                Assert.True(clock.Elapsed < DrainTimeout, $"the service journalled fewer than {KillAfterTrades} trades in time. Output:\n" + first.Tail());
                Assert.False(publishing.IsFaulted, "publishing failed: " + publishing.Exception);
                await Task.Delay(20, cts.Token);
            }
            first.KillHard();
            var journalledAtKill = rig.JournalFiles().Sum(f => f.Trades.Count);
            await publishing;
            output.WriteLine($"SIGKILL after {journalledAtKill} journalled trade versions of {stream.TradeMessages}");
            Assert.True(journalledAtKill < stream.TradeMessages, "the kill came after every trade was processed; it proves nothing");

            var lastSeqOfFirstRun = LimitStatusAudit.LastCompleteSeq(rig);
            second = rig.StartService();
            await rig.WaitForDrainAsync(publisher, second, stream, DrainTimeout);
            var exit = await second.InterruptAsync(TimeSpan.FromSeconds(30));
            output.WriteLine("restarted service, last output lines:\n" + second.Tail(15));
            Assert.True(exit == 0, $"the restarted service exited with {exit} after SIGTERM. Output:\n{second.Tail()}");

            await FaultFigures.AssertNothingLostOrDuplicatedAsync(rig, publisher, stream, $"1 SIGKILL under load, after {journalledAtKill} of {stream.TradeMessages} trade versions were journalled", output);
            LimitStatusAudit.AssertEveryStatusChangeLogged(rig, stream, [lastSeqOfFirstRun], output);
        }
        finally
        {
            first?.Dispose();
            second?.Dispose();
        }
    }
}

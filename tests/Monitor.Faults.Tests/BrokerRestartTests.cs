using System.Diagnostics;
using Monitor.Faults.Tests.Support;
using Monitor.Service.Hosting;
using Xunit.Abstractions;

namespace Monitor.Faults.Tests;

/// <summary>
/// Broker restart under load: RabbitMQ's application is stopped and started (`rabbitmqctl stop_app` / `start_app`)
/// while the service works through a backlog. The service must reconnect by itself, report the lost connection in
/// its log and as an unhealthy "bus" check in its health report, and end with exactly the positions the stream implies.
/// </summary>
[Trait("Category", "Fault")]
public sealed class BrokerRestartTests(ITestOutputHelper output)
{
    private static readonly TimeSpan StartTimeout = TimeSpan.FromSeconds(40);
    private static readonly TimeSpan DrainTimeout = TimeSpan.FromSeconds(120);
    private static readonly TimeSpan Outage = TimeSpan.FromSeconds(5);
    private const int StopAfterTrades = 400;

    [Fact]
    public async Task BrokerStopAndStartMidStreamLosesAndDuplicatesNothing()
    {
        await using var rig = await FaultRig.CreateAsync();
        var stream = TradeStream.Generate(seed: 20261202, trades: 1200, rig.DataFolder, DateTimeOffset.UtcNow);
        var firstPart = stream.Messages.Count / 2;
        using var cts = new CancellationTokenSource(TimeSpan.FromMinutes(3));

        var health = new HealthStatusFile(Path.Combine(rig.Folder, "health.json"));
        ServiceProcess? service = null;
        Publisher? publisher = null;
        var brokerStopped = false;
        try
        {
            service = rig.StartService(health.ServiceEnvironment);
            publisher = await Publisher.ConnectAsync(rig.VirtualHost);
            await FaultRig.WaitForQueuesAsync(publisher, service, StartTimeout);
            await health.WaitForAsync(ServiceRegistration.BusHealthCheckName, "Healthy", service, StartTimeout);
            foreach (var message in stream.Messages.Take(firstPart))
            {
                await publisher.PublishAsync(message, cts.Token);
            }

            // Cut the broker while the service still has a backlog to work through.
            var clock = Stopwatch.StartNew();
            while (rig.JournalFiles().Sum(f => f.Trades.Count) < StopAfterTrades)
            {
                Assert.True(clock.Elapsed < DrainTimeout, $"the service journalled fewer than {StopAfterTrades} trades in time. Output:\n" + service.Tail());
                await Task.Delay(20, cts.Token);
            }
            var logLinesBefore = service.Output.Split('\n').Length;
            brokerStopped = true;
            await BrokerAdmin.StopAppAsync();
            var journalledAtStop = rig.JournalFiles().Sum(f => f.Trades.Count);
            var outage = Stopwatch.StartNew();
            var unhealthy = await health.WaitForAsync(ServiceRegistration.BusHealthCheckName, "Unhealthy", service, Outage + TimeSpan.FromSeconds(10));
            output.WriteLine($"health 'bus' Unhealthy {outage.Elapsed.TotalSeconds:F1} s into the outage: {unhealthy}");
            if (outage.Elapsed < Outage)
            {
                await Task.Delay(Outage - outage.Elapsed, cts.Token);
            }
            await BrokerAdmin.StartAppAsync();
            brokerStopped = false;
            await health.WaitForAsync(ServiceRegistration.BusHealthCheckName, "Healthy", service, TimeSpan.FromSeconds(60));
            output.WriteLine($"broker stopped after {journalledAtStop} journalled trade versions of {stream.TradeMessages} ({firstPart} messages published), down for {Outage.TotalSeconds} s");
            Assert.True(journalledAtStop < stream.TradeMessages, "the broker stop came after every trade was processed; it proves nothing");

            // The publisher's connection died with the broker: a new one sends the rest.
            await DisposeQuietlyAsync(publisher);
            publisher = await Publisher.ConnectAsync(rig.VirtualHost);
            foreach (var message in stream.Messages.Skip(firstPart))
            {
                await publisher.PublishAsync(message, cts.Token);
            }

            await rig.WaitForDrainAsync(publisher, service, stream, DrainTimeout);
            var reported = service.Output.Split('\n').Skip(logLinesBefore - 1)
                .Where(l => l.Contains("[WRN]", StringComparison.Ordinal) || l.Contains("[ERR]", StringComparison.Ordinal))
                .Where(l => !l.Contains("refit rejected", StringComparison.Ordinal))
                .ToList();
            output.WriteLine($"service log lines (warning or error, other than curve rejections) after the broker stop: {reported.Count}");
            foreach (var line in reported.Take(5))
            {
                output.WriteLine("  " + line);
            }
            var exit = await service.InterruptAsync(TimeSpan.FromSeconds(30));
            Assert.True(exit == 0, $"the service exited with {exit} after SIGTERM. Output:\n{service.Tail()}");
            Assert.True(reported.Count > 0, "the service logged no warning or error about the lost broker connection");

            await FaultFigures.AssertNothingLostOrDuplicatedAsync(rig, publisher, stream, $"1 broker stop_app/start_app ({Outage.TotalSeconds} s down) under load, after {journalledAtStop} of {stream.TradeMessages} trade versions were journalled", output);
            LimitStatusAudit.AssertEveryStatusChangeLogged(rig, stream, [], output);
        }
        finally
        {
            if (brokerStopped)
            {
                await BrokerAdmin.StartAppAsync();
            }
            service?.Dispose();
            if (publisher is not null)
            {
                await DisposeQuietlyAsync(publisher);
            }
        }
    }

    private static async Task DisposeQuietlyAsync(Publisher publisher)
    {
        try
        {
            await publisher.DisposeAsync().AsTask().WaitAsync(TimeSpan.FromSeconds(10));
        }
        catch (Exception ex) when (ex is TimeoutException or RabbitMQ.Client.Exceptions.RabbitMQClientException or ObjectDisposedException or IOException)
        {
            // The connection is already gone with the broker; nothing to close.
        }
    }
}

using MassTransit;
using Monitor.Contracts.V1;
using Monitor.Service.Hosting;

namespace Monitor.Cli.Demo;

/// <summary>
/// Plays the <see cref="DemoScenario"/> through the bus as an outside producer would: quote bursts sent to the
/// <c>monitor-quotes</c> queue, trades to <c>monitor-trades</c>, each when the simulated clock reaches its time.
/// </summary>
internal sealed class ScenarioDriver(IBus bus, SimulatedClock clock, QuoteFactory quotes, DemoRecorder recorder)
{
    public async Task RunAsync(CancellationToken cancellationToken)
    {
        var quoteEndpoint = await bus.GetSendEndpoint(new Uri($"queue:{InboundEndpoints.Quotes}")).ConfigureAwait(false);
        var tradeEndpoint = await bus.GetSendEndpoint(new Uri($"queue:{InboundEndpoints.Trades}")).ConfigureAwait(false);
        var trades = new Queue<ScenarioTrade>(DemoScenario.Trades);
        clock.Run();
        // Step 0 (08:00) is the opening quotes file the service fitted at start-up (OpeningQuotes).
        for (var step = 1; step < DemoScenario.BurstCount; step++)
        {
            var burstAt = DemoScenario.At(DemoScenario.Open + step * DemoScenario.BurstEvery);
            while (trades.TryPeek(out var trade) && DemoScenario.At(trade.At) < burstAt)
            {
                trades.Dequeue();
                await WaitUntil(DemoScenario.At(trade.At), cancellationToken).ConfigureAwait(false);
                var messageId = NewId.NextGuid();
                recorder.TradeSent(messageId, trade.TradeId);
                await tradeEndpoint.Send(Booked(trade, step), context => context.MessageId = messageId, cancellationToken).ConfigureAwait(false);
            }
            await WaitUntil(burstAt, cancellationToken).ConfigureAwait(false);
            foreach (var bond in quotes.Shuffled())
            {
                var error = burstAt.TimeOfDay == DemoScenario.FatFingerAt && bond.Id == DemoScenario.FatFingerInstrument ? -DemoScenario.FatFingerPoints : 0.0;
                await quoteEndpoint.Send(quotes.Quote(bond, burstAt, step, error), cancellationToken).ConfigureAwait(false);
                recorder.QuoteSent();
            }
        }
    }

    private TradeBooked Booked(ScenarioTrade trade, int step)
    {
        var time = DemoScenario.At(trade.At);
        var bond = quotes.Bonds.Single(b => b.Id == trade.InstrumentId);
        return new TradeBooked
        {
            TradeId = trade.TradeId,
            Version = 1,
            Action = "new",
            Book = trade.Book,
            InstrumentId = trade.InstrumentId,
            FaceAmount = trade.FaceAmount,
            CleanPrice = Math.Round(quotes.CleanPrice(bond, time, step), 3),
            TradeTime = time,
        };
    }

    private Task WaitUntil(DateTimeOffset simulated, CancellationToken cancellationToken)
    {
        var delay = clock.RealDelayUntil(simulated);
        return delay > TimeSpan.Zero ? Task.Delay(delay, cancellationToken) : Task.CompletedTask;
    }
}

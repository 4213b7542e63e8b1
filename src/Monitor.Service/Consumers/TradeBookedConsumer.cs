using MassTransit;
using Monitor.Contracts.V1;
using Monitor.Service.Engine;
using Monitor.Service.Pipeline;
using Monitor.Service.Telemetry;

namespace Monitor.Service.Consumers;

/// <summary>Applies a trade to its book (by version: redeliveries change nothing) and publishes what changed.</summary>
public sealed class TradeBookedConsumer(RiskPipeline pipeline, MonitorMetrics metrics) : IConsumer<TradeBooked>
{
    public Task Consume(ConsumeContext<TradeBooked> context) => ConsumeMeter.RunAsync(metrics, nameof(TradeBooked), () => Apply(context));

    private Task Apply(ConsumeContext<TradeBooked> context)
    {
        var trade = InboundMapper.ToTrade(context.Message);
        var cause = new Cause(nameof(TradeBooked), context.MessageId?.ToString() ?? trade.TradeId, trade.TradeTime);
        return pipeline.ApplyTradeAsync(trade, cause, context.CancellationToken);
    }
}

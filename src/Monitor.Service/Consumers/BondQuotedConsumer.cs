using MassTransit;
using Monitor.Contracts.V1;
using Monitor.Service.Engine;
using Monitor.Service.Pipeline;
using Monitor.Service.Telemetry;

namespace Monitor.Service.Consumers;

/// <summary>Keeps the quote and wakes the refit loop; the refit itself is conflated across a burst.</summary>
public sealed class BondQuotedConsumer(RiskPipeline pipeline, MonitorMetrics metrics) : IConsumer<BondQuoted>
{
    public Task Consume(ConsumeContext<BondQuoted> context) => ConsumeMeter.RunAsync(metrics, nameof(BondQuoted), () => Apply(context));

    private Task Apply(ConsumeContext<BondQuoted> context)
    {
        var quote = InboundMapper.ToQuote(context.Message);
        var cause = new Cause(nameof(BondQuoted), context.MessageId?.ToString() ?? context.Message.QuoteId, context.Message.QuoteTime);
        return pipeline.AcceptQuoteAsync(quote, cause, context.CancellationToken);
    }
}

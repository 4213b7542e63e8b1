using MassTransit;
using Monitor.Contracts.V1;
using Monitor.Service.Engine;
using Monitor.Service.Pipeline;
using Monitor.Service.Telemetry;

namespace Monitor.Service.Consumers;

/// <summary>Fits the government curve from published par yields (same quality gate as a bond fit) and revalues the books.</summary>
public sealed class ParYieldsPublishedConsumer(RiskPipeline pipeline, MonitorMetrics metrics) : IConsumer<ParYieldsPublished>
{
    public Task Consume(ConsumeContext<ParYieldsPublished> context) => ConsumeMeter.RunAsync(metrics, nameof(ParYieldsPublished), () => Apply(context));

    private Task Apply(ConsumeContext<ParYieldsPublished> context)
    {
        var points = InboundMapper.ToParYields(context.Message);
        var cause = new Cause(nameof(ParYieldsPublished), context.MessageId?.ToString() ?? string.Empty, context.Message.AsOf);
        return pipeline.ApplyParYieldsAsync(context.Message.CurveId, context.Message.AsOf, points, cause, context.CancellationToken);
    }
}

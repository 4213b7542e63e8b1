using MassTransit;
using Monitor.Contracts.V1;
using Monitor.Service.Engine;
using Monitor.Service.Pipeline;

namespace Monitor.Service.Consumers;

/// <summary>Fits the government curve from published par yields (same quality gate as a bond fit) and revalues the books.</summary>
public sealed class ParYieldsPublishedConsumer(RiskPipeline pipeline) : IConsumer<ParYieldsPublished>
{
    public Task Consume(ConsumeContext<ParYieldsPublished> context)
    {
        var points = InboundMapper.ToParYields(context.Message);
        var cause = new Cause(nameof(ParYieldsPublished), context.MessageId?.ToString() ?? string.Empty, context.Message.AsOf);
        return pipeline.ApplyParYieldsAsync(context.Message.CurveId, context.Message.AsOf, points, cause, context.CancellationToken);
    }
}

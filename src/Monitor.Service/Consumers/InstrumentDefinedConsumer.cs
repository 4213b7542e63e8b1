using MassTransit;
using Monitor.Contracts.V1;
using Monitor.Service.Pipeline;

namespace Monitor.Service.Consumers;

/// <summary>Adds or updates a bond's reference data.</summary>
public sealed class InstrumentDefinedConsumer(RiskPipeline pipeline) : IConsumer<InstrumentDefined>
{
    public Task Consume(ConsumeContext<InstrumentDefined> context) =>
        pipeline.DefineInstrumentAsync(InboundMapper.ToBond(context.Message), context.CancellationToken);
}

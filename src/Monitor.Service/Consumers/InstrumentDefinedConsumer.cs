using MassTransit;
using Monitor.Contracts.V1;
using Monitor.Service.Pipeline;
using Monitor.Service.Telemetry;

namespace Monitor.Service.Consumers;

/// <summary>Adds or updates a bond's reference data.</summary>
public sealed class InstrumentDefinedConsumer(RiskPipeline pipeline, MonitorMetrics metrics) : IConsumer<InstrumentDefined>
{
    public Task Consume(ConsumeContext<InstrumentDefined> context) =>
        ConsumeMeter.RunAsync(metrics, nameof(InstrumentDefined), () => pipeline.DefineInstrumentAsync(InboundMapper.ToBond(context.Message), context.CancellationToken));
}

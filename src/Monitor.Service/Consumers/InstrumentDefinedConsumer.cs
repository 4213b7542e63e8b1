using MassTransit;
using Monitor.Contracts.V1;
using Monitor.Service.Engine;
using Monitor.Service.Pipeline;
using Monitor.Service.Telemetry;

namespace Monitor.Service.Consumers;

/// <summary>Adds or updates a bond's reference data (journalled and logged first: <see cref="RiskPipeline.DefineInstrumentAsync"/>).</summary>
public sealed class InstrumentDefinedConsumer(RiskPipeline pipeline, MonitorMetrics metrics, TimeProvider time) : IConsumer<InstrumentDefined>
{
    public Task Consume(ConsumeContext<InstrumentDefined> context) =>
        ConsumeMeter.RunAsync(metrics, nameof(InstrumentDefined), () =>
        {
            var bond = InboundMapper.ToBond(context.Message);
            // The message carries no time of its own: the event time is when it arrived.
            var cause = new Cause(nameof(InstrumentDefined), context.MessageId?.ToString() ?? bond.Id, time.GetUtcNow());
            return pipeline.DefineInstrumentAsync(bond, cause, context.CancellationToken);
        });
}

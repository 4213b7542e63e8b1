using MassTransit;
using Monitor.Contracts.V1;

namespace Monitor.Cli.Demo;

/// <summary>Hands each <see cref="LimitStatusChanged"/> the service publishes to the demo's recorder (and so to the view).</summary>
internal sealed class LimitStatusConsumer(DemoRecorder recorder) : IConsumer<LimitStatusChanged>
{
    public Task Consume(ConsumeContext<LimitStatusChanged> context)
    {
        recorder.Changed(context.Message);
        return Task.CompletedTask;
    }
}

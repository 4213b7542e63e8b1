using MassTransit;
using Monitor.Contracts.V1;

namespace Monitor.Cli.Demo;

/// <summary>Counts the curves the service fits and records the refits it refuses.</summary>
internal sealed class CurveEventConsumer(DemoRecorder recorder) : IConsumer<CurveFitted>, IConsumer<CurveRejected>
{
    public Task Consume(ConsumeContext<CurveFitted> context)
    {
        recorder.Fitted(context.Message);
        return Task.CompletedTask;
    }

    public Task Consume(ConsumeContext<CurveRejected> context)
    {
        recorder.Rejected(context.Message);
        return Task.CompletedTask;
    }
}

using MassTransit;
using Monitor.Contracts.V1;

namespace Monitor.Cli.Load;

/// <summary>The baseline of <c>monitor load --mode bare</c>: consumes <see cref="BondQuoted"/> and does nothing with it.</summary>
internal sealed class BareQuoteConsumer : IConsumer<BondQuoted>
{
    public Task Consume(ConsumeContext<BondQuoted> context) => Task.CompletedTask;
}

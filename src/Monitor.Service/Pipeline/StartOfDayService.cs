using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using Monitor.Files;
using Monitor.Service.Engine;
using Monitor.Service.Hosting;

namespace Monitor.Service.Pipeline;

/// <summary>
/// Runs once the bus is up: builds the engine (instruments, positions, limits: a bad file stops the start),
/// then fits the opening curves from the opening quotes file when one is configured, publishing the result.
/// </summary>
public sealed partial class StartOfDayService(RiskPipeline pipeline, IOptions<MonitorOptions> options, TimeProvider time, ILogger<StartOfDayService> logger)
    : IHostedService
{
    public async Task StartAsync(CancellationToken cancellationToken)
    {
        var (date, books, instruments) = await pipeline.ReadAsync(e => (e.ValuationDate, e.Books.Count, e.Instruments.Count), cancellationToken).ConfigureAwait(false);
        LogStarted(date, books, instruments);
        if (options.Value.OpeningQuotesFile is { Length: > 0 } path)
        {
            var quotes = QuoteFile.Read(path);
            foreach (var quote in quotes)
            {
                await pipeline.AcceptQuoteAsync(quote, new Cause("opening-quotes", string.Empty, quote.QuoteTime), cancellationToken).ConfigureAwait(false);
            }
            await pipeline.RefitAsync(cancellationToken).ConfigureAwait(false);
            LogOpeningFit(quotes.Count, path);
        }
        _ = time;
    }

    public Task StopAsync(CancellationToken cancellationToken) => Task.CompletedTask;

    [LoggerMessage(Level = LogLevel.Information, Message = "Monitor started for valuation date {ValuationDate:yyyy-MM-dd}: {Books} books, {Instruments} instruments")]
    private partial void LogStarted(DateOnly valuationDate, int books, int instruments);

    [LoggerMessage(Level = LogLevel.Information, Message = "Opening curves fitted from {Count} quotes in {Path}")]
    private partial void LogOpeningFit(int count, string path);
}

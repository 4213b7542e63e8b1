using Monitor.Contracts.V1;

namespace Monitor.Cli.Demo;

/// <summary>
/// The demo's output as plain lines (<c>--no-live</c>, or when output is redirected): each warning, breach, clear
/// and refused refit as it arrives, and one progress line per simulated hour.
/// </summary>
internal sealed class PlainView(TextWriter output)
{
    private readonly TextWriter _output = TextWriter.Synchronized(output);

    public async Task RunAsync(Func<Task<DemoSnapshot>> capture, DemoRecorder recorder, Task until)
    {
        ArgumentNullException.ThrowIfNull(capture);
        ArgumentNullException.ThrowIfNull(recorder);
        ArgumentNullException.ThrowIfNull(until);
        void OnChange(ObservedStatusChange change) => _output.WriteLine(DemoFormat.StatusLine(change));
        void OnRejected(CurveRejected rejected) => _output.WriteLine(
            $"{DemoFormat.Clock(rejected.AsOf)}  REFIT REFUSED  {rejected.CurveId}: {string.Join("; ", rejected.Reasons)}; version {rejected.KeptCurveVersion} kept");
        recorder.StatusChanged += OnChange;
        recorder.CurveRejectedSeen += OnRejected;
        try
        {
            var nextHour = DemoScenario.DayStart;
            while (!until.IsCompleted)
            {
                var snapshot = await capture().ConfigureAwait(false);
                if (snapshot.SimulatedTime >= nextHour)
                {
                    _output.WriteLine(Progress(snapshot, recorder));
                    nextHour = nextHour.AddHours(1);
                }
                await Task.WhenAny(until, Task.Delay(50)).ConfigureAwait(false);
            }
        }
        finally
        {
            recorder.StatusChanged -= OnChange;
            recorder.CurveRejectedSeen -= OnRejected;
        }
    }

    private static string Progress(DemoSnapshot snapshot, DemoRecorder recorder)
    {
        var books = string.Join("  ", snapshot.Books.Select(b => $"{b.Book} DV01 {DemoFormat.Money(b.Dv01)}{b.Mark}"));
        var legend = snapshot.Books.Any(b => b.Provisional) ? $"  ({BookRow.ProvisionalMark} provisional)" : string.Empty;
        return $"{DemoFormat.Clock(snapshot.SimulatedTime)}  quotes {recorder.QuotesSent}, fits {recorder.Fits}, trades {recorder.TradesSent}  |  {books}{legend}";
    }
}

namespace Monitor.Service.Pipeline;

/// <summary>
/// Told when a business day has closed and its <c>day-closed</c> record is on the disk (e.g. to write a checkpoint
/// of the exposure log, or to archive old days). Register as a singleton <c>IDayCloseListener</c>; every one
/// registered is called in registration order by <see cref="DayCloseWorker"/>, outside the pipeline's lock. A
/// listener that throws is logged as an error; the others still run.
/// </summary>
public interface IDayCloseListener
{
    Task OnDayClosedAsync(DayClose close, CancellationToken cancellationToken);
}

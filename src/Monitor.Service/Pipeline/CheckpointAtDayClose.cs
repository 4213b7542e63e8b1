namespace Monitor.Service.Pipeline;

/// <summary>Cuts an exposure log checkpoint (reason <see cref="ExposureLogCheckpointer.DayClose"/>) once a business day's <c>day-closed</c> record is on the disk.</summary>
public sealed class CheckpointAtDayClose(ExposureLogCheckpointer checkpointer) : IDayCloseListener
{
    public Task OnDayClosedAsync(DayClose close, CancellationToken cancellationToken) =>
        checkpointer.WriteCheckpointAsync(ExposureLogCheckpointer.DayClose, cancellationToken);
}

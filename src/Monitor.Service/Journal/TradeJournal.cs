using System.Threading.Channels;
using Monitor.Analytics.Market;
using Monitor.Service.Engine;

using Monitor.Service.Storage;

namespace Monitor.Service.Journal;

/// <summary>
/// Append-only journal of accepted trades and of quotes, one file per business day (format trade-journal/2, README.md in
/// this folder). Group commit: appends go through a queue to one writer loop, which writes every record waiting
/// and then fsyncs once (<c>FileStream.Flush(true)</c>) for the whole batch, so concurrent callers share a flush.
/// <see cref="AppendTradeAsync"/> completes only after its record is on the disk; <see cref="AppendQuote"/> does
/// not wait (quotes are refreshed all day) but keeps file order with the trades. A failed write fails every
/// trade of its batch with <see cref="JournalWriteException"/> (the callers retry them), keeps its quotes for the next
/// batch (retried every second meanwhile), makes the journal unhealthy until a later write succeeds, and is cut back
/// (no partial line stays) before the next write. One journal per folder.
/// </summary>
public sealed class TradeJournal : IAsyncDisposable
{
    private readonly string _folder;
    private readonly BusinessDayRoll _roll;
    private readonly RecordKey _key;
    private readonly int _maxBatch;
    private readonly TimeProvider _time;
    private readonly Channel<Entry> _queue = Channel.CreateUnbounded<Entry>(new UnboundedChannelOptions { SingleReader = true });
    private readonly List<JournalProblem> _repairs = [];
    private readonly List<Entry> _carried = [];
    private readonly Task _loop;
    private FileStream? _stream;
    private string? _path;
    private long _seq;
    private string _lastMac = JournalLine.Genesis;
    private long _goodLength;
    private bool _needsRepair;
    private string? _lost;
    private volatile string? _lastError;
    private long _flushes;
    private long _records;

    /// <summary>How long quotes of a failed batch wait for a retry when no other append comes.</summary>
    internal static readonly TimeSpan QuoteRetryDelay = TimeSpan.FromSeconds(1);

    public TradeJournal(RecordKey key, JournalOptions options, TimeProvider time, BusinessDayRoll? roll = null)
    {
        ArgumentNullException.ThrowIfNull(key);
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(time);
        if (string.IsNullOrWhiteSpace(options.Folder))
        {
            throw new ArgumentException("Journal:Folder is blank; set the folder of the trade journal.", nameof(options));
        }
        if (options.MaxBatch < 1)
        {
            throw new ArgumentException($"Journal:MaxBatch {options.MaxBatch} must be 1 or more.", nameof(options));
        }
        _folder = options.Folder;
        _roll = roll ?? BusinessDayRoll.UtcMidnight;
        _key = key;
        _maxBatch = options.MaxBatch;
        _time = time;
        _loop = Task.Run(RunAsync);
    }

    /// <summary>False from a failed write until the next successful one.</summary>
    public bool IsHealthy => _lastError is null;

    /// <summary>The last failure (path and reason); null while healthy.</summary>
    public string? LastError => _lastError;

    /// <summary>Torn tails cut off when a day file was opened for appending (found before the first write to it).</summary>
    public IReadOnlyList<JournalProblem> Repairs
    {
        get
        {
            lock (_repairs)
            {
                return _repairs.ToArray();
            }
        }
    }

    /// <summary>Flushes (one per written batch; an fsync when the batch holds a trade).</summary>
    internal long FlushCount => Interlocked.Read(ref _flushes);

    /// <summary>Records written since start.</summary>
    internal long RecordCount => Interlocked.Read(ref _records);

    /// <summary>The day file of a business day in this journal's folder.</summary>
    public string PathOf(DateOnly day) => JournalFiles.PathOf(_folder, day);

    /// <summary>
    /// Queues the trade (synchronously, before returning: calls made in some order are written in that order)
    /// and completes once its line is fsynced. Throws <see cref="JournalWriteException"/> when the write failed.
    /// Cancelling stops the wait only: the record may still be written.
    /// </summary>
    public ValueTask AppendTradeAsync(TradeInput trade, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(trade);
        var done = new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);
        if (!_queue.Writer.TryWrite(new Entry(trade, null, done)))
        {
            throw new ObjectDisposedException(nameof(TradeJournal));
        }
        return new ValueTask(cancellationToken.CanBeCanceled ? done.Task.WaitAsync(cancellationToken) : done.Task);
    }

    /// <summary>As <see cref="AppendTradeAsync"/> for an accepted instrument definition (line kind <c>instrument</c>).</summary>
    public ValueTask AppendDefinitionAsync(Analytics.Instruments.Bond bond, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(bond);
        var done = new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);
        if (!_queue.Writer.TryWrite(new Entry(null, null, done) { Definition = bond }))
        {
            throw new ObjectDisposedException(nameof(TradeJournal));
        }
        return new ValueTask(cancellationToken.CanBeCanceled ? done.Task.WaitAsync(cancellationToken) : done.Task);
    }

    /// <summary>
    /// Completes once everything queued before it is fsynced, quotes kept from a failed batch included; throws
    /// <see cref="JournalWriteException"/> when that write fails. Lets a quote consumer wait out a failing journal.
    /// </summary>
    public Task FlushAsync(CancellationToken cancellationToken = default)
    {
        var done = new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);
        if (!_queue.Writer.TryWrite(new Entry(null, null, done)))
        {
            throw new ObjectDisposedException(nameof(TradeJournal));
        }
        return cancellationToken.CanBeCanceled ? done.Task.WaitAsync(cancellationToken) : done.Task;
    }

    /// <summary>Queues a quote without waiting: it is written in order with the trades and on disk at the next fsync.</summary>
    public void AppendQuote(BondQuote quote)
    {
        ArgumentNullException.ThrowIfNull(quote);
        if (!_queue.Writer.TryWrite(new Entry(null, quote, null)))
        {
            throw new ObjectDisposedException(nameof(TradeJournal));
        }
    }

    /// <summary>Writes what is queued, then closes the file.</summary>
    public async ValueTask DisposeAsync()
    {
        _queue.Writer.TryComplete();
        await _loop.ConfigureAwait(false);
        CloseQuietly();
    }

    private async Task RunAsync()
    {
        var batch = new List<Entry>(_maxBatch);
        var reader = _queue.Reader;
        while (true)
        {
            if (_carried.Count == 0)
            {
                if (!await reader.WaitToReadAsync().ConfigureAwait(false))
                {
                    return;
                }
            }
            else if (!await WaitOrRetryAsync(reader).ConfigureAwait(false))
            {
                WriteBatch([.. _carried]); // closing with quotes still unwritten: one last try
                return;
            }
            batch.Clear();
            batch.AddRange(_carried);
            _carried.Clear();
            while (batch.Count < _maxBatch && reader.TryRead(out var entry))
            {
                batch.Add(entry);
            }
            WriteBatch(batch);
        }
    }

    /// <summary>With quotes of a failed batch waiting: wakes on the next append or after <see cref="QuoteRetryDelay"/>; false once the queue is closed.</summary>
    private async Task<bool> WaitOrRetryAsync(ChannelReader<Entry> reader)
    {
        using var retry = new CancellationTokenSource(QuoteRetryDelay, _time);
        try
        {
            return await reader.WaitToReadAsync(retry.Token).ConfigureAwait(false);
        }
        catch (OperationCanceledException) when (retry.IsCancellationRequested)
        {
            return !reader.Completion.IsCompleted;
        }
    }

    private void WriteBatch(List<Entry> batch)
    {
        var now = _time.GetUtcNow();
        var path = JournalFiles.PathOf(_folder, _roll.BusinessDateOf(now));
        var seq = _seq;
        var mac = _lastMac;
        var written = 0L;
        try
        {
            EnsureOpen(path);
            seq = _seq;
            mac = _lastMac;
            var durable = false;
            foreach (var entry in batch)
            {
                durable |= entry.Done is not null;
                if (entry.Trade is null && entry.Quote is null && entry.Definition is null)
                {
                    continue; // a flush request: no line of its own
                }
                seq++;
                var line = entry.Trade is { } trade ? JournalLine.Trade(_key, seq, now, trade, mac)
                    : entry.Definition is { } bond ? JournalLine.Definition(_key, seq, now, bond, mac)
                    : JournalLine.Quote(_key, seq, now, entry.Quote!, mac);
                mac = JournalLine.MacIn(line);
                _stream!.Write(line);
                written += line.Length;
            }
            _stream!.Flush(flushToDisk: durable);
            Interlocked.Increment(ref _flushes);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException or NotSupportedException)
        {
            _needsRepair = true;
            CloseQuietly();
            var failure = new JournalWriteException(_path ?? path, ex.Message, ex);
            _lastError = failure.Message;
            foreach (var entry in batch)
            {
                entry.Done?.TrySetException(failure);
            }
            // Trades fail to their callers, who retry them; quotes have no caller waiting, so the journal keeps them and
            // writes them first with the next batch (file order stays the order of the appends).
            _carried.AddRange(batch.Where(e => e.Done is null));
            return;
        }
        Interlocked.Add(ref _records, seq - _seq);
        _seq = seq;
        _lastMac = mac;
        _goodLength += written;
        _lastError = null;
        foreach (var entry in batch)
        {
            entry.Done?.TrySetResult();
        }
    }

    /// <summary>Opens the day file for appending: cuts back what a failed write left, and on first opening a file continues its sequence.</summary>
    private void EnsureOpen(string path)
    {
        if (_lost is not null)
        {
            throw new IOException(_lost);
        }
        if (_stream is not null && _path is not null)
        {
            CheckStillOnDisk(_path);
        }
        if (_stream is not null && !_needsRepair && string.Equals(path, _path, StringComparison.Ordinal))
        {
            return;
        }
        CloseQuietly();
        if (_needsRepair && _path is not null && File.Exists(_path))
        {
            // The file of the failed write first (maybe yesterday's): no partial line may stay behind.
            PartialWriteCutBack.CutBackTo(_path, _goodLength);
        }
        if (!string.Equals(path, _path, StringComparison.Ordinal))
        {
            Directory.CreateDirectory(_folder);
            var existing = JournalReplay.ReadFile(_key, path);
            if (existing.CompleteLength < FileLength.Of(path))
            {
                PartialWriteCutBack.CutBackTo(path, existing.CompleteLength);
                lock (_repairs)
                {
                    _repairs.AddRange(existing.Problems.Where(p => p.Kind == JournalProblemKind.TornTail));
                }
            }
            _path = path;
            _seq = existing.LastSeq;
            _lastMac = existing.LastMac;
            _goodLength = existing.CompleteLength;
        }
        _stream = new FileStream(path, FileMode.Append, FileAccess.Write, FileShare.Read, bufferSize: 64 * 1024);
        _needsRepair = false;
    }

    /// <summary>
    /// Refuses to write into a file that is no longer the one on disk: the day file (or its folder) was deleted or
    /// replaced under the writer, so appends would go into an unlinked file and vanish at the next start. The path must
    /// still exist with exactly the bytes this writer put there (a replacement of the very same length is not caught).
    /// From then on every write fails (a storage fault: <c>storage</c> Unhealthy, acknowledgements stop) until the
    /// file is restored and the service restarted.
    /// </summary>
    private void CheckStillOnDisk(string path)
    {
        var onDisk = File.Exists(path) ? FileLength.Of(path) : -1;
        if (onDisk != _goodLength)
        {
            _lost = onDisk < 0
                ? $"the journal day file {path} (or its folder) was deleted while the service was writing it; restore it and restart the service."
                : $"the journal day file {path} holds {onDisk} bytes but this writer wrote {_goodLength}: it was replaced or changed while the service was writing it; restore it and restart the service.";
            throw new IOException(_lost);
        }
    }

    private void CloseQuietly()
    {
        var stream = _stream;
        _stream = null;
        try
        {
            stream?.Dispose();
        }
        catch (IOException)
        {
            // Disposing flushes what a failed write left in the buffer; the repair cuts it off again.
        }
        catch (UnauthorizedAccessException)
        {
        }
    }

    private sealed record Entry(TradeInput? Trade, BondQuote? Quote, TaskCompletionSource? Done)
    {
        public Analytics.Instruments.Bond? Definition { get; init; }
    }
}

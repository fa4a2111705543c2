using System.Runtime.CompilerServices;
using System.Text;
using System.Threading.Channels;
using GelDispense.Agent.Formats;
using Polly;
using Polly.Retry;

namespace GelDispense.Agent.Links;

/// <summary>
/// The one <see cref="IBalanceLink"/> implementation: a background thread that opens a connection through its
/// connector, cuts the bytes into lines, and on any failure reports Lost, closes the old connection off-thread
/// with a bound and reopens with exponential backoff (Polly). A fresh <see cref="LineSplitter"/> per connection
/// keeps half a line from before a hang-up out of the first line after it, and it drops the first (possibly
/// partial) line of every connection: losing one reading is cheap, a tail parsed as a mass is not.
/// </summary>
public sealed class BalanceLink : IBalanceLink
{
    private readonly IBalanceConnector _connector;
    private readonly string _terminator;
    private readonly int _maxLineLength;
    private readonly ReconnectSettings _settings;
    private readonly TimeProvider _time;
    private readonly Channel<ReceivedLine> _lines;
    private readonly CancellationTokenSource _stop = new();
    private readonly Lock _sendGate = new();
    private IBalanceConnection? _current;
    private volatile string? _writeFailure;
    private Thread? _worker;
    private int _epoch;

    public BalanceLink(IBalanceConnector connector, LineEnding commandEnding, int maxLineLength, ReconnectSettings settings, TimeProvider time)
    {
        _connector = connector;
        _terminator = commandEnding.Terminator();
        _maxLineLength = maxLineLength;
        _settings = settings;
        _time = time;
        _lines = Channel.CreateBounded<ReceivedLine>(new BoundedChannelOptions(settings.LineBufferCapacity)
        {
            FullMode = BoundedChannelFullMode.DropOldest,
            SingleReader = true,
            SingleWriter = true,
        });
    }

    public LinkStatus Status { get; private set; } = LinkStatus.Connecting;

    public event EventHandler<LinkStatusChange>? StatusChanged;

    public string Describe => _connector.Describe;

    public void Start()
    {
        if (_worker is not null)
        {
            return;
        }

        _worker = new Thread(Run) { IsBackground = true, Name = $"balance link {Describe}" };
        _worker.Start();
    }

    public async IAsyncEnumerable<ReceivedLine> ReadLinesAsync([EnumeratorCancellation] CancellationToken cancellationToken)
    {
        await foreach (var line in _lines.Reader.ReadAllAsync(cancellationToken).ConfigureAwait(false))
        {
            yield return line;
        }
    }

    public Task<bool> SendAsync(string command, CancellationToken cancellationToken)
    {
        var bytes = Encoding.ASCII.GetBytes(command + _terminator);

        // Writes are short and bounded by the write timeout; doing them inline keeps commands in order.
        lock (_sendGate)
        {
            if (_current is not { } connection)
            {
                return Task.FromResult(false);
            }

            try
            {
                connection.Write(bytes);
                return Task.FromResult(true);
            }
            catch (Exception ex) when (ex is TimeoutException or IOException or ObjectDisposedException or InvalidOperationException or System.Net.Sockets.SocketException)
            {
                // The reader thread owns the connection's life; tell it, and let it close and reopen.
                _writeFailure = $"write failed: {ex.Message}";
                return Task.FromResult(false);
            }
        }
    }

    public async ValueTask DisposeAsync()
    {
        await _stop.CancelAsync().ConfigureAwait(false);
        if (_worker is { } worker)
        {
            await Task.Run(() => worker.Join(TimeSpan.FromSeconds(5))).ConfigureAwait(false);
        }

        _lines.Writer.TryComplete();
        Report(LinkStatus.Closed, "stopped", 0);
        _stop.Dispose();
    }

    private void Run()
    {
        var reopen = BuildReopenPipeline();
        var first = true;
        while (!_stop.IsCancellationRequested)
        {
            if (first)
            {
                Report(LinkStatus.Connecting, $"opening {Describe}", 0);
            }
            else
            {
                Report(LinkStatus.Reconnecting, $"reopening {Describe}", 0);
            }

            IBalanceConnection connection;
            try
            {
                connection = reopen.Execute(_ => _connector.Open(), _stop.Token);
            }
            catch (OperationCanceledException)
            {
                return;
            }

            first = false;
            var reason = Pump(connection);
            lock (_sendGate)
            {
                _current = null;
            }

            connection.Dispose();
            if (reason is not null)
            {
                Report(LinkStatus.Lost, reason, 0);

                // A peer that accepts and drops at once must not make this loop spin.
                try
                {
                    Task.Delay(_settings.FirstDelay, _time, _stop.Token).GetAwaiter().GetResult();
                }
                catch (OperationCanceledException)
                {
                    return;
                }
            }
        }
    }

    /// <summary>Reads until the connection fails (returns why) or the link stops (returns null).</summary>
    private string? Pump(IBalanceConnection connection)
    {
        var epoch = Interlocked.Increment(ref _epoch);
        var splitter = new LineSplitter(_maxLineLength, startsMidLine: true);
        var buffer = new byte[4096];
        var lastDataAt = _time.GetUtcNow();
        _writeFailure = null;
        lock (_sendGate)
        {
            _current = connection;
        }

        Report(LinkStatus.Connected, $"connected to {Describe}", 0);
        try
        {
            while (!_stop.IsCancellationRequested)
            {
                var n = connection.Read(buffer);
                var now = _time.GetUtcNow();
                if (n > 0)
                {
                    lastDataAt = now;
                    splitter.Feed(buffer.AsSpan(0, n), line => _lines.Writer.TryWrite(new ReceivedLine(line, epoch, now)));
                }
                else if (_settings.SilenceLimit is { } limit && now - lastDataAt > limit)
                {
                    return $"no data for {limit.TotalSeconds:0.#} s";
                }

                if (_writeFailure is { } failure)
                {
                    return failure;
                }
            }

            return null;
        }
        catch (Exception ex) when (!_stop.IsCancellationRequested)
        {
            return $"{ex.GetType().Name}: {ex.Message}";
        }
        catch (Exception)
        {
            return null;
        }
    }

    private ResiliencePipeline BuildReopenPipeline() =>
        new ResiliencePipelineBuilder { TimeProvider = _time }
            .AddRetry(new RetryStrategyOptions
            {
                ShouldHandle = new PredicateBuilder().Handle<Exception>(ex => ex is not OperationCanceledException),
                MaxRetryAttempts = int.MaxValue,
                BackoffType = DelayBackoffType.Exponential,
                UseJitter = true,
                Delay = _settings.FirstDelay,
                MaxDelay = _settings.MaxDelay,
                OnRetry = args =>
                {
                    var why = args.Outcome.Exception?.Message ?? "open failed";
                    Report(LinkStatus.Reconnecting, $"{why}; next try in {args.RetryDelay.TotalSeconds:0.0} s", args.AttemptNumber + 1);
                    return default;
                },
            })
            .Build();

    private void Report(LinkStatus status, string reason, int attempt)
    {
        Status = status;
        StatusChanged?.Invoke(this, new LinkStatusChange(status, reason, attempt, _time.GetUtcNow()));
    }
}

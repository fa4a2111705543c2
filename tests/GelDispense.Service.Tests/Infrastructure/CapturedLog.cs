using System.Collections.Concurrent;
using Serilog.Core;
using Serilog.Events;

namespace GelDispense.Service.Tests.Infrastructure;

/// <summary>A Serilog sink the service's logger picks up from its services (ReadFrom.Services): register it as an ILogEventSink.</summary>
public sealed class CapturedLog : ILogEventSink
{
    private readonly ConcurrentQueue<string> _messages = new();

    public IEnumerable<string> Messages => _messages;

    public void Emit(LogEvent logEvent) => _messages.Enqueue(logEvent.RenderMessage(System.Globalization.CultureInfo.InvariantCulture));
}

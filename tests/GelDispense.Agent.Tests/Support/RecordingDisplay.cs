using System.Collections.Concurrent;
using GelDispense.Agent.Display;
using GelDispense.Contracts.V1;

namespace GelDispense.Agent.Tests.Support;

/// <summary>A display that keeps every note with its time, and writes them as plain lines for a failing test's message.</summary>
internal sealed class RecordingDisplay : IStationDisplay
{
    private readonly StringWriter _text = new();
    private readonly PlainLogDisplay _plain;

    public RecordingDisplay()
    {
        _plain = new PlainLogDisplay(_text, TimeProvider.System, TimeSpan.FromSeconds(1));
    }

    public ConcurrentQueue<(NoteKind Kind, string Text, DateTimeOffset At)> Notes { get; } = new();

    public AsMade? Finished { get; private set; }

    public string Log
    {
        get
        {
            lock (_text)
            {
                return _text.ToString();
            }
        }
    }

    public void Show(StationView view)
    {
    }

    public void Note(NoteKind kind, string text)
    {
        Notes.Enqueue((kind, text, DateTimeOffset.UtcNow));
        lock (_text)
        {
            _plain.Note(kind, text);
        }
    }

    public void Finish(AsMade asMade, string recipeName, string origin)
    {
        Finished = asMade;
        lock (_text)
        {
            _plain.Finish(asMade, recipeName, origin);
        }
    }

    public bool Said(string fragment) => Notes.Any(n => n.Text.Contains(fragment, StringComparison.OrdinalIgnoreCase));

    public ValueTask DisposeAsync() => ValueTask.CompletedTask;
}

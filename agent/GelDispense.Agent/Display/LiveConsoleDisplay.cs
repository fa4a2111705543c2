using System.Globalization;
using GelDispense.Agent.Links;
using GelDispense.Agent.Service;
using GelDispense.Contracts.V1;
using Spectre.Console;
using Spectre.Console.Rendering;

namespace GelDispense.Agent.Display;

/// <summary>
/// The live panel on a terminal (Spectre.Console): the step, reagent and lot, target and window, the live reading
/// with a bar toward the target, stability and drift, both links, the reagent's cautions, and the latest notes.
/// Redrawn at most every <c>refresh</c>; the sequencer never waits for the terminal.
/// </summary>
public sealed class LiveConsoleDisplay : IStationDisplay
{
    private const int NotesKept = 8;

    private readonly IAnsiConsole _console;
    private readonly TimeProvider _time;
    private readonly TimeSpan _refresh;
    private readonly Queue<string> _notes = new();
    private readonly TaskCompletionSource _done = new(TaskCreationOptions.RunContinuationsAsynchronously);
    private readonly TaskCompletionSource<LiveDisplayContext> _context = new(TaskCreationOptions.RunContinuationsAsynchronously);
    private readonly Task _live;
    private StationView? _view;
    private DateTimeOffset _drawnAt = DateTimeOffset.MinValue;

    public LiveConsoleDisplay(IAnsiConsole console, TimeProvider time, TimeSpan refresh)
    {
        _console = console;
        _time = time;
        _refresh = refresh;
        _live = console.Live(new Markup("starting…")).AutoClear(false).StartAsync(async context =>
        {
            _context.TrySetResult(context);
            await _done.Task.ConfigureAwait(false);
        });
    }

    public void Show(StationView view)
    {
        _view = view;
        var now = _time.GetUtcNow();
        if (now - _drawnAt >= _refresh)
        {
            _drawnAt = now;
            Draw();
        }
    }

    public void Note(NoteKind kind, string text)
    {
        var color = kind switch { NoteKind.Alert => "red", NoteKind.Warning => "yellow", NoteKind.Good => "green", _ => "grey" };
        var at = _time.GetLocalNow().ToString("HH:mm:ss", CultureInfo.InvariantCulture);
        _notes.Enqueue($"[{color}]{at}  {Markup.Escape(text)}[/]");
        while (_notes.Count > NotesKept)
        {
            _notes.Dequeue();
        }

        Draw();
    }

    public void Finish(AsMade asMade, string recipeName, string origin)
    {
        Draw();
        Stop();
        var summary = AsMadeSummary.From(asMade, recipeName, origin);
        _console.Write(new Rule(Markup.Escape(summary.Heading)));
        foreach (var line in summary.Totals)
        {
            _console.MarkupLine(Markup.Escape(line));
        }

        _console.Write(Table(AsMadeSummary.ComponentColumns, summary.Components, null));
        _console.Write(Table(AsMadeSummary.DeviationColumns, summary.Deviations, 5));
        foreach (var line in summary.Footer)
        {
            _console.MarkupLine(Markup.Escape(line));
        }
    }

    public async ValueTask DisposeAsync()
    {
        Stop();
        await _live.ConfigureAwait(false);
    }

    private void Stop() => _done.TrySetResult();

    private void Draw()
    {
        if (!_context.Task.IsCompleted || _done.Task.IsCompleted)
        {
            return;
        }

        var context = _context.Task.Result;
        context.UpdateTarget(Render());
        context.Refresh();
    }

    private IRenderable Render()
    {
        var rows = new List<IRenderable>();
        if (_view is { } v)
        {
            rows.AddRange(StepRows(v).Select(r => new Markup(r)));
        }

        rows.Add(new Rule("notes"));
        rows.AddRange(_notes.Select(n => new Markup(n)));
        return new Panel(new Rows(rows)) { Header = new PanelHeader("GelDispense station"), Expand = true };
    }

    private static IEnumerable<string> StepRows(StationView v)
    {
        var d = v.ReadabilityG;
        yield return $"[bold]{Markup.Escape(v.RecipeName)}[/]  batch {Markup.Escape(v.BatchId)}";
        if (v.StepIndex >= 0)
        {
            var lot = v.LotId.Length > 0 ? $"  lot {Markup.Escape(v.LotId)}" : "";
            yield return $"step [bold]{v.StepNumber}/{v.StepCount}[/]  [bold cyan]{Markup.Escape(v.ReagentId)}[/]{lot}  ({v.Phase.ToString().ToLowerInvariant()})";
            yield return $"target [bold]{Grams.Text(v.TargetNetG, d)}[/]  window {Grams.Text(v.LowNetG, d)} .. {Grams.Text(v.HighNetG, d)}";
            var color = v.LiveNetG is not { } net || v.LowNetG is not { } low || v.HighNetG is not { } high ? "white" : net > high ? "red" : net >= low ? "green" : "yellow";
            var bar = v.LowNetG is { } l && v.HighNetG is { } h ? TargetBar.Render(v.LiveNetG, l, h, 40) : "";
            yield return $"reading [{color} bold]{Grams.Text(v.LiveNetG, d)}[/] {Markup.Escape(v.ReadingState)}  [{color}]{Markup.Escape(bar)}[/]";
            if (v.VolumeToDeliverMl is { } ml)
            {
                yield return string.Create(CultureInfo.InvariantCulture,
                    $"pipette: deliver [bold]{ml * 1000:0} µL[/]; the balance shows {v.LiveVolumeMl * 1000 ?? 0:0} µL (ρ {v.DensityGPerMl:0.0000} g/mL at {v.TemperatureC:0.#} °C)");
            }

            if (v.DriftGPerMin is { } slope)
            {
                yield return $"[yellow]drift {Grams.Signed(slope * 1000, 1)} mg/min: evaporation? cover the vessel and confirm promptly[/]";
            }

            foreach (var caution in v.Cautions)
            {
                yield return $"[red]caution[/] {Markup.Escape(caution)}";
            }
        }

        var balance = v.BalanceStatus == LinkStatus.Connected ? "green" : "red";
        var service = v.ServiceStatus == ServiceStatus.Offline ? "red" : "green";
        var pending = v.PendingAdditions > 0 ? $", {v.PendingAdditions} pending" : "";
        yield return $"balance [{balance}]{v.BalanceStatus}[/]   service [{service}]{(v.ServiceStatus == ServiceStatus.Offline ? "OFFLINE" : v.ServiceStatus.ToString())}[/]{pending}";
        yield return $"[italic]{Markup.Escape(v.Hint)}[/]";
    }

    private static Table Table(string[] columns, IReadOnlyList<string[]> rows, int? flagColumn)
    {
        var table = new Table().AddColumns(columns);
        foreach (var row in rows)
        {
            table.AddRow(row.Select((cell, i) => i == flagColumn ? (cell == "OK" ? "[green]OK[/]" : "[red]OUT[/]") : Markup.Escape(cell)).ToArray());
        }

        return table;
    }
}

using System.CommandLine;
using GelDispense.Agent.Configuration;
using GelDispense.Agent.Readings;
using GelDispense.Agent.Stability;
using GelDispense.Chemistry.Errors;

namespace GelDispense.Agent.Commands;

/// <summary><c>watch</c>: shows each line from the balance raw and parsed, with stability, drift and link status.</summary>
internal static class WatchCommand
{
    public static Command Create()
    {
        var balance = new BalanceOptions();
        var count = new Option<int?>("--count", "-n") { HelpName = "lines", Description = "Stop after this many lines" };
        var seconds = new Option<double?>("--seconds", "-s") { HelpName = "s", Description = "Stop after this many seconds" };
        var command = new Command("watch", "Show what the balance sends: the raw line, the reading in grams, stability and drift. Ctrl+C stops.");
        balance.AddTo(command);
        command.Options.Add(count);
        command.Options.Add(seconds);
        command.SetAction(async (parse, cancellationToken) =>
        {
            var output = parse.InvocationConfiguration.Output;
            BalanceSetup setup;
            try
            {
                setup = BalanceSetup.From(balance.Load(parse));
            }
            catch (InvalidInputException ex)
            {
                return AgentCommandLine.Report(ex, parse.InvocationConfiguration.Error);
            }

            using var stop = CancellationTokenSource.CreateLinkedTokenSource(cancellationToken);
            if (parse.GetValue(seconds) is { } s)
            {
                stop.CancelAfter(TimeSpan.FromSeconds(s));
            }

            await using var link = setup.CreateLink(TimeProvider.System);
            link.StatusChanged += (_, change) => output.WriteLine($"# link {change}");
            var stream = new BalanceReadingStream(link, setup.Parser, new StabilityDetector(setup.Stability, TimeProvider.System));
            output.WriteLine($"# watching {link.Describe}, format '{setup.Parser.Format.Name}'");
            link.Start();
            var limit = parse.GetValue(count);
            try
            {
                await foreach (var e in stream.ReadAsync(stop.Token))
                {
                    output.WriteLine(WatchLineText.Format(e));
                    if (stream.Counters.Lines >= limit)
                    {
                        break;
                    }
                }
            }
            catch (OperationCanceledException)
            {
                // Ctrl+C or --seconds: the summary below is the normal end.
            }

            var c = stream.Counters;
            output.WriteLine($"# {c.Lines} lines, {c.Readings} readings, {c.Garbage} ignored, {c.NonTextBytes} noise bytes, {c.Reconnects} reconnects");
            return AgentCommandLine.ExitOk;
        });
        return command;
    }
}

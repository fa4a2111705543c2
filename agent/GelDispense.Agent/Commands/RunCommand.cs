using System.CommandLine;
using GelDispense.Agent.Display;
using GelDispense.Agent.Service;
using GelDispense.Agent.Station;
using GelDispense.Chemistry.Errors;

namespace GelDispense.Agent.Commands;

/// <summary><c>run</c>: makes a batch at this station, step by step, from a recipe file or by resuming a batch id.</summary>
internal static class RunCommand
{
    public const int ExitPending = 3;

    public static Command Create()
    {
        var balance = new BalanceOptions();
        var options = new RunOptions();
        var command = new Command("run", "Make a batch at this station: shows each addition with its target, window and live reading, confirms on a stable reading, " +
            "journals every addition before sending it, and keeps going (re-planning locally) while the service is unreachable. Press q to stop.");
        balance.AddTo(command);
        options.AddTo(command);
        command.SetAction(async (parse, cancellationToken) =>
        {
            var output = parse.InvocationConfiguration.Output;
            StationSession session;
            BatchStart start;
            RunSettings settings;
            try
            {
                var config = balance.Load(parse);
                start = options.Start(parse, config.Balance.ReadabilityG, config.Pipette, config.Vessel);
                settings = new RunSettings
                {
                    Machine = new() { Mode = options.Mode(parse), ZeroBandG = 5 * config.Balance.ReadabilityG },
                    TareCommand = config.Balance.Commands.Tare,
                    Lots = options.Lots(parse),
                    ReadabilityG = config.Balance.ReadabilityG,
                    CompleteAtEnd = !parse.GetValue(options.NoComplete),
                };
                session = StationSession.Open(config, options.JournalPath(parse, config.StationId), new ServiceLinkSettings(), TimeProvider.System);
            }
            catch (InvalidInputException ex)
            {
                return AgentCommandLine.Report(ex, parse.InvocationConfiguration.Error);
            }

            await using (session)
            {
                await using var display = DisplayChoice.Create(output, parse.GetValue(options.Plain), TimeProvider.System);
                try
                {
                    var batch = await session.StartAsync(start, display, cancellationToken);
                    using var keys = DisplayChoice.IsTerminal(output) && !Console.IsInputRedirected ? new KeyReader() : null;
                    var result = await session.RunAsync(batch, display, settings, runner => keys?.Forward(runner.PressKey), cancellationToken);
                    return result.PendingAdditions > 0 ? ExitPending : AgentCommandLine.ExitOk;
                }
                catch (InvalidInputException ex)
                {
                    return AgentCommandLine.Report(ex, parse.InvocationConfiguration.Error);
                }
                catch (OperationCanceledException)
                {
                    output.WriteLine("stopped; confirmed additions are safe in the journal and are sent on the next run");
                    return ExitPending;
                }
            }
        });
        return command;
    }
}

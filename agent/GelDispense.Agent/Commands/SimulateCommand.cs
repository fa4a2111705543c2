using System.CommandLine;
using GelDispense.Agent.Formats;
using GelDispense.Agent.Simulation;
using GelDispense.Chemistry.Errors;

namespace GelDispense.Agent.Commands;

/// <summary><c>simulate</c>: serves a realistic simulated balance on a pseudo-terminal or a TCP port.</summary>
internal static class SimulateCommand
{
    public static Command Create()
    {
        var options = new SimulateOptions();
        var command = new Command("simulate", "Serve a simulated balance on a pseudo-terminal (prints its path) or a TCP port, for trying the agent without hardware.");
        options.AddTo(command);
        command.SetAction(async (parse, cancellationToken) =>
        {
            var output = parse.InvocationConfiguration.Output;
            SimulatorSettings settings;
            ITechnician technician;
            LineFormat format;
            try
            {
                settings = options.Settings(parse);
                SimulatorChecks.Check(settings);
                var name = parse.GetValue(options.Format)!;
                format = BuiltInFormats.Find(name) ?? throw new InvalidInputException("--format", name, "the simulator serves column, keyed or bare");
                technician = Technician(parse, options);
            }
            catch (InvalidInputException ex)
            {
                return AgentCommandLine.Report(ex, parse.InvocationConfiguration.Error);
            }

            var seed = parse.GetValue(options.Seed);
            using ISimulatorPort port = parse.GetValue(options.TcpPort) is { } tcpPort
                ? new TcpSimulatorPort(tcpPort)
                : new PtySimulatorPort(parse.GetValue(options.Link));
            var host = new SimulatorHost(
                new BalanceSimulator(settings, technician, new Random(seed)),
                new SampleRenderer(format, settings.ReadabilityG, new Random(seed + 1)),
                port,
                settings,
                TimeProvider.System);
            if (!parse.GetValue(options.Quiet))
            {
                host.Activity += output.WriteLine;
            }

            output.WriteLine($"serving {format.Name} on {port.Describe}");
            output.Flush();
            try
            {
                var duration = parse.GetValue(options.DurationS) is { } d ? TimeSpan.FromSeconds(d) : (TimeSpan?)null;
                await host.RunAsync(duration, cancellationToken);
            }
            catch (OperationCanceledException)
            {
                // Ctrl+C is the normal way to stop serving.
            }

            return AgentCommandLine.ExitOk;
        });
        return command;
    }

    private static ITechnician Technician(ParseResult parse, SimulateOptions options)
    {
        var pace = new TechnicianPace();
        if (parse.GetValue(options.Script) is { } script)
        {
            return new ScriptedTechnician(PourScript.Parse(script), pace);
        }

        return parse.GetValue(options.RandomSteps) is { } steps
            ? RandomTechnician.Create(new Random(parse.GetValue(options.Seed) + 2), steps, 1, 20, parse.GetValue(options.OverPourChance), pace)
            : new ScriptedTechnician([], pace);
    }
}

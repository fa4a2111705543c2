using System.CommandLine;
using GelDispense.Agent.Calibration;
using GelDispense.Agent.Configuration;
using GelDispense.Agent.Display;
using GelDispense.Chemistry.Errors;
using GelDispense.Chemistry.Metrology;

namespace GelDispense.Agent.Commands;

/// <summary><c>pipette-check</c>: a guided gravimetric check of the station's pipette against ISO 8655.</summary>
internal static class PipetteCheckCommand
{
    public const int ExitFailed = 4;

    public static Command Create()
    {
        var balance = new BalanceOptions();
        var volume = new Option<double?>("--volume", "-v") { Description = "Volume to check in µL (default: the pipette's nominal volume)" };
        var count = new Option<int>("--count", "-n") { Description = "Number of deliveries (ISO 8655-6 asks for 10)", DefaultValueFactory = _ => 10 };
        var temperature = new Option<double>("--temperature") { Description = "Water and air temperature in °C", DefaultValueFactory = _ => 20 };
        var pressure = new Option<double>("--pressure") { Description = "Barometric pressure in hPa", DefaultValueFactory = _ => 1013.25 };
        var humidity = new Option<double>("--humidity") { Description = "Relative humidity in %", DefaultValueFactory = _ => 50 };
        var command = new Command("pipette-check", "Check the station's pipette by weighing deliveries of water: dispense when asked, the balance confirms each stable reading; " +
            "the result is compared with the ISO 8655-2 maximum permissible errors. The pipette comes from the station config (pipette section).");
        balance.AddTo(command);
        foreach (var option in new Option[] { volume, count, temperature, pressure, humidity })
        {
            command.Options.Add(option);
        }

        command.SetAction(async (parse, cancellationToken) =>
        {
            var output = parse.InvocationConfiguration.Output;
            BalanceSetup setup;
            PipetteCheckPlan plan;
            try
            {
                var config = balance.Load(parse);
                setup = BalanceSetup.From(config);
                var pipette = config.Pipette ?? throw new InvalidInputException("pipette", "", "the station config has no pipette section (name, nominalVolumeUl, minVolumeUl)");
                var profile = new PipetteProfile(pipette.Name, pipette.NominalVolumeUl, pipette.MinVolumeUl);
                plan = new PipetteCheckPlan(profile, parse.GetValue(volume) ?? pipette.NominalVolumeUl, parse.GetValue(count), parse.GetValue(temperature),
                    parse.GetValue(pressure), parse.GetValue(humidity), config.Balance.Commands.Tare, config.Balance.ReadabilityG);
                PipetteCheckRunner.Check(plan);
            }
            catch (InvalidInputException ex)
            {
                return AgentCommandLine.Report(ex, parse.InvocationConfiguration.Error);
            }

            await using var link = setup.CreateLink(TimeProvider.System);
            await using var display = DisplayChoice.Create(output, false, TimeProvider.System);
            try
            {
                var result = await new PipetteCheckRunner(link, setup.Parser, setup.Stability, display, TimeProvider.System).RunAsync(plan, cancellationToken);
                await display.DisposeAsync();
                foreach (var line in PipetteCheckText.Lines(result))
                {
                    output.WriteLine(line);
                }

                return result.Passed ? AgentCommandLine.ExitOk : ExitFailed;
            }
            catch (InvalidInputException ex)
            {
                return AgentCommandLine.Report(ex, parse.InvocationConfiguration.Error);
            }
        });
        return command;
    }
}

using System.CommandLine;
using GelDispense.Agent.Commands;
using GelDispense.Agent.Pty;
using GelDispense.Agent.Tests.Support;

namespace GelDispense.Agent.Tests.Commands;

/// <summary>The command line end to end, with output captured.</summary>
public sealed class AgentCommandLineTests : TempDirectoryTest
{
    private static async Task<(int Exit, string Output, string Error)> Run(params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        var exit = await AgentCommandLine.Build().Parse(args).InvokeAsync(new InvocationConfiguration { Output = output, Error = error });
        return (exit, output.ToString(), error.ToString());
    }

    [Fact]
    public async Task Help_lists_the_balance_commands()
    {
        var (exit, output, _) = await Run("--help");

        Assert.Equal(0, exit);
        Assert.Contains("watch", output);
        Assert.Contains("simulate", output);
        Assert.Contains("ports", output);
    }

    [Fact]
    public async Task Watch_with_a_bad_config_exits_2_and_names_every_problem()
    {
        var config = Path.Combine(Dir, "station.json");
        await File.WriteAllTextAsync(config, """{ "balance": { "port": "/dev/x", "format": "nope" }, "stability": { "bandG": -1 } }""");

        var (exit, _, error) = await Run("watch", "--config", config, "--baud", "7");

        Assert.Equal(2, exit);
        Assert.Contains("balance.format = 'nope': unknown format", error);
        Assert.Contains("balance.serial.baud = '7'", error);
        Assert.Contains("stability.bandG = '-1'", error);
    }

    [Fact]
    public async Task Watch_shows_raw_and_parsed_lines_from_a_pty_then_a_summary()
    {
        using var pty = PseudoTerminal.Open();
        using var feeding = new CancellationTokenSource();
        var feeder = Task.Run(async () =>
        {
            string[] lines = ["= +    2.5000 g", "! E3", "garbled?", "~ +    2.5010 oz"];
            for (var i = 0; !feeding.IsCancellationRequested; i++)
            {
                pty.Write(lines[i % lines.Length] + "\r\n");
                await Task.Delay(20);
            }
        });

        var (exit, output, _) = await Run("watch", "--port", pty.SlavePath, "--format", "column", "--count", "12", "--seconds", "20");
        await feeding.CancelAsync();
        await feeder;

        Assert.Equal(0, exit);
        Assert.Contains("2.5000 g  stable (balance flag)", output);
        Assert.Contains("ERROR: no usable mass", output);
        Assert.Contains("ignored (NoMatch", output);
        Assert.Contains("ignored (UnknownUnit: unit 'oz' cannot be converted to g)", output);
        Assert.Contains("# 12 lines,", output);
    }

    [Fact]
    public async Task Simulate_serves_on_a_TCP_port_and_stops_after_its_duration()
    {
        var (exit, output, _) = await Run("simulate", "--tcp-port", "0", "--duration", "0.5", "--interval-ms", "20", "--format", "bare");

        Assert.Equal(0, exit);
        Assert.Matches(@"^serving bare on 127\.0\.0\.1:\d+", output);
    }

    [Fact]
    public async Task Simulate_refuses_bad_settings_with_the_option_name()
    {
        var (exit, _, error) = await Run("simulate", "--script", "5+ten%", "--garbage", "2");

        Assert.Equal(2, exit);
        Assert.Contains("--garbage = '2'", error);
    }

    [Fact]
    public async Task Ports_runs_on_a_machine_without_serial_hardware()
    {
        var (exit, output, _) = await Run("ports");

        Assert.Equal(0, exit);
        Assert.False(string.IsNullOrWhiteSpace(output));
    }
}

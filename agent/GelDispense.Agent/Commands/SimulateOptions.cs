using System.CommandLine;
using GelDispense.Agent.Simulation;

namespace GelDispense.Agent.Commands;

/// <summary>The simulator's knobs on the command line, read into <see cref="SimulatorSettings"/>.</summary>
internal sealed class SimulateOptions
{
    public Option<string> Format { get; } = new("--format", "-f") { HelpName = "name", Description = "Line format to serve: column, keyed or bare", DefaultValueFactory = _ => "column" };

    public Option<string?> Link { get; } = new("--link") { HelpName = "path", Description = "Fixed path kept pointing at the current pty (survives simulated disconnects)" };

    public Option<int?> TcpPort { get; } = new("--tcp-port") { HelpName = "port", Description = "Serve on 127.0.0.1:PORT instead of a pty (0 picks a free port)" };

    public Option<double> ReadabilityG { get; } = new("--readability") { HelpName = "g", Description = "Readability d in grams", DefaultValueFactory = _ => 0.0001 };

    public Option<double> CapacityG { get; } = new("--capacity") { HelpName = "g", Description = "Capacity in grams; above it the balance shows overload", DefaultValueFactory = _ => 220 };

    public Option<int> IntervalMs { get; } = new("--interval-ms") { HelpName = "ms", Description = "Milliseconds between lines", DefaultValueFactory = _ => 100 };

    public Option<int> Seed { get; } = new("--seed") { HelpName = "n", Description = "Seed for noise and the random technician (same seed, same trace)", DefaultValueFactory = _ => 1 };

    public Option<string?> Script { get; } = new("--script") { HelpName = "grams", Description = "Additions to pour, in grams, e.g. 5,12.5+10%,3.2 (+N% over-pours, -N% short)" };

    public Option<int?> RandomSteps { get; } = new("--random-steps") { HelpName = "n", Description = "Let a random technician pour this many additions" };

    public Option<double> OverPourChance { get; } = new("--over-pour-chance") { HelpName = "0..1", Description = "Chance that a random addition is over-poured", DefaultValueFactory = _ => 0.25 };

    public Option<double> EvaporationGPerMin { get; } = new("--evaporation") { HelpName = "g/min", Description = "Mass lost from an open vessel, g/min", DefaultValueFactory = _ => 0 };

    public Option<double> Garbage { get; } = new("--garbage") { HelpName = "0..1", Description = "Chance per line of noise bytes (0 to 1)", DefaultValueFactory = _ => 0 };

    public Option<double?> DisconnectEveryS { get; } = new("--disconnect-every") { HelpName = "s", Description = "Cut the line every this many seconds" };

    public Option<double> DisconnectForS { get; } = new("--disconnect-for") { HelpName = "s", Description = "Seconds the line stays cut", DefaultValueFactory = _ => 2 };

    public Option<double?> DurationS { get; } = new("--duration") { HelpName = "s", Description = "Stop after this many seconds (default: until Ctrl+C)" };

    public Option<string?> TareCommand { get; } = new("--tare-command") { HelpName = "text", Description = "Text that tares the simulated balance" };

    public Option<string?> ZeroCommand { get; } = new("--zero-command") { HelpName = "text", Description = "Text that zeroes the simulated balance" };

    public Option<bool> Quiet { get; } = new("--quiet", "-q") { Description = "Do not echo each line sent" };

    public void AddTo(Command command)
    {
        foreach (var option in new Option[]
        {
            Format, Link, TcpPort, ReadabilityG, CapacityG, IntervalMs, Seed, Script, RandomSteps, OverPourChance,
            EvaporationGPerMin, Garbage, DisconnectEveryS, DisconnectForS, DurationS, TareCommand, ZeroCommand, Quiet,
        })
        {
            command.Options.Add(option);
        }
    }

    public SimulatorSettings Settings(ParseResult parse) => new()
    {
        ReadabilityG = parse.GetValue(ReadabilityG),
        CapacityG = parse.GetValue(CapacityG),
        SampleInterval = TimeSpan.FromMilliseconds(parse.GetValue(IntervalMs)),
        EvaporationGPerMin = parse.GetValue(EvaporationGPerMin),
        GarbageProbability = parse.GetValue(Garbage),
        DisconnectEvery = parse.GetValue(DisconnectEveryS) is { } every ? TimeSpan.FromSeconds(every) : null,
        DisconnectFor = TimeSpan.FromSeconds(parse.GetValue(DisconnectForS)),
        TareCommand = parse.GetValue(TareCommand),
        ZeroCommand = parse.GetValue(ZeroCommand),
    };
}

using GelDispense.Agent.Configuration;
using GelDispense.Agent.Simulation;
using GelDispense.Contracts.V1;

namespace GelDispense.Agent.Demo;

/// <summary>
/// Our own demo: the NA-7 hybrid monolith sol (TEOS and MTMS in methanol, acid then base catalysis) made at station
/// north-annex-bench-2 on a 620 g precision balance read to 1 mg, from our own reagent lots; the station's 2 mL
/// pipette is offered to the planner, which keeps every step on the balance since it holds each window. The
/// technician over-pours the TEOS by 3 %; the service re-plans the rest of the batch around it.
/// </summary>
public static class DemoScenario
{
    public const string StationId = "north-annex-bench-2";

    public const string TareCommand = "T";

    public const string RecipeResource = "GelDispense.Agent.Demo.na7-hybrid-monolith.json";

    /// <summary>The one over-pour: plan step 0 (TEOS) by 3 %.</summary>
    public static readonly IReadOnlyDictionary<int, double> OverPours = new Dictionary<int, double> { [0] = 0.03 };

    public static readonly IReadOnlyDictionary<string, string> Lots = new Dictionary<string, string>(StringComparer.OrdinalIgnoreCase)
    {
        ["teos"] = "NA-TEOS-24-117",
        ["mtms"] = "NA-MTMS-24-031",
        ["methanol"] = "NA-MEOH-24-552",
        ["water"] = "NA-DIW-24-208",
        ["hcl-0.1m"] = "NA-HCL01-24-019",
        ["nh3-1m"] = "NA-NH3-1M-24-044",
    };

    public static BalanceProfile Balance => new() { Id = "NA-BAL-2", ReadabilityG = 0.001, RepeatabilityG = 0.0008, CapacityG = 620 };

    public static PipetteProfile Pipette => new() { Id = "NA-PIP-2000", NominalVolumeUl = 2000, MinVolumeUl = 200 };

    /// <summary>A quick balance: settles in a fraction of a second and streams fifty lines a second.</summary>
    public static SimulatorSettings Simulator => new()
    {
        ReadabilityG = 0.001,
        CapacityG = 620,
        SettlingTimeConstant = TimeSpan.FromMilliseconds(80),
        SampleInterval = TimeSpan.FromMilliseconds(20),
        TareCommand = TareCommand,
    };

    public static TechnicianPace Pace => new() { FastGPerS = 60, SlowGPerS = 6, PauseBetweenSteps = TimeSpan.Zero };

    public static TimeSpan Reaction => TimeSpan.FromMilliseconds(300);

    public static Recipe Recipe()
    {
        using var stream = typeof(DemoScenario).Assembly.GetManifestResourceStream(RecipeResource)
            ?? throw new InvalidOperationException($"the demo recipe {RecipeResource} is not embedded in the agent");
        using var reader = new StreamReader(stream);
        return Station.RecipeFile.Parse(reader.ReadToEnd(), RecipeResource);
    }

    /// <summary>The station config for the demo: the simulated balance on its pty link, the embedded service.</summary>
    public static StationConfig StationConfig(string balancePath, Uri serviceAddress, string? apiKey, double readabilityG = 0.001) => new()
    {
        ServiceAddress = serviceAddress.ToString(),
        ApiKey = apiKey,
        StationId = StationId,
        Balance = new BalanceConfig
        {
            Port = balancePath,
            Format = "column",
            ReadabilityG = readabilityG,
            Commands = new CommandsConfig { Tare = TareCommand },
            Serial = new SerialConfig { ReadTimeoutMs = 100 },
        },
        Pipette = new PipetteConfig { Name = "NA-PIP-2000", NominalVolumeUl = 2000, MinVolumeUl = 200 },
    };
}

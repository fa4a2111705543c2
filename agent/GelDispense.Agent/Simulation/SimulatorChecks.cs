using GelDispense.Agent.Configuration;

namespace GelDispense.Agent.Simulation;

/// <summary>Refuses simulator settings that would make a nonsense balance, naming the option.</summary>
public static class SimulatorChecks
{
    public static void Check(SimulatorSettings s)
    {
        var errors = new ErrorList();
        errors.Require(s.ReadabilityG is > 0 and <= 1, "--readability", s.ReadabilityG, "must be above 0 and at most 1 g");
        errors.Require(s.CapacityG > 0, "--capacity", s.CapacityG, "must be above 0 g");
        errors.Require(s.SampleInterval >= TimeSpan.FromMilliseconds(5), "--interval-ms", s.SampleInterval.TotalMilliseconds, "must be at least 5 ms");
        errors.Require(s.EvaporationGPerMin >= 0, "--evaporation", s.EvaporationGPerMin, "must be 0 or more g/min");
        errors.Require(s.GarbageProbability is >= 0 and <= 1, "--garbage", s.GarbageProbability, "must be a probability from 0 to 1");
        errors.Require(s.DisconnectEvery is null || s.DisconnectEvery > TimeSpan.Zero, "--disconnect-every", s.DisconnectEvery?.TotalSeconds, "must be above 0 s");
        errors.Require(s.DisconnectFor > TimeSpan.Zero, "--disconnect-for", s.DisconnectFor.TotalSeconds, "must be above 0 s");
        errors.ThrowIfAny();
    }
}

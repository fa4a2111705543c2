namespace GelDispense.Agent.Simulation;

/// <summary>Whoever pours onto the simulated balance.</summary>
public interface ITechnician
{
    /// <summary>Mass poured onto the pan during the next <paramref name="dt"/>, in grams.</summary>
    double Pour(TimeSpan dt);

    bool Finished { get; }

    /// <summary>The step being poured or waited for, 0-based; equals the step count when finished.</summary>
    int StepIndex { get; }
}

namespace GelDispense.Agent.Simulation;

/// <summary>
/// A seeded random script: additions between the given bounds, each over-poured by 2–20 % with the given
/// probability and otherwise within ±0.5 % of the target.
/// </summary>
public static class RandomTechnician
{
    public static ScriptedTechnician Create(Random random, int steps, double minG, double maxG, double overPourProbability, TechnicianPace pace)
    {
        var script = new List<PourStep>(steps);
        for (var i = 0; i < steps; i++)
        {
            var target = minG + random.NextDouble() * (maxG - minG);
            var fraction = random.NextDouble() < overPourProbability
                ? 0.02 + random.NextDouble() * 0.18
                : (random.NextDouble() - 0.5) * 0.01;
            script.Add(new PourStep(Math.Round(target, 3), fraction));
        }

        return new ScriptedTechnician(script, pace);
    }
}

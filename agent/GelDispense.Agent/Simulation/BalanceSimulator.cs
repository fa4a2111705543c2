using GelDispense.Agent.Formats;

namespace GelDispense.Agent.Simulation;

/// <summary>
/// The physics of a simulated balance, stepped in time by the caller so it is deterministic for a given seed:
/// a true load (pours, evaporation), a display that approaches the load as a first-order lag, Gaussian noise
/// scaled to the readability, quantisation to d, overload above capacity, and tare/zero commands.
/// </summary>
public sealed class BalanceSimulator(SimulatorSettings settings, ITechnician? technician, Random random)
{
    private double _trueG;
    private double _displayG;
    private double _tareG;
    private TimeSpan _sinceLastPour = TimeSpan.MaxValue;

    public TimeSpan Elapsed { get; private set; }

    public double TrueNetG => _trueG - _tareG;

    public ITechnician? Technician => technician;

    public SimulatedSample Step(TimeSpan dt)
    {
        Elapsed += dt;
        var poured = technician?.Pour(dt) ?? 0;
        _trueG += poured;
        _sinceLastPour = poured > 0 ? TimeSpan.Zero : _sinceLastPour == TimeSpan.MaxValue ? _sinceLastPour : _sinceLastPour + dt;
        if (_trueG > 0 && settings.EvaporationGPerMin > 0)
        {
            _trueG = Math.Max(0, _trueG - settings.EvaporationGPerMin * dt.TotalMinutes);
        }

        var lag = 1 - Math.Exp(-dt.TotalSeconds / settings.SettlingTimeConstant.TotalSeconds);
        _displayG += (_trueG - _displayG) * lag;
        var garbled = settings.GarbageProbability > 0 && random.NextDouble() < settings.GarbageProbability;
        if (_displayG > settings.CapacityG)
        {
            return new SimulatedSample(Elapsed, ReadingKind.Overload, double.NaN, false, garbled);
        }

        var d = settings.ReadabilityG;
        var noisy = _displayG - _tareG + Gaussian() * settings.NoiseInReadabilities * d;
        var shown = Math.Round(noisy / d) * d;

        // The balance's own judgement: the display has caught up with the load and nobody is pouring.
        var stable = Math.Abs(_trueG - _displayG) < d / 2 && _sinceLastPour > settings.SettlingTimeConstant;
        return new SimulatedSample(Elapsed, ReadingKind.Weight, shown, stable, garbled);
    }

    /// <summary>Acts on a command line received from the agent; false when the text is not a configured command.</summary>
    public bool HandleCommand(string command)
    {
        if (settings.TareCommand is { } tare && command == tare)
        {
            _tareG = _displayG;
            return true;
        }

        // Zero only takes a small offset, as a balance refuses to zero a loaded pan (common practice: ±2 % of capacity).
        if (settings.ZeroCommand is { } zero && command == zero && Math.Abs(_displayG - _tareG) < 0.02 * settings.CapacityG)
        {
            _tareG = _displayG;
            return true;
        }

        return false;
    }

    private double Gaussian()
    {
        // Box–Muller on the injected generator, so a seed fixes the whole trace.
        var u1 = 1.0 - random.NextDouble();
        var u2 = random.NextDouble();
        return Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2);
    }
}

namespace GelDispense.Chemistry.Reagents;

/// <summary>Density from a table of (temperature °C, g/mL) points, interpolated linearly; valid between the end points.</summary>
public sealed record TabulatedDensity : DensityModel
{
    private readonly (double TemperatureC, double DensityGPerMl)[] _points;

    public TabulatedDensity(IEnumerable<(double TemperatureC, double DensityGPerMl)> points)
    {
        _points = [.. points.OrderBy(p => p.TemperatureC)];
        if (_points.Length < 2)
        {
            throw new ArgumentException("A density table needs at least two points.", nameof(points));
        }
    }

    public IReadOnlyList<(double TemperatureC, double DensityGPerMl)> Points => _points;

    public override double MinTemperatureC => _points[0].TemperatureC;

    public override double MaxTemperatureC => _points[^1].TemperatureC;

    public override double DensityGPerMl(double temperatureC)
    {
        var i = 1;
        while (i < _points.Length - 1 && _points[i].TemperatureC < temperatureC)
        {
            i++;
        }

        var (t0, d0) = _points[i - 1];
        var (t1, d1) = _points[i];
        return d0 + (d1 - d0) * (temperatureC - t0) / (t1 - t0);
    }
}

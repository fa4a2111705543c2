using System.Globalization;
using System.Text;
using GelDispense.Agent.Formats;

namespace GelDispense.Agent.Simulation;

/// <summary>
/// Writes simulated samples as lines of one of the built-in formats (a custom pattern cannot be run backwards),
/// with the format's line ending, splicing noise bytes into a garbled line.
/// </summary>
public sealed class SampleRenderer
{
    private readonly Func<SimulatedSample, string> _render;
    private readonly string _terminator;
    private readonly string _valueFormat;
    private readonly Random _random;

    public SampleRenderer(LineFormat format, double readabilityG, Random random)
    {
        _render = format.Name switch
        {
            "column" => Column,
            "keyed" => Keyed,
            "bare" => Bare,
            _ => throw new ArgumentException($"the simulator serves only the built-in formats (column, keyed, bare), not '{format.Name}'", nameof(format)),
        };
        _terminator = format.LineEnding.Terminator();
        var decimals = Math.Clamp((int)Math.Ceiling(-Math.Log10(readabilityG) - 1e-9), 0, 8);
        _valueFormat = "F" + decimals.ToString(CultureInfo.InvariantCulture);
        _random = random;
    }

    public string Text(SimulatedSample sample) => _render(sample);

    public byte[] Bytes(SimulatedSample sample)
    {
        var bytes = Encoding.ASCII.GetBytes(_render(sample)).ToList();
        if (sample.Garbled)
        {
            var at = _random.Next(bytes.Count + 1);
            var count = _random.Next(1, 6);
            for (var i = 0; i < count; i++)
            {
                // High bytes and low controls, never CR or LF: noise that stays inside its line.
                var noise = _random.Next(2) == 0 ? (byte)_random.Next(0x80, 0x100) : (byte)_random.Next(0x00, 0x09);
                bytes.Insert(at, noise);
            }
        }

        bytes.AddRange(Encoding.ASCII.GetBytes(_terminator));
        return [.. bytes];
    }

    private string Value(double valueG) => Math.Abs(valueG).ToString(_valueFormat, CultureInfo.InvariantCulture);

    private static string Sign(double valueG) => valueG < 0 ? "-" : "+";

    private string Column(SimulatedSample s) => s.Kind switch
    {
        ReadingKind.Overload => "> OVER",
        ReadingKind.Underload => "< UNDER",
        ReadingKind.Error => "! E1",
        _ => $"{(s.Stable ? '=' : '~')} {Sign(s.DisplayedG)}{Value(s.DisplayedG),10} g",
    };

    private string Keyed(SimulatedSample s) => s.Kind switch
    {
        ReadingKind.Overload => "status=over",
        ReadingKind.Underload => "status=under",
        ReadingKind.Error => "status=fault",
        _ => $"mass={(s.DisplayedG < 0 ? "-" : "")}{Value(s.DisplayedG)},unit=g,steady={(s.Stable ? 1 : 0)}",
    };

    private string Bare(SimulatedSample s) => s.Kind switch
    {
        ReadingKind.Overload => "OVER",
        ReadingKind.Underload => "UNDER",
        ReadingKind.Error => "ERR",
        _ => $"{(s.DisplayedG < 0 ? "-" : "")}{Value(s.DisplayedG)}",
    };
}

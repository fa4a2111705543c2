using System.Text;
using GelDispense.Agent.Formats;

namespace GelDispense.Agent.Tests.Formats;

/// <summary>The parser corpus for every built-in format: good lines, markers, wrong units, garbage, partial lines.</summary>
public class BuiltInFormatsTests
{
    private static readonly LineParser Column = new(BuiltInFormats.Column);
    private static readonly LineParser Keyed = new(BuiltInFormats.Keyed);
    private static readonly LineParser Bare = new(BuiltInFormats.Bare);

    private static LineParser For(string name) => new(BuiltInFormats.Find(name)!);

    [Theory]
    [InlineData("= +   12.3456 g", 12.3456, true)]
    [InlineData("~ -    0.0012 g", -0.0012, false)]
    [InlineData("= +  1234.5 mg", 1.2345, true)]
    [InlineData("= +    0.2500 kg", 250.0, true)]
    [InlineData("= +    0.0000 g  ", 0.0, true)]
    public void Column_lines_give_grams_and_the_balance_flag(string line, double expectedG, bool stable)
    {
        var reading = Column.Parse(line).Reading!;

        Assert.Equal(ReadingKind.Weight, reading.Kind);
        Assert.Equal(expectedG, reading.ValueG!.Value, 9);
        Assert.Equal(stable, reading.Stable);
        Assert.Equal(line, reading.Raw);
    }

    [Theory]
    [InlineData("mass=12.3456,unit=g,steady=1", 12.3456, true)]
    [InlineData("mass=-150.5,unit=mg,steady=0", -0.1505, false)]
    [InlineData("seq=41,mass=0.0213,unit=kg,t=21.4,steady=1,temp=21.4", 21.3, true)]
    public void Keyed_lines_give_grams_and_the_balance_flag_with_other_keys_ignored(string line, double expectedG, bool stable)
    {
        var reading = Keyed.Parse(line).Reading!;

        Assert.Equal(expectedG, reading.ValueG!.Value, 9);
        Assert.Equal(stable, reading.Stable);
    }

    [Theory]
    [InlineData("12.3456", 12.3456)]
    [InlineData("  -0.0012 ", -0.0012)]
    [InlineData("+250", 250.0)]
    public void Bare_lines_are_grams_without_a_flag(string line, double expectedG)
    {
        var reading = Bare.Parse(line).Reading!;

        Assert.Equal(expectedG, reading.ValueG!.Value, 9);
        Assert.Null(reading.Stable);
        Assert.False(Bare.HasStabilityFlag);
    }

    [Theory]
    [InlineData("column", "> OVER", ReadingKind.Overload)]
    [InlineData("column", "< UNDER", ReadingKind.Underload)]
    [InlineData("column", "! E17", ReadingKind.Error)]
    [InlineData("keyed", "status=over,unit=g", ReadingKind.Overload)]
    [InlineData("keyed", "seq=3,status=under", ReadingKind.Underload)]
    [InlineData("keyed", "status=fault", ReadingKind.Error)]
    [InlineData("bare", "OVER", ReadingKind.Overload)]
    [InlineData("bare", " UNDER", ReadingKind.Underload)]
    [InlineData("bare", "ERR 4", ReadingKind.Error)]
    public void Markers_become_readings_without_a_mass_and_never_stable(string format, string line, ReadingKind kind)
    {
        var reading = For(format).Parse(line).Reading!;

        Assert.Equal(kind, reading.Kind);
        Assert.Null(reading.ValueG);
        Assert.False(reading.Stable);
    }

    [Theory]
    [InlineData("column", "= +   12.3456 oz")]
    [InlineData("column", "= +   12.3456 ct")]
    [InlineData("column", "= +   12.3456 lb")]
    [InlineData("keyed", "mass=12.3,unit=dwt,steady=1")]
    [InlineData("keyed", "mass=12.3,unit=Kg,steady=1")]
    public void A_unit_that_cannot_be_converted_is_a_failure_not_a_number(string format, string line)
    {
        var result = For(format).Parse(line);

        Assert.Null(result.Reading);
        Assert.Equal(ParseFailureReason.UnknownUnit, result.Failure!.Reason);
        Assert.Contains("cannot be converted to g", result.Failure.Detail);
    }

    [Theory]
    [InlineData("column", "= +   12.34")]
    [InlineData("column", "56 g")]
    [InlineData("column", "= =   12.3456 g")]
    [InlineData("column", "= 12.3456 g")]
    [InlineData("column", "")]
    [InlineData("keyed", "mass=12.3456,unit=g")]
    [InlineData("keyed", "mass=1.2.3,unit=g,steady=1")]
    [InlineData("keyed", "xmass=1,unit=g,steady=1")]
    [InlineData("keyed", "steady=1,unit=g,mass=1.5")]
    [InlineData("keyed", "mass=1.5,unit=g,steady=1,")]
    [InlineData("bare", "12.34.56")]
    [InlineData("bare", "NaN")]
    [InlineData("bare", "Infinity")]
    [InlineData("bare", "1e5")]
    [InlineData("bare", "1,5")]
    [InlineData("bare", "12.3 g")]
    public void Partial_and_malformed_lines_fail_with_a_reason(string format, string line)
    {
        var result = For(format).Parse(line);

        Assert.False(result.IsReading);
        Assert.Equal(ParseFailureReason.NoMatch, result.Failure!.Reason);
    }

    [Theory]
    [InlineData("column")]
    [InlineData("keyed")]
    [InlineData("bare")]
    public void Random_garbage_never_throws_and_only_a_clean_line_can_give_a_weight(string format)
    {
        var parser = For(format);
        var random = new Random(20260412);
        var splitter = new LineSplitter(parser.Format.MaxLineLength);
        var lines = 0;
        var weightsFromTaintedLines = 0;
        var weights = 0;
        var buffer = new byte[4096];
        for (var round = 0; round < 200; round++)
        {
            random.NextBytes(buffer);
            splitter.Feed(buffer, line =>
            {
                lines++;
                if (parser.Parse(line).Reading?.Kind == ReadingKind.Weight)
                {
                    weights++;
                    weightsFromTaintedLines += line.IsClean ? 0 : 1;
                }
            });
        }

        // Noise can spell a short clean number between two terminators ("7" for the bare format);
        // what must never happen is a weight from a line that carried noise bytes.
        Assert.Equal(0, weightsFromTaintedLines);
        Assert.True(weights < lines / 100, $"{weights} weights from {lines} noise lines");
        Assert.True(splitter.NonTextBytesSeen > 0);
    }

    [Theory]
    [InlineData("column", "= +   12.3456 g\r\n~ +   12.3460 g\n= +   12.3461 g\r")]
    [InlineData("keyed", "mass=12.3456,unit=g,steady=1\r\nmass=12.346,unit=g,steady=0\nmass=12.3461,unit=g,steady=1\r")]
    [InlineData("bare", "12.3456\r\n12.3460\n12.3461\r")]
    public void Mixed_line_endings_give_every_reading_once(string format, string stream)
    {
        var parser = For(format);
        var values = new List<double>();
        var splitter = new LineSplitter(parser.Format.MaxLineLength);
        var bytes = Encoding.ASCII.GetBytes(stream);

        // Byte by byte is the worst case for a reader: every line arrives as partial pieces.
        for (var i = 0; i < bytes.Length; i++)
        {
            splitter.Feed(bytes.AsSpan(i, 1), line => values.Add(parser.Parse(line).Reading!.ValueG!.Value));
        }

        Assert.Equal([12.3456, 12.3460, 12.3461], values);
    }

    [Fact]
    public void A_line_with_noise_bytes_is_rejected_even_when_the_rest_would_parse()
    {
        var line = new SplitLine("= +   12.3456 g", NonTextBytes: 1, Overlong: false);

        var result = Column.Parse(line);

        Assert.Equal(ParseFailureReason.NonText, result.Failure!.Reason);
    }

    [Fact]
    public void An_overlong_line_is_rejected_and_its_raw_text_is_cut()
    {
        var result = Bare.Parse(new string('1', 1000));

        Assert.Equal(ParseFailureReason.TooLong, result.Failure!.Reason);
        Assert.Equal(Bare.Format.MaxLineLength, result.Failure.Raw.Length);
    }

    [Fact]
    public void Built_in_names_are_our_own_and_distinct()
    {
        Assert.Equal(["column", "keyed", "bare"], BuiltInFormats.All.Select(f => f.Name));
        Assert.Null(BuiltInFormats.Find("no-such-format"));
    }
}

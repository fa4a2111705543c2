using GelDispense.Agent.Formats;
using GelDispense.Agent.Simulation;

namespace GelDispense.Agent.Tests.Simulation;

/// <summary>Everything the simulator writes must read back through our own codec to the same value.</summary>
public class SampleRendererTests
{
    public static TheoryData<string> Formats => new(BuiltInFormats.All.Select(f => f.Name));

    [Theory]
    [MemberData(nameof(Formats))]
    public void Rendered_samples_parse_back_to_the_same_mass_flag_and_kind(string name)
    {
        var format = BuiltInFormats.Find(name)!;
        var renderer = new SampleRenderer(format, 0.0001, new Random(1));
        var parser = new LineParser(format);
        SimulatedSample[] samples =
        [
            new(TimeSpan.Zero, ReadingKind.Weight, 12.3456, true, false),
            new(TimeSpan.Zero, ReadingKind.Weight, -0.0012, false, false),
            new(TimeSpan.Zero, ReadingKind.Weight, 219.9999, true, false),
            new(TimeSpan.Zero, ReadingKind.Overload, double.NaN, false, false),
        ];

        foreach (var sample in samples)
        {
            var reading = parser.Parse(renderer.Text(sample)).Reading!;
            Assert.Equal(sample.Kind, reading.Kind);
            if (sample.Kind == ReadingKind.Weight)
            {
                Assert.Equal(sample.DisplayedG, reading.ValueG!.Value, 9);
                Assert.Equal(parser.HasStabilityFlag ? sample.Stable : null, reading.Stable);
            }
        }
    }

    [Theory]
    [MemberData(nameof(Formats))]
    public void A_garbled_sample_carries_noise_bytes_and_is_rejected_by_the_codec(string name)
    {
        var format = BuiltInFormats.Find(name)!;
        var renderer = new SampleRenderer(format, 0.0001, new Random(5));
        var splitter = new LineSplitter(format.MaxLineLength);
        var results = new List<LineParseResult>();

        splitter.Feed(renderer.Bytes(new SimulatedSample(TimeSpan.Zero, ReadingKind.Weight, 1.0, true, Garbled: true)), l => results.Add(new LineParser(format).Parse(l)));

        Assert.Equal(ParseFailureReason.NonText, Assert.Single(results).Failure!.Reason);
    }

    [Fact]
    public void Decimals_follow_the_readability()
    {
        var renderer = new SampleRenderer(BuiltInFormats.Bare, 0.01, new Random(1));

        Assert.Equal("3.14", renderer.Text(new SimulatedSample(TimeSpan.Zero, ReadingKind.Weight, 3.14159, true, false)));
    }

    [Fact]
    public void A_custom_format_cannot_be_served()
    {
        var custom = BuiltInFormats.Bare with { Name = "lab-7" };

        Assert.Throws<ArgumentException>(() => new SampleRenderer(custom, 0.001, new Random(1)));
    }
}

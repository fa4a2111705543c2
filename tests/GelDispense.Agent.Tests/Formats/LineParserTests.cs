using GelDispense.Agent.Formats;
using GelDispense.Chemistry.Errors;

namespace GelDispense.Agent.Tests.Formats;

/// <summary>Custom formats from a config file: validation names the field, parsing follows the pattern.</summary>
public class LineParserTests
{
    [Fact]
    public void A_custom_pattern_with_its_own_flag_and_unit_parses()
    {
        var parser = new LineParser(new LineFormat
        {
            Name = "lab-7",
            Pattern = @"^W(?<flag>[SD])(?<value>[+-]\d+\.\d+)(?<unit>mg|g)$",
            StableFlag = "S",
            OverloadPattern = "^WO",
        });

        var reading = parser.Parse("WS+001523.5mg").Reading!;

        Assert.Equal(1.5235, reading.ValueG!.Value, 9);
        Assert.True(reading.Stable);
        Assert.False(parser.Parse("WD+001523.5mg").Reading!.Stable);
        Assert.Equal(ReadingKind.Overload, parser.Parse("WO").Reading!.Kind);
    }

    [Fact]
    public void A_pattern_without_a_value_group_is_refused_naming_the_field()
    {
        var ex = Assert.Throws<InvalidInputException>(() =>
            new LineParser(new LineFormat { Name = "x", Pattern = @"^(?<v>\d+)$", DefaultUnit = "g" }, "balance.formats[1]"));

        var error = Assert.Single(ex.Errors);
        Assert.Equal("balance.formats[1].pattern", error.Field);
        Assert.Contains("'value'", error.Reason);
    }

    [Fact]
    public void An_invalid_regular_expression_is_refused_with_the_pattern_as_value()
    {
        var ex = Assert.Throws<InvalidInputException>(() =>
            new LineParser(new LineFormat { Name = "x", Pattern = "(?<value>[0-9", DefaultUnit = "g" }));

        Assert.Equal("format.pattern", ex.Errors[0].Field);
        Assert.Equal("(?<value>[0-9", ex.Errors[0].Value);
    }

    [Fact]
    public void All_rule_violations_are_reported_together()
    {
        var ex = Assert.Throws<InvalidInputException>(() =>
            new LineParser(new LineFormat { Name = "x", Pattern = @"^(?<flag>.)(?<value>\d+)$", DefaultUnit = "oz", MaxLineLength = 2 }));

        Assert.Equal(
            ["format.stableFlag", "format.defaultUnit", "format.maxLineLength"],
            ex.Errors.Select(e => e.Field));
    }

    [Fact]
    public void A_pattern_without_a_unit_group_needs_a_default_unit()
    {
        var ex = Assert.Throws<InvalidInputException>(() =>
            new LineParser(new LineFormat { Name = "x", Pattern = @"^(?<value>\d+)$" }));

        Assert.Equal("format.defaultUnit", Assert.Single(ex.Errors).Field);
    }

    [Fact]
    public void A_catastrophically_backtracking_pattern_times_out_instead_of_hanging()
    {
        var parser = new LineParser(new LineFormat { Name = "slow", Pattern = @"^(?<value>(\d+)+)$", DefaultUnit = "g", MaxLineLength = 4096 });

        var result = parser.Parse(new string('1', 4000) + "x");

        Assert.Equal(ParseFailureReason.PatternTimeout, result.Failure!.Reason);
    }

    [Fact]
    public void Markers_with_backreferences_keep_their_meaning()
    {
        var parser = new LineParser(new LineFormat
        {
            Name = "echoed",
            Pattern = @"^(?<value>\d+)$",
            DefaultUnit = "g",
            OverloadPattern = @"^(O)\1$",
            ErrorPattern = @"^(E)\1$",
        });

        Assert.Equal(ReadingKind.Overload, parser.Parse("OO").Reading!.Kind);
        Assert.Equal(ReadingKind.Error, parser.Parse("EE").Reading!.Kind);
        Assert.Equal(12.0, parser.Parse("12").Reading!.ValueG);
        Assert.False(parser.Parse("OE").IsReading);
    }
}

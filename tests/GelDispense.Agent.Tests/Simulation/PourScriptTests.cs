using GelDispense.Agent.Simulation;
using GelDispense.Chemistry.Errors;

namespace GelDispense.Agent.Tests.Simulation;

public class PourScriptTests
{
    [Fact]
    public void Additions_with_over_and_short_pours_parse()
    {
        var steps = PourScript.Parse("5, 12.5+10%,3.2-2%");

        Assert.Equal([new PourStep(5, 0), new PourStep(12.5, 0.1), new PourStep(3.2, -0.02)], steps);
        Assert.Equal(13.75, steps[1].AimG, 9);
    }

    [Theory]
    [InlineData("")]
    [InlineData("abc")]
    [InlineData("0")]
    [InlineData("-5")]
    [InlineData("5+10")]
    [InlineData("5+x%")]
    [InlineData("5-100%")]
    public void A_bad_item_is_refused_naming_it(string script)
    {
        var ex = Assert.Throws<InvalidInputException>(() => PourScript.Parse(script));

        Assert.Equal("--script", ex.Errors[0].Field);
    }
}

using System.CommandLine;
using GelDispense.Agent.Commands;
using GelDispense.Agent.Tests.Support;

namespace GelDispense.Agent.Tests.Commands;

/// <summary>The README's first command: `demo` must run to exit code 0 with nothing else running.</summary>
[Collection(StationCollection.Name)]
public sealed class DemoCommandTests
{
    [Fact]
    public async Task The_demo_runs_a_batch_with_one_over_pour_and_its_replan_and_exits_zero()
    {
        var output = new StringWriter();
        var error = new StringWriter();

        var exit = await AgentCommandLine.Build().Parse(["demo", "--plain"]).InvokeAsync(new InvocationConfiguration { Output = output, Error = error });

        var text = output.ToString();
        Assert.True(exit == 0, $"exit {exit}\n{text}\n{error}");
        Assert.True(text.Split('\n').Count(l => l.Contains("OUT OF WINDOW", StringComparison.Ordinal)) == 1, text);
        Assert.Contains("RE-PLANNED", text, StringComparison.Ordinal);
        Assert.Contains("batch factor 1.030", text, StringComparison.Ordinal);
        Assert.Contains("lot NA-TEOS-24-117", text, StringComparison.Ordinal);
        Assert.Contains("Within spec: yes; complete: yes; steps made: 6.", text, StringComparison.Ordinal);
        Assert.Contains("6 additions recorded once each, batch completed", text, StringComparison.Ordinal);
    }
}

using System.CommandLine;
using GelDispense.Agent.Commands;
using GelDispense.Agent.Tests.Support;

namespace GelDispense.Agent.Tests.Commands;

/// <summary>Bad input to `run` and `pipette-check` is reported with field, value and reason, and never starts anything.</summary>
public sealed class RunCommandTests : TempDirectoryTest
{
    private static async Task<(int Exit, string Error)> InvokeAsync(params string[] args)
    {
        var error = new StringWriter();
        var exit = await AgentCommandLine.Build().Parse(args).InvokeAsync(new InvocationConfiguration { Output = new StringWriter(), Error = error });
        return (exit, error.ToString());
    }

    [Fact]
    public async Task Both_a_recipe_and_a_batch_id_is_refused()
    {
        var (exit, error) = await InvokeAsync("run", "--port", "/dev/null", "--recipe", "sol.json", "--batch", "b-1");

        Assert.Equal(AgentCommandLine.ExitBadInput, exit);
        Assert.Contains("--recipe", error, StringComparison.Ordinal);
        Assert.Contains("not both", error, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_missing_recipe_file_is_named()
    {
        var missing = Path.Combine(Dir, "missing.json");

        var (exit, error) = await InvokeAsync("run", "--port", "/dev/null", "--recipe", missing);

        Assert.Equal(AgentCommandLine.ExitBadInput, exit);
        Assert.Contains($"recipe = '{missing}': file not found", error, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_recipe_file_that_is_not_a_recipe_is_refused_with_the_reason()
    {
        var file = Path.Combine(Dir, "sol.json");
        await File.WriteAllTextAsync(file, """{ "name": "x", "components": 7 }""");

        var (exit, error) = await InvokeAsync("run", "--port", "/dev/null", "--recipe", file);

        Assert.Equal(AgentCommandLine.ExitBadInput, exit);
        Assert.Contains($"recipe = '{file}'", error, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_lot_without_a_reagent_is_refused()
    {
        var (exit, error) = await InvokeAsync("run", "--port", "/dev/null", "--batch", "b-1", "--lot", "A-117");

        Assert.Equal(AgentCommandLine.ExitBadInput, exit);
        Assert.Contains("--lot = 'A-117'", error, StringComparison.Ordinal);
    }

    [Fact]
    public async Task An_unknown_confirmation_mode_is_refused()
    {
        var (exit, error) = await InvokeAsync("run", "--port", "/dev/null", "--batch", "b-1", "--confirm", "sometimes");

        Assert.Equal(AgentCommandLine.ExitBadInput, exit);
        Assert.Contains("--confirm = 'sometimes': use auto or key", error, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_pipette_check_without_a_pipette_in_the_config_is_refused()
    {
        var (exit, error) = await InvokeAsync("pipette-check", "--port", "/dev/null");

        Assert.Equal(AgentCommandLine.ExitBadInput, exit);
        Assert.Contains("pipette = '': the station config has no pipette section", error, StringComparison.Ordinal);
    }
}

using System.CommandLine;
using GelDispense.Chemistry.Errors;

namespace GelDispense.Agent.Commands;

/// <summary>
/// The one place where commands are wired. Each command lives in its own file with a <c>Create()</c>;
/// the station workflow commands are added here beside the balance tools.
/// </summary>
public static class AgentCommandLine
{
    public const int ExitOk = 0;
    public const int ExitBadInput = 2;

    public static RootCommand Build()
    {
        var root = new RootCommand("GelDispense station agent: reads the balance at a dispensing station and guides each addition.");
        root.Subcommands.Add(WatchCommand.Create());
        root.Subcommands.Add(SimulateCommand.Create());
        root.Subcommands.Add(PortsCommand.Create());
        root.Subcommands.Add(RunCommand.Create());
        root.Subcommands.Add(PipetteCheckCommand.Create());
        root.Subcommands.Add(DemoCommand.Create());
        return root;
    }

    /// <summary>Prints input errors one per line as "field = 'value': reason" and returns the bad-input exit code.</summary>
    internal static int Report(InvalidInputException ex, TextWriter error)
    {
        error.WriteLine("The configuration has problems:");
        foreach (var e in ex.Errors)
        {
            error.WriteLine($"  {e}");
        }

        return ExitBadInput;
    }
}

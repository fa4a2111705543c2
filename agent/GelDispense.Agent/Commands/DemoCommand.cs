using System.CommandLine;
using GelDispense.Agent.Demo;
using GelDispense.Agent.Display;

namespace GelDispense.Agent.Commands;

/// <summary>
/// <c>demo</c>: the whole station on this machine with nothing else running (the README's first command): the service
/// in-process on SQLite in a temporary directory, a simulated balance on a pseudo-terminal with a technician who
/// over-pours once, and the agent making the NA-7 demo batch. Exits 0 when every addition is recorded and the batch
/// is completed.
/// </summary>
internal static class DemoCommand
{
    public const int ExitDemoFailed = 1;

    public static Command Create()
    {
        var seed = new Option<int>("--seed") { Description = "Seed of the balance noise (same seed, same trace)", DefaultValueFactory = _ => 7 };
        var plain = new Option<bool>("--plain") { Description = "Plain log lines even on a terminal" };
        var timeout = new Option<double>("--timeout") { Description = "Give up after this many seconds", DefaultValueFactory = _ => 100 };
        var command = new Command("demo", "Run a demo batch end to end: in-process service, simulated balance with one over-pour and its re-plan, and the as-made composition.");
        command.Options.Add(seed);
        command.Options.Add(plain);
        command.Options.Add(timeout);
        command.SetAction(async (parse, cancellationToken) =>
        {
            var output = parse.InvocationConfiguration.Output;
            using var limit = CancellationTokenSource.CreateLinkedTokenSource(cancellationToken);
            limit.CancelAfter(TimeSpan.FromSeconds(parse.GetValue(timeout)));
            await using var display = DisplayChoice.Create(output, parse.GetValue(plain), TimeProvider.System);
            try
            {
                var result = await DemoRun.RunAsync(display, output, parse.GetValue(seed), limit.Token);
                var ok = result.Completed && result.PendingAdditions == 0 && result.AsMade is not null;
                await display.DisposeAsync();
                output.WriteLine(ok
                    ? $"demo finished: batch {result.BatchId}, {result.Additions.Count} additions recorded once each, batch completed"
                    : $"demo did not finish cleanly: batch {result.BatchId}, {result.PendingAdditions} additions pending");
                return ok ? AgentCommandLine.ExitOk : ExitDemoFailed;
            }
            catch (OperationCanceledException) when (limit.IsCancellationRequested && !cancellationToken.IsCancellationRequested)
            {
                parse.InvocationConfiguration.Error.WriteLine($"demo gave up after {parse.GetValue(timeout)} s");
                return ExitDemoFailed;
            }
        });
        return command;
    }
}

using GelDispense.Agent.Formats;

namespace GelDispense.Agent.Simulation;

/// <summary>
/// Paces a <see cref="BalanceSimulator"/> with the injected clock, sends each sample through the port, answers
/// commands, and cuts and restores the line on the configured schedule.
/// </summary>
public sealed class SimulatorHost(BalanceSimulator simulator, SampleRenderer renderer, ISimulatorPort port, SimulatorSettings settings, TimeProvider time)
{
    private readonly LineSplitter _commands = new(256);
    private readonly byte[] _receiveBuffer = new byte[256];

    /// <summary>Called with each line as sent (text without terminator), or with a note such as a disconnect.</summary>
    public event Action<string>? Activity;

    public async Task RunAsync(TimeSpan? duration, CancellationToken cancellationToken)
    {
        var started = time.GetUtcNow();
        var last = started;
        var downSince = (DateTimeOffset?)null;
        var upSince = started;
        while (!cancellationToken.IsCancellationRequested)
        {
            await Task.Delay(settings.SampleInterval, time, cancellationToken).ConfigureAwait(false);
            var now = time.GetUtcNow();
            var sample = simulator.Step(now - last);
            last = now;
            if (duration is { } limit && now - started >= limit)
            {
                return;
            }

            if (downSince is { } down)
            {
                if (now - down < settings.DisconnectFor)
                {
                    continue;
                }

                port.Reconnect();
                downSince = null;
                upSince = now;
                Activity?.Invoke($"# line restored: {port.Describe}");
            }
            else if (settings.DisconnectEvery is { } every && now - upSince >= every)
            {
                port.Disconnect();
                downSince = now;
                Activity?.Invoke("# line cut");
                continue;
            }

            port.Send(renderer.Bytes(sample));
            Activity?.Invoke(renderer.Text(sample));
            ServeCommands();
        }
    }

    private void ServeCommands()
    {
        var n = port.Receive(_receiveBuffer);
        if (n == 0)
        {
            return;
        }

        _commands.Feed(_receiveBuffer.AsSpan(0, n), line =>
        {
            var known = line.IsClean && simulator.HandleCommand(line.Text);
            Activity?.Invoke($"# command '{line.Text}'{(known ? "" : " ignored")}");
        });
    }
}

using GelDispense.Agent.Simulation;

namespace GelDispense.Agent.Tests.Support;

/// <summary>
/// A simulator port whose line a test can cut and restore. The cut and the restore are carried out on the simulator's
/// own thread, at its next send, so they never race a write to the pseudo-terminal; the times they took effect are kept.
/// </summary>
internal sealed class ControlledPort(PtySimulatorPort inner) : ISimulatorPort
{
    private volatile bool _cut;
    private volatile bool _restore;

    public DateTimeOffset? CutAt { get; private set; }

    public DateTimeOffset? RestoredAt { get; private set; }

    public string Describe => inner.Describe;

    public void RequestCut() => _cut = true;

    public void RequestRestore() => _restore = true;

    public void Send(ReadOnlySpan<byte> line)
    {
        if (_cut)
        {
            _cut = false;
            inner.Disconnect();
            CutAt = DateTimeOffset.UtcNow;
        }

        if (_restore)
        {
            _restore = false;
            inner.Reconnect();
            RestoredAt = DateTimeOffset.UtcNow;
        }

        inner.Send(line);
    }

    public int Receive(Span<byte> buffer) => inner.Receive(buffer);

    public void Disconnect() => inner.Disconnect();

    public void Reconnect() => inner.Reconnect();

    public void Dispose() => inner.Dispose();
}

using GelDispense.Agent.Pty;

namespace GelDispense.Agent.Simulation;

/// <summary>
/// Serves on a pseudo-terminal. With a link path, that fixed path always points at the current slave, so the
/// agent can reopen it after a simulated disconnect (a new pty gets a new /dev/pts number).
/// </summary>
public sealed class PtySimulatorPort : ISimulatorPort
{
    private readonly string? _linkPath;
    private PseudoTerminal _pty;

    public PtySimulatorPort(string? linkPath)
    {
        _linkPath = linkPath;
        _pty = OpenPointed();
    }

    public string SlavePath => _pty.SlavePath;

    public string Describe => _linkPath is null ? _pty.SlavePath : $"{_linkPath} -> {_pty.SlavePath}";

    public void Send(ReadOnlySpan<byte> line)
    {
        if (!_pty.IsHungUp)
        {
            _pty.Write(line);
        }
    }

    public int Receive(Span<byte> buffer) => _pty.Read(buffer, 0);

    /// <summary>Hangs up and removes the fixed path, as unplugging a USB adapter removes its by-id name.</summary>
    public void Disconnect()
    {
        _pty.HangUp();
        if (_linkPath is not null)
        {
            File.Delete(_linkPath);
        }
    }

    public void Reconnect()
    {
        if (_pty.IsHungUp)
        {
            _pty = OpenPointed();
        }
    }

    public void Dispose()
    {
        _pty.Dispose();
        if (_linkPath is not null)
        {
            // Deletes the symlink itself, and does nothing when it is already gone.
            File.Delete(_linkPath);
        }
    }

    private PseudoTerminal OpenPointed()
    {
        var pty = PseudoTerminal.Open();
        if (_linkPath is not null)
        {
            SymlinkPoint.Point(_linkPath, pty.SlavePath);
        }

        return pty;
    }
}

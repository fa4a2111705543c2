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

    /// <summary>Removes the fixed path and hangs up, as unplugging a USB adapter removes its by-id name.</summary>
    /// <remarks>
    /// The path goes first: the kernel hands a freed /dev/pts number to the next terminal opened anywhere on the
    /// machine, so a path left standing for a moment after the hang-up can lead a reopening agent to a stranger's
    /// terminal, where it would sit connected and never see this line come back.
    /// </remarks>
    public void Disconnect()
    {
        DeleteLink();
        _pty.HangUp();
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
        DeleteLink();
        _pty.Dispose();
    }

    private void DeleteLink()
    {
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

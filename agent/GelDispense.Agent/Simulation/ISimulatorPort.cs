namespace GelDispense.Agent.Simulation;

/// <summary>Where the simulated balance is served: a pseudo-terminal or a TCP port.</summary>
public interface ISimulatorPort : IDisposable
{
    /// <summary>The path or address a client opens, for printing.</summary>
    string Describe { get; }

    /// <summary>Sends a line; bytes are dropped when nobody listens, as on a real line.</summary>
    void Send(ReadOnlySpan<byte> line);

    /// <summary>Bytes the client sent (commands); 0 when none, never blocks for long.</summary>
    int Receive(Span<byte> buffer);

    /// <summary>Cuts the line: a pulled cable on a pty, a closed socket on TCP.</summary>
    void Disconnect();

    /// <summary>Restores the line after <see cref="Disconnect"/>.</summary>
    void Reconnect();
}

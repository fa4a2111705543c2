namespace GelDispense.Agent.Links;

/// <summary>
/// One open connection to a balance. <see cref="Read"/> blocks at most the configured read timeout and returns
/// 0 when nothing arrived; any exception means the connection is gone. <see cref="IDisposable.Dispose"/> must
/// return within a bound even when the driver's own close hangs.
/// </summary>
public interface IBalanceConnection : IDisposable
{
    int Read(Span<byte> buffer);

    void Write(ReadOnlySpan<byte> data);
}

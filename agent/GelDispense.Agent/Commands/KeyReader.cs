namespace GelDispense.Agent.Commands;

/// <summary>
/// Reads keys from the terminal on a background thread and forwards them (Enter to confirm in key mode, q to stop).
/// Console.ReadKey blocks, so the thread is a background one and simply dies with the process.
/// </summary>
internal sealed class KeyReader : IDisposable
{
    private volatile Action<char>? _target;
    private volatile bool _stopped;

    public KeyReader()
    {
        new Thread(Read) { IsBackground = true, Name = "key reader" }.Start();
    }

    public void Forward(Action<char> target) => _target = target;

    public void Dispose() => _stopped = true;

    private void Read()
    {
        while (!_stopped)
        {
            var key = Console.ReadKey(intercept: true);
            if (!_stopped)
            {
                _target?.Invoke(key.Key == ConsoleKey.Enter ? '\r' : key.KeyChar);
            }
        }
    }
}

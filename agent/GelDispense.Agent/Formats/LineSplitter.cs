namespace GelDispense.Agent.Formats;

/// <summary>
/// Cuts a byte stream into lines on CR, LF or CR LF, in any mix, keeping a partial line until its end
/// arrives. Memory stays bounded: past <c>maxLineLength</c> characters the rest of a line is only counted.
/// Not thread-safe; one splitter per connection, and a new one after a reconnect so that half a line from
/// before a hang-up can never be glued to half a line after it. A splitter made with
/// <c>startsMidLine: true</c> drops everything up to the first terminator: right after a port opens we cannot
/// know whether the balance was halfway through a line, and a tail such as "00" would parse as a mass.
/// </summary>
public sealed class LineSplitter(int maxLineLength, bool startsMidLine = false)
{
    private readonly char[] _buffer = new char[maxLineLength];
    private bool _resyncing = startsMidLine;
    private int _length;
    private int _nonText;
    private bool _overlong;
    private bool _lastWasCr;

    /// <summary>Non-empty lines completed so far, including rejected ones.</summary>
    public long LinesSeen { get; private set; }

    /// <summary>Bytes that were neither printable ASCII, tab nor a line terminator.</summary>
    public long NonTextBytesSeen { get; private set; }

    /// <summary>Bytes dropped before the first terminator of a splitter that starts mid-line.</summary>
    public long BytesDroppedAtStart { get; private set; }

    /// <summary>True while a line has started but its terminator has not arrived.</summary>
    public bool HasPartialLine => _length > 0 || _nonText > 0 || _overlong;

    /// <summary>Feeds bytes and calls <paramref name="onLine"/> for each completed non-empty line.</summary>
    public void Feed(ReadOnlySpan<byte> bytes, Action<SplitLine> onLine)
    {
        foreach (var b in bytes)
        {
            if (b is (byte)'\r' or (byte)'\n')
            {
                // The LF of a CR LF pair ends nothing: the CR already ended the line.
                var secondHalfOfPair = b == (byte)'\n' && _lastWasCr;
                _lastWasCr = b == (byte)'\r';
                if (_resyncing)
                {
                    _resyncing = false;
                }
                else if (!secondHalfOfPair)
                {
                    EndLine(onLine);
                }

                continue;
            }

            _lastWasCr = false;
            if (_resyncing)
            {
                BytesDroppedAtStart++;
            }
            else if (b is < 0x20 and not (byte)'\t' or >= 0x7F)
            {
                _nonText++;
                NonTextBytesSeen++;
            }
            else if (_length < _buffer.Length)
            {
                _buffer[_length++] = (char)b;
            }
            else
            {
                _overlong = true;
            }
        }
    }

    private void EndLine(Action<SplitLine> onLine)
    {
        if (!HasPartialLine)
        {
            return;
        }

        LinesSeen++;
        var line = new SplitLine(new string(_buffer, 0, _length), _nonText, _overlong);
        _length = 0;
        _nonText = 0;
        _overlong = false;
        onLine(line);
    }
}

using System.ComponentModel;
using System.Runtime.InteropServices;
using System.Text;

namespace GelDispense.Agent.Pty;

/// <summary>
/// A pseudo-terminal pair: the slave side is a real serial device path (<see cref="SlavePath"/>) that
/// System.IO.Ports opens like a USB adapter; this object plays the far end through the master side.
/// We keep our own slave descriptor open so the pair survives a client closing and reopening its port.
/// The master is non-blocking: with nobody reading, lines are dropped like on a real cable, instead of the
/// writer stalling once the kernel buffer is full. Closing the master (<see cref="HangUp"/>) is a cable pull.
/// </summary>
public sealed class PseudoTerminal : IDisposable
{
    private readonly Lock _gate = new();
    private int _master;
    private int _slave;

    private PseudoTerminal(int master, int slave, string slavePath)
    {
        _master = master;
        _slave = slave;
        SlavePath = slavePath;
    }

    public string SlavePath { get; }

    public bool IsHungUp { get { lock (_gate) { return _master < 0; } } }

    public static unsafe PseudoTerminal Open()
    {
        if (LibC.openpty(out var master, out var slave, null, 0, 0) != 0)
        {
            throw new Win32Exception(Marshal.GetLastPInvokeError(), "openpty failed");
        }

        try
        {
            var termios = stackalloc byte[LibC.TermiosBufferBytes];
            Check(LibC.tcgetattr(slave, termios), "tcgetattr");
            LibC.cfmakeraw(termios);
            Check(LibC.tcsetattr(slave, LibC.TcsaNow, termios), "tcsetattr");
            var flags = LibC.fcntl(master, LibC.FGetFl, 0);
            Check(flags, "fcntl(F_GETFL)");
            Check(LibC.fcntl(master, LibC.FSetFl, flags | LibC.ONonBlock), "fcntl(F_SETFL)");
            var name = stackalloc byte[512];
            Check(LibC.ttyname_r(slave, name, 512) == 0 ? 0 : -1, "ttyname_r");
            return new PseudoTerminal(master, slave, Marshal.PtrToStringUTF8((nint)name)!);
        }
        catch
        {
            LibC.close(master);
            LibC.close(slave);
            throw;
        }
    }

    /// <summary>Writes to the far end of the line; returns the bytes accepted (fewer when the buffer is full).</summary>
    public unsafe int Write(ReadOnlySpan<byte> data)
    {
        lock (_gate)
        {
            if (_master < 0)
            {
                throw new ObjectDisposedException(nameof(PseudoTerminal), "the master side is hung up");
            }

            var written = 0;
            fixed (byte* p = data)
            {
                while (written < data.Length)
                {
                    var n = LibC.write(_master, p + written, data.Length - written);
                    if (n >= 0)
                    {
                        written += (int)n;
                        continue;
                    }

                    var errno = Marshal.GetLastPInvokeError();
                    if (errno == LibC.EIntr)
                    {
                        continue;
                    }

                    return errno == LibC.EAgain ? written : throw new Win32Exception(errno, "write to pty master failed");
                }
            }

            return written;
        }
    }

    /// <summary>Writes text one byte per character (Latin-1), so tests can put noise bytes such as \xff on the line.</summary>
    public int Write(string text) => Write(Encoding.Latin1.GetBytes(text));

    /// <summary>Reads what the client sent (commands), waiting at most <paramref name="timeoutMs"/> (capped at 50 ms); 0 when nothing came.</summary>
    public unsafe int Read(Span<byte> buffer, int timeoutMs)
    {
        // Short waits under the lock: a descriptor closed by HangUp on another thread must never be
        // reused by the kernel for another file while a read is still aimed at its number.
        lock (_gate)
        {
            if (_master < 0)
            {
                return 0;
            }

            var pfd = new LibC.PollFd { Fd = _master, Events = LibC.PollIn };
            if (LibC.poll(&pfd, 1, Math.Min(timeoutMs, 50)) <= 0 || (pfd.Revents & LibC.PollIn) == 0)
            {
                return 0;
            }

            fixed (byte* p = buffer)
            {
                var n = LibC.read(_master, p, buffer.Length);
                return n > 0 ? (int)n : 0;
            }
        }
    }

    /// <summary>Closes the master side: the client sees a hang-up, as when a cable is pulled.</summary>
    public void HangUp()
    {
        lock (_gate)
        {
            CloseFd(ref _master);
            CloseFd(ref _slave);
        }
    }

    public void Dispose() => HangUp();

    private static void CloseFd(ref int fd)
    {
        if (fd >= 0)
        {
            LibC.close(fd);
            fd = -1;
        }
    }

    private static void Check(int result, string call)
    {
        if (result < 0)
        {
            throw new Win32Exception(Marshal.GetLastPInvokeError(), $"{call} failed on the new pseudo-terminal");
        }
    }
}

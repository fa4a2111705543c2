using System.Runtime.InteropServices;

namespace GelDispense.Agent.Pty;

/// <summary>The few libc calls a pseudo-terminal pair needs (glibc has openpty in libc itself since 2.34).</summary>
internal static partial class LibC
{
    public const int TcsaNow = 0;
    public const int FGetFl = 3;
    public const int FSetFl = 4;
    public const int ONonBlock = 0x800;
    public const int EAgain = 11;
    public const int EIntr = 4;
    public const short PollIn = 0x001;

    // glibc's struct termios is 60 bytes on x86-64 and arm64; a larger buffer leaves room for any libc.
    public const int TermiosBufferBytes = 256;

    [StructLayout(LayoutKind.Sequential)]
    public struct PollFd
    {
        public int Fd;
        public short Events;
        public short Revents;
    }

    [LibraryImport("libc", SetLastError = true)]
    public static unsafe partial int openpty(out int master, out int slave, byte* name, nint termp, nint winp);

    [LibraryImport("libc", SetLastError = true)]
    public static unsafe partial int ttyname_r(int fd, byte* buffer, nuint length);

    [LibraryImport("libc", SetLastError = true)]
    public static unsafe partial int tcgetattr(int fd, byte* termios);

    [LibraryImport("libc")]
    public static unsafe partial void cfmakeraw(byte* termios);

    [LibraryImport("libc", SetLastError = true)]
    public static unsafe partial int tcsetattr(int fd, int optionalActions, byte* termios);

    [LibraryImport("libc", SetLastError = true)]
    public static partial int fcntl(int fd, int command, int argument);

    [LibraryImport("libc", SetLastError = true)]
    public static unsafe partial nint read(int fd, byte* buffer, nint count);

    [LibraryImport("libc", SetLastError = true)]
    public static unsafe partial nint write(int fd, byte* buffer, nint count);

    [LibraryImport("libc", SetLastError = true)]
    public static unsafe partial int poll(PollFd* fds, nuint count, int timeoutMs);

    [LibraryImport("libc", SetLastError = true)]
    public static partial int close(int fd);
}

using System.IO.Ports;
using System.Text;
using GelDispense.Agent.Pty;

namespace GelDispense.Agent.Tests.Pty;

/// <summary>A real pseudo-terminal pair opened through libc, driven by System.IO.Ports on the slave side.</summary>
public class PseudoTerminalTests
{
    [Fact]
    public void The_slave_is_a_serial_path_that_SerialPort_opens_and_reads_lines_from()
    {
        using var pty = PseudoTerminal.Open();
        using var port = new SerialPort(pty.SlavePath, 9600, Parity.None, 8, StopBits.One) { NewLine = "\r\n", ReadTimeout = 2000, WriteTimeout = 2000 };
        port.Open();

        pty.Write("= +   12.3456 g\r\n");

        Assert.StartsWith("/dev/pts/", pty.SlavePath);
        Assert.Equal("= +   12.3456 g", port.ReadLine());
    }

    [Fact]
    public void What_the_client_writes_arrives_byte_exact_on_the_master()
    {
        using var pty = PseudoTerminal.Open();
        using var port = new SerialPort(pty.SlavePath) { WriteTimeout = 2000 };
        port.Open();

        port.Write("TARE-NOW\r\n");

        var received = new List<byte>();
        var buffer = new byte[64];
        var deadline = DateTime.UtcNow.AddSeconds(5);
        while (received.Count < 10 && DateTime.UtcNow < deadline)
        {
            received.AddRange(buffer.AsSpan(0, pty.Read(buffer, 50)).ToArray());
        }

        Assert.Equal("TARE-NOW\r\n", Encoding.ASCII.GetString([.. received]));
    }

    [Fact]
    public void Nothing_sent_reads_as_zero_bytes_without_blocking()
    {
        using var pty = PseudoTerminal.Open();

        Assert.Equal(0, pty.Read(new byte[16], 20));
    }

    [Fact]
    public void With_nobody_reading_the_master_drops_instead_of_blocking()
    {
        using var pty = PseudoTerminal.Open();
        var line = Encoding.ASCII.GetBytes(new string('1', 1000) + "\n");
        var accepted = 0;

        for (var i = 0; i < 200; i++)
        {
            accepted += pty.Write(line);
        }

        Assert.True(accepted < 200 * line.Length, "a full kernel buffer must refuse bytes, not block the writer");
    }

    [Fact]
    public void A_hung_up_master_refuses_writes()
    {
        var pty = PseudoTerminal.Open();

        pty.HangUp();

        Assert.True(pty.IsHungUp);
        Assert.Throws<ObjectDisposedException>(() => pty.Write("1\n"));
    }
}

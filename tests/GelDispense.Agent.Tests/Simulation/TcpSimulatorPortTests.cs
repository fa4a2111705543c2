using System.Net.Sockets;
using System.Text;
using GelDispense.Agent.Simulation;

namespace GelDispense.Agent.Tests.Simulation;

public class TcpSimulatorPortTests
{
    [Fact]
    public void A_client_receives_lines_and_a_disconnect_closes_its_socket()
    {
        using var port = new TcpSimulatorPort(0);
        using var client = new TcpClient();
        client.Connect("127.0.0.1", port.Port);
        client.ReceiveTimeout = 5000;
        var buffer = new byte[8];

        port.Send("1.0\n"u8);
        var first = Encoding.ASCII.GetString(buffer, 0, client.GetStream().Read(buffer));
        port.Disconnect();

        Assert.Equal("1.0\n", first);
        Assert.Equal(0, client.GetStream().Read(buffer));
    }
}

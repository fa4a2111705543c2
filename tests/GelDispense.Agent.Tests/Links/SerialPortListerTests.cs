using GelDispense.Agent.Links;

namespace GelDispense.Agent.Tests.Links;

public sealed class SerialPortListerTests : IDisposable
{
    private readonly string _dev = Directory.CreateTempSubdirectory("gd-dev-").FullName;

    public void Dispose() => Directory.Delete(_dev, recursive: true);

    [Fact]
    public void Lists_by_id_names_with_targets_then_device_nodes_in_natural_order()
    {
        foreach (var name in new[] { "ttyS10", "ttyS2", "ttyUSB0", "ttyACM1", "tty0", "null" })
        {
            File.WriteAllText(Path.Combine(_dev, name), "");
        }

        Directory.CreateDirectory(Path.Combine(_dev, "serial", "by-id"));
        var byId = Path.Combine(_dev, "serial", "by-id", "usb-Acme_Bridge_1234-if00-port0");
        File.CreateSymbolicLink(byId, "../../ttyUSB0");

        var ports = SerialPortLister.List(_dev);

        Assert.Equal(
            [byId, Path.Combine(_dev, "ttyUSB0"), Path.Combine(_dev, "ttyACM1"), Path.Combine(_dev, "ttyS2"), Path.Combine(_dev, "ttyS10")],
            ports.Select(p => p.Path));
        Assert.Equal(Path.Combine(_dev, "ttyUSB0"), ports[0].Target);
    }

    [Fact]
    public void A_missing_dev_folder_lists_nothing()
    {
        Assert.Empty(SerialPortLister.List(Path.Combine(_dev, "absent")));
    }
}

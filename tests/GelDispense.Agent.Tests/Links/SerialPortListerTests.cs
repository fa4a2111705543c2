using GelDispense.Agent.Links;
using GelDispense.Agent.Tests.Support;

namespace GelDispense.Agent.Tests.Links;

public sealed class SerialPortListerTests : TempDirectoryTest
{
    [Fact]
    public void Lists_by_id_names_with_targets_then_device_nodes_in_natural_order()
    {
        foreach (var name in new[] { "ttyS10", "ttyS2", "ttyUSB0", "ttyACM1", "tty0", "null" })
        {
            File.WriteAllText(Path.Combine(Dir, name), "");
        }

        Directory.CreateDirectory(Path.Combine(Dir, "serial", "by-id"));
        var byId = Path.Combine(Dir, "serial", "by-id", "usb-bridge-0001-if00-port0");
        File.CreateSymbolicLink(byId, "../../ttyUSB0");

        var ports = SerialPortLister.List(Dir);

        Assert.Equal(
            [byId, Path.Combine(Dir, "ttyUSB0"), Path.Combine(Dir, "ttyACM1"), Path.Combine(Dir, "ttyS2"), Path.Combine(Dir, "ttyS10")],
            ports.Select(p => p.Path));
        Assert.Equal(Path.Combine(Dir, "ttyUSB0"), ports[0].Target);
    }

    [Fact]
    public void A_missing_dev_folder_lists_nothing()
    {
        Assert.Empty(SerialPortLister.List(Path.Combine(Dir, "absent")));
    }
}

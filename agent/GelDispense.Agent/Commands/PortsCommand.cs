using System.CommandLine;
using GelDispense.Agent.Links;

namespace GelDispense.Agent.Commands;

/// <summary><c>ports</c>: lists serial device paths, because the runtime's own list is empty on Linux.</summary>
internal static class PortsCommand
{
    public static Command Create()
    {
        var command = new Command("ports", "List serial ports a balance may be on (stable /dev/serial/by-id names first).");
        command.SetAction(parse =>
        {
            var output = parse.InvocationConfiguration.Output;
            var ports = SerialPortLister.List();
            if (ports.Count == 0)
            {
                output.WriteLine("No serial devices found under /dev. Is the adapter plugged in?");
                return AgentCommandLine.ExitOk;
            }

            foreach (var port in ports)
            {
                output.WriteLine(port.Target is null ? $"{port.Path}  ({port.Kind})" : $"{port.Path} -> {port.Target}  ({port.Kind})");
            }

            return AgentCommandLine.ExitOk;
        });
        return command;
    }
}

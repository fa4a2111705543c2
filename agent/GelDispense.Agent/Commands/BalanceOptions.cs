using System.CommandLine;
using GelDispense.Agent.Configuration;

namespace GelDispense.Agent.Commands;

/// <summary>
/// Options that say where the balance is and how to read it. They override the station config file given with
/// --config, so a technician can try another port or format without editing the file.
/// </summary>
internal sealed class BalanceOptions
{
    public Option<FileInfo?> Config { get; } = new("--config", "-c") { HelpName = "file", Description = "Station config file (JSON)" };

    public Option<string?> Port { get; } = new("--port", "-p") { HelpName = "path", Description = "Serial device path, e.g. /dev/ttyUSB0 or /dev/serial/by-id/…" };

    public Option<string?> Tcp { get; } = new("--tcp") { HelpName = "host:port", Description = "Balance on the network, host:port" };

    public Option<string?> Format { get; } = new("--format", "-f") { HelpName = "name", Description = "Line format: column, keyed, bare, or a name from the config file" };

    public Option<int?> Baud { get; } = new("--baud") { HelpName = "rate", Description = "Baud rate (default 9600)" };

    public Option<string?> Parity { get; } = new("--parity") { HelpName = "parity", Description = "none, even, odd, mark or space" };

    public Option<int?> DataBits { get; } = new("--data-bits") { HelpName = "bits", Description = "5, 6, 7 or 8" };

    public Option<string?> StopBits { get; } = new("--stop-bits") { HelpName = "bits", Description = "1, 1.5 or 2" };

    public Option<string?> Handshake { get; } = new("--handshake") { HelpName = "kind", Description = "none, xonxoff, rtscts or both" };

    public Option<string?> LineEnding { get; } = new("--line-ending") { HelpName = "ending", Description = "Terminator for commands: crlf, lf or cr" };

    public void AddTo(Command command)
    {
        foreach (var option in new Option[] { Config, Port, Tcp, Format, Baud, Parity, DataBits, StopBits, Handshake, LineEnding })
        {
            command.Options.Add(option);
        }
    }

    /// <summary>The config file (or defaults) with the command-line values laid over it.</summary>
    public StationConfig Load(ParseResult parse)
    {
        var config = parse.GetValue(Config) is { } file ? StationConfigLoader.Load(file.FullName) : new StationConfig();
        var balance = config.Balance;
        var serial = balance.Serial;
        if (parse.GetValue(Port) is { } port)
        {
            balance = balance with { Port = port, Tcp = null };
        }

        if (parse.GetValue(Tcp) is { } tcp)
        {
            balance = balance with { Tcp = tcp, Port = null };
        }

        serial = serial with
        {
            Baud = parse.GetValue(Baud) ?? serial.Baud,
            Parity = parse.GetValue(Parity) ?? serial.Parity,
            DataBits = parse.GetValue(DataBits) ?? serial.DataBits,
            StopBits = parse.GetValue(StopBits) ?? serial.StopBits,
            Handshake = parse.GetValue(Handshake) ?? serial.Handshake,
        };
        balance = balance with
        {
            Format = parse.GetValue(Format) ?? balance.Format,
            LineEnding = parse.GetValue(LineEnding) ?? balance.LineEnding,
            Serial = serial,
        };
        return config with { Balance = balance };
    }
}

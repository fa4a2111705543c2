namespace GelDispense.Agent.Configuration;

/// <summary>Serial line settings, spelled as on a balance's menu: 9600, none/even/odd, 8, 1, none/xonxoff/rtscts.</summary>
public sealed record SerialConfig
{
    public int Baud { get; init; } = 9600;

    public string Parity { get; init; } = "none";

    public int DataBits { get; init; } = 8;

    public string StopBits { get; init; } = "1";

    public string Handshake { get; init; } = "none";

    public int ReadTimeoutMs { get; init; } = 500;

    public int WriteTimeoutMs { get; init; } = 1000;
}

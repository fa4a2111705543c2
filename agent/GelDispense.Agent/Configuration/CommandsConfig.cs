namespace GelDispense.Agent.Configuration;

/// <summary>Command strings the balance understands; none are built in, since every model has its own.</summary>
public sealed record CommandsConfig
{
    public string? Tare { get; init; }

    public string? Zero { get; init; }

    public string? Read { get; init; }
}

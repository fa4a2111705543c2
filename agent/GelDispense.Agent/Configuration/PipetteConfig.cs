namespace GelDispense.Agent.Configuration;

/// <summary>The station's pipette or dispenser for small liquid additions (volumes in µL).</summary>
public sealed record PipetteConfig
{
    public string Name { get; init; } = "";

    public double NominalVolumeUl { get; init; }

    public double MinVolumeUl { get; init; }
}

namespace GelDispense.Service.Storage;

/// <summary>The few columns of a batch that change with every write; read first by each addition.</summary>
public sealed class BatchHead
{
    public string Id { get; init; } = "";
    public string Status { get; init; } = "";
    public string StationId { get; init; } = "";
    public long Version { get; init; }
    public long PlanRevision { get; init; }
}

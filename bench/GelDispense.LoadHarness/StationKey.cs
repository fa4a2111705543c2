using GelDispense.Contracts.V1;
using Grpc.Core;
using Grpc.Net.Client;

namespace GelDispense.LoadHarness;

/// <summary>A simulated station's id and its own station key (null when the service issues no keys).</summary>
public sealed record StationKey(string StationId, string? Key)
{
    /// <summary>Issues one station key per station through the admin key, as a site administrator would (untimed).</summary>
    public static async Task<IReadOnlyList<StationKey>> IssueAsync(Uri grpc, string? adminKey, IEnumerable<string> stationIds)
    {
        using var channel = GrpcChannel.ForAddress(grpc);
        var keys = new ApiKeyService.ApiKeyServiceClient(channel);
        var headers = GrpcCall.Headers(adminKey);
        var stations = new List<StationKey>();
        foreach (var id in stationIds)
        {
            stations.Add(adminKey is null
                ? new StationKey(id, null)
                : new StationKey(id, (await keys.CreateApiKeyAsync(
                    new CreateApiKeyRequest { Role = "station", StationId = id, Label = "load harness" }, headers)).Key));
        }

        return stations;
    }
}

using Serilog;

namespace GelDispense.Service.Api;

/// <summary>Adds the batch and station a call is about to the one request-log line Serilog writes per request.</summary>
public sealed class RequestLog(IDiagnosticContext diagnostics)
{
    public void Batch(string batchId) => diagnostics.Set("BatchId", batchId);

    public void Station(string stationId) => diagnostics.Set("StationId", stationId);
}

using System.Text.Json;
using Google.Protobuf;
using Grpc.Core.Interceptors;
using Grpc.Net.Client;
using Microsoft.AspNetCore.Mvc.Testing;
using Contract = GelDispense.Contracts.V1;

namespace GelDispense.Service.Tests.Infrastructure;

/// <summary>What the correction tests share: requests and clients.</summary>
public static class Corrections
{
    public static string Path(string batchId, string additionId) => $"/v1/batches/{batchId}/additions/{additionId}:correct";

    public static string Body(string correctionId, double readingG, string reason) =>
        JsonSerializer.Serialize(new { correctionId, readingG, reason });

    /// <summary>A gRPC client of <paramref name="factory"/> that sends <paramref name="key"/> as its bearer credential.</summary>
    public static Contract.BatchService.BatchServiceClient Client(WebApplicationFactory<Program> factory, string key) =>
        new(GrpcChannel.ForAddress(factory.Server.BaseAddress, new GrpcChannelOptions { HttpHandler = factory.Server.CreateHandler() })
            .Intercept(headers =>
            {
                headers.Add("Authorization", "Bearer " + key);
                return headers;
            }));

    /// <summary>The demo batch at a station.</summary>
    public static Contract.CreateBatchRequest CreateRequest(string stationId) =>
        JsonParser.Default.Parse<Contract.CreateBatchRequest>($$"""{"stationId":"{{stationId}}","recipe":{{Demo.Recipe}},"balance":{{Demo.Balance}}}""");

    public static Contract.RecordAdditionRequest Add(Contract.Batch batch, string additionId, int stepIndex, double readingG) =>
        new() { BatchId = batch.Id, AdditionId = additionId, StepIndex = stepIndex, ReadingG = readingG, Stable = true };

    public static Contract.CorrectAdditionRequest Correct(Contract.Batch batch, string additionId, string correctionId, double readingG, string reason) =>
        new() { BatchId = batch.Id, AdditionId = additionId, CorrectionId = correctionId, ReadingG = readingG, Reason = reason };
}

using System.Text.Json;
using GelDispense.Chemistry.AsMade;
using GelDispense.Chemistry.Composition;
using GelDispense.Chemistry.Planning;
using GelDispense.Chemistry.Reagents;
using GelDispense.Service.Api;
using GelDispense.Service.Mapping;
using Google.Protobuf;
using Grpc.Core.Interceptors;
using Grpc.Net.Client;
using Microsoft.AspNetCore.Mvc.Testing;
using Contract = GelDispense.Contracts.V1;

namespace GelDispense.Service.Tests.Infrastructure;

/// <summary>What the correction tests share: requests, clients and the library's as-made.</summary>
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

    /// <summary>
    /// The as-made composition from the chemistry library alone: the batch as first planned (its stored targets, the
    /// built-in reagents, its devices) and the given readings, in g as the balance showed them, by step.
    /// </summary>
    public static SolComposition LibraryAsMade(Contract.Batch batch, IEnumerable<(int StepIndex, double ReadingG)> readings)
    {
        var prepared = Formulation.Prepare(RecipeMapping.ToChemistry(batch.Recipe), BuiltInReagents.CreateCatalog());
        var massesG = new double[prepared.Lines.Count];
        foreach (var step in batch.Steps)
        {
            massesG[step.ComponentIndex] += step.TargetMassG;
        }

        var request = Planner.Request(batch.Balance, batch.Pipette, batch.Air);
        var plan = PlanBuilder.Build(prepared.WithMasses(massesG), request);
        return AsMadeCalculator.Compute(plan, [.. readings.Select(r => new RecordedReading(r.StepIndex, r.ReadingG))], request.Options).Composition;
    }
}

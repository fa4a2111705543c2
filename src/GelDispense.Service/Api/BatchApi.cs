using System.Text;
using GelDispense.Contracts.V1;
using GelDispense.Service.Batches;
using Google.Api;
using Google.Protobuf;
using Grpc.Core;
using GelDispense.Service.Security;
using Microsoft.AspNetCore.Authorization;

namespace GelDispense.Service.Api;

/// <summary>Batches at stations: create, read, additions and their corrections, as-made, plan revisions, complete/abort, the LIMS list, CSV export, the live watch stream and the audit check.</summary>
public sealed class BatchApi(
    Planner planner, BatchLedger ledger, AdditionRecorder additions, AdditionCorrector corrections, PlanHistory plans, AuditVerifier audit,
    BatchEventSignal signal, RequestLog log)
    : BatchService.BatchServiceBase
{
    /// <summary>How often a watcher re-reads the event log for events written by other replicas.</summary>
    public static readonly TimeSpan WatchPollInterval = TimeSpan.FromSeconds(1);

    [Authorize(Policy = Policies.RunBatches)]
    public override async Task<Batch> CreateBatch(CreateBatchRequest request, ServerCallContext context)
    {
        log.Station(request.StationId);
        var caller = Caller.From(context.GetHttpContext().User);
        caller.RequireStation(request.StationId.Trim(), "stationId");
        var plan = await planner.PlanAsync(request.Recipe, request.Balance, request.Pipette, request.Air, request.Options, context.CancellationToken);
        var batch = await ledger.CreateAsync(request, plan, caller, context.CancellationToken);
        log.Batch(batch.Id);
        return batch;
    }

    [Authorize(Policy = Policies.Read)]
    public override async Task<Batch> GetBatch(GetBatchRequest request, ServerCallContext context)
    {
        log.Batch(request.Id);
        var batch = await ledger.GetAsync(request.Id, context.CancellationToken);
        Caller.From(context.GetHttpContext().User).RequireStation(batch.StationId, "id");
        return batch;
    }

    [Authorize(Policy = Policies.RunBatches)]
    public override Task<RecordAdditionResponse> RecordAddition(RecordAdditionRequest request, ServerCallContext context)
    {
        log.Batch(request.BatchId);
        return additions.RecordAsync(request, Caller.From(context.GetHttpContext().User), context.CancellationToken);
    }

    [Authorize(Policy = Policies.CorrectAdditions)]
    public override Task<CorrectAdditionResponse> CorrectAddition(CorrectAdditionRequest request, ServerCallContext context)
    {
        log.Batch(request.BatchId);
        return corrections.CorrectAsync(request, Caller.From(context.GetHttpContext().User), context.CancellationToken);
    }

    [Authorize(Policy = Policies.Read)]
    public override async Task<AsMade> GetAsMade(GetAsMadeRequest request, ServerCallContext context)
    {
        log.Batch(request.BatchId);
        await RequireOwnBatchAsync(request.BatchId, "batchId", context);
        return await additions.AsMadeAsync(request.BatchId, context.CancellationToken);
    }

    [Authorize(Policy = Policies.Read)]
    public override Task<PlanRevision> GetPlanRevision(GetPlanRevisionRequest request, ServerCallContext context)
    {
        log.Batch(request.BatchId);
        return plans.GetAsync(request.BatchId, request.Revision, Caller.From(context.GetHttpContext().User), context.CancellationToken);
    }

    [Authorize(Policy = Policies.RunBatches)]
    public override async Task<Batch> CompleteBatch(CompleteBatchRequest request, ServerCallContext context)
    {
        log.Batch(request.Id);
        await RequireOwnBatchAsync(request.Id, "id", context);
        return await ledger.CloseAsync(request.Id, BatchStatus.Completed, "", Caller.From(context.GetHttpContext().User), context.CancellationToken);
    }

    [Authorize(Policy = Policies.RunBatches)]
    public override async Task<Batch> AbortBatch(AbortBatchRequest request, ServerCallContext context)
    {
        log.Batch(request.Id);
        await RequireOwnBatchAsync(request.Id, "id", context);
        return await ledger.CloseAsync(request.Id, BatchStatus.Aborted, request.Reason, Caller.From(context.GetHttpContext().User), context.CancellationToken);
    }

    [Authorize(Policy = Policies.Read)]
    public override Task<ListBatchesResponse> ListBatches(ListBatchesRequest request, ServerCallContext context)
    {
        request.StationId = StationInScope(request.StationId, context);
        return ledger.ListAsync(request, context.CancellationToken);
    }

    [Authorize(Policy = Policies.Read)]
    public override async Task<HttpBody> ExportAdditionsCsv(ExportAdditionsCsvRequest request, ServerCallContext context)
    {
        var csv = new StringBuilder(AdditionsCsv.Header).Append("\r\n");
        if (request.BatchId.Length > 0)
        {
            log.Batch(request.BatchId);
            var batch = await ledger.GetAsync(request.BatchId, context.CancellationToken);
            Caller.From(context.GetHttpContext().User).RequireStation(batch.StationId, "batchId");
            AdditionsCsv.AppendRows(csv, batch);
        }
        else
        {
            var page = new ListBatchesRequest { UpdatedAfter = request.UpdatedAfter, StationId = StationInScope(request.StationId, context), PageSize = BatchLedger.MaxPageSize };
            ListBatchesResponse response;
            do
            {
                response = await ledger.ListAsync(page, context.CancellationToken);
                foreach (var batch in response.Batches)
                {
                    AdditionsCsv.AppendRows(csv, batch);
                }

                page.PageToken = response.NextPageToken;
            }
            while (response.HasMore);
        }

        return new HttpBody { ContentType = "text/csv; charset=utf-8", Data = ByteString.CopyFromUtf8(csv.ToString()) };
    }

    [Authorize(Policy = Policies.Read)]
    public override async Task WatchBatch(WatchBatchRequest request, IServerStreamWriter<BatchEvent> responseStream, ServerCallContext context)
    {
        log.Batch(request.BatchId);
        var found = await ledger.FindAsync(request.BatchId, "batchId", context.CancellationToken);
        Caller.From(context.GetHttpContext().User).RequireStation(found.StationId, "batchId");
        var batchId = found.Id;
        var after = request.AfterSequence;
        while (!context.CancellationToken.IsCancellationRequested)
        {
            foreach (var batchEvent in await ledger.EventsAsync(batchId, after, context.CancellationToken))
            {
                await responseStream.WriteAsync(batchEvent, context.CancellationToken);
                after = batchEvent.Sequence;
                if (batchEvent.Type is BatchEventType.Completed or BatchEventType.Aborted)
                {
                    return;
                }
            }

            await signal.WaitAsync(batchId, WatchPollInterval, context.CancellationToken);
        }
    }

    [Authorize(Policy = Policies.ReadAudit)]
    public override Task<VerifyBatchAuditResponse> VerifyBatchAudit(VerifyBatchAuditRequest request, ServerCallContext context)
    {
        log.Batch(request.BatchId);
        return audit.VerifyAsync(request.BatchId, context.CancellationToken);
    }

    /// <summary>A station caller may act on and read only its own station's batches; others skip the extra read.</summary>
    private async Task RequireOwnBatchAsync(string batchId, string field, ServerCallContext context)
    {
        var caller = Caller.From(context.GetHttpContext().User);
        if (caller.OwnStationId is not null)
        {
            caller.RequireStation((await ledger.FindAsync(batchId, field, context.CancellationToken)).StationId, field);
        }
    }

    /// <summary>The station filter of a list: a station caller sees its own station only, whether or not it asked.</summary>
    private static string StationInScope(string requested, ServerCallContext context)
    {
        var caller = Caller.From(context.GetHttpContext().User);
        if (caller.OwnStationId is not { } own)
        {
            return requested;
        }

        caller.RequireStation(requested.Length == 0 ? own : requested.Trim(), "stationId");
        return own;
    }
}

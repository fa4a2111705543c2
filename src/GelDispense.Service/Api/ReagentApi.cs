using System.Globalization;
using System.Text.RegularExpressions;
using GelDispense.Chemistry.Errors;
using GelDispense.Chemistry.Reagents;
using GelDispense.Contracts.V1;
using GelDispense.Service.Errors;
using GelDispense.Service.Mapping;
using GelDispense.Service.Storage;
using Google.Protobuf;
using Grpc.Core;
using GelDispense.Service.Security;
using Microsoft.AspNetCore.Authorization;

namespace GelDispense.Service.Api;

/// <summary>The reagent catalog routes: built-in reagents, custom reagents and their lots.</summary>
public sealed partial class ReagentApi(ReagentDirectory directory, ReagentStore store, TimeProvider time) : ReagentService.ReagentServiceBase
{
    [GeneratedRegex("^[a-z0-9][a-z0-9-]{0,63}$")]
    private static partial Regex IdPattern();

    [Authorize(Policy = Policies.Read)]
    public override async Task<ListReagentsResponse> ListReagents(ListReagentsRequest request, ServerCallContext context)
    {
        var response = new ListReagentsResponse();
        response.Reagents.AddRange(directory.BuiltIn.Select(r => ReagentMapping.ToContract(r, builtIn: true)));
        var custom = await directory.CustomAsync(context.CancellationToken);
        response.Reagents.AddRange(custom.Select(r => ReagentMapping.ToContract(r, builtIn: false)));
        return response;
    }

    [Authorize(Policy = Policies.Read)]
    public override async Task<Contracts.V1.Reagent> GetReagent(GetReagentRequest request, ServerCallContext context)
    {
        var reagent = await directory.FindAsync(request.Id, context.CancellationToken)
            ?? throw ApiException.NotFound("id", request.Id, "reagent");
        return ReagentMapping.ToContract(reagent, directory.IsBuiltIn(reagent.Id));
    }

    [Authorize(Policy = Policies.WriteCatalog)]
    public override async Task<Contracts.V1.Reagent> CreateReagent(CreateReagentRequest request, ServerCallContext context)
    {
        var submitted = request.Reagent ?? throw new InvalidInputException("reagent", "", "a reagent is required");
        var id = submitted.Id.Trim().ToLowerInvariant();
        if (!IdPattern().IsMatch(id))
        {
            throw new InvalidInputException("reagent.id", RecipeMapping.Clip(submitted.Id), "an id is 1 to 64 lower-case letters, digits and dashes, starting with a letter or digit");
        }

        if (directory.IsBuiltIn(id))
        {
            throw ApiException.AlreadyExists("reagent.id", id, "a built-in reagent has this id");
        }

        var errors = new List<InputError>();
        var reagent = ReagentMapping.ToChemistry(submitted, "reagent", errors)! with { Id = id };
        if (errors.Count > 0)
        {
            throw new InvalidInputException(errors);
        }

        PreparedReagent.Prepare(reagent, "reagent");
        var stored = ReagentMapping.ToContract(reagent, builtIn: false);
        if (!await store.TryAddReagentAsync(id, JsonFormatter.Default.Format(stored), time.GetUtcNow(), context.CancellationToken))
        {
            throw ApiException.AlreadyExists("reagent.id", id, "a reagent with this id exists");
        }

        return stored;
    }

    [Authorize(Policy = Policies.WriteCatalog)]
    public override async Task<ReagentLot> CreateReagentLot(CreateReagentLotRequest request, ServerCallContext context)
    {
        var reagent = await directory.FindAsync(request.ReagentId, context.CancellationToken)
            ?? throw ApiException.NotFound("reagentId", request.ReagentId, "reagent");
        var lot = request.Lot ?? throw new InvalidInputException("lot", "", "a lot is required");
        var errors = new List<InputError>();
        if (lot.LotId.Trim().Length is 0 or > 64)
        {
            errors.Add(new InputError("lot.lotId", RecipeMapping.Clip(lot.LotId), "a lot id has 1 to 64 characters"));
        }

        if (lot.HasAssayPct && !(double.IsFinite(lot.AssayPct) && lot.AssayPct > 0 && lot.AssayPct <= 100))
        {
            errors.Add(new InputError("lot.assayPct", ReagentMapping.Text(lot.AssayPct), "an assay must be above 0 and at most 100 %"));
        }

        if (!DateOnly.TryParseExact(lot.ExpiresOn, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out _))
        {
            errors.Add(new InputError("lot.expiresOn", RecipeMapping.Clip(lot.ExpiresOn), "an expiry is a calendar date YYYY-MM-DD"));
        }

        if (lot.Note.Length > 500)
        {
            errors.Add(new InputError("lot.note", RecipeMapping.Clip(lot.Note), "a note has at most 500 characters"));
        }

        if (errors.Count > 0)
        {
            throw new InvalidInputException(errors);
        }

        var stored = lot.Clone();
        stored.ReagentId = reagent.Id;
        stored.LotId = lot.LotId.Trim();
        if (!await store.TryAddLotAsync(reagent.Id, stored.LotId, stored.ExpiresOn, JsonFormatter.Default.Format(stored), time.GetUtcNow(), context.CancellationToken))
        {
            throw ApiException.AlreadyExists("lot.lotId", stored.LotId, $"reagent '{reagent.Id}' already has this lot");
        }

        return stored;
    }

    [Authorize(Policy = Policies.Read)]
    public override async Task<ListReagentLotsResponse> ListReagentLots(ListReagentLotsRequest request, ServerCallContext context)
    {
        var reagent = await directory.FindAsync(request.ReagentId, context.CancellationToken)
            ?? throw ApiException.NotFound("reagentId", request.ReagentId, "reagent");
        var response = new ListReagentLotsResponse();
        var bodies = await store.LotBodiesAsync(reagent.Id, context.CancellationToken);
        response.Lots.AddRange(bodies.Select(JsonParser.Default.Parse<ReagentLot>));
        return response;
    }
}

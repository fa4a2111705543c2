using GelDispense.Contracts.V1;
using GelDispense.Service.Errors;
using GelDispense.Service.Security;
using GelDispense.Service.Storage;
using Google.Protobuf.WellKnownTypes;
using Grpc.Core;
using Microsoft.AspNetCore.Authorization;

namespace GelDispense.Service.Api;

/// <summary>POST /v1/api-keys, GET /v1/api-keys, POST /v1/api-keys/{id}:revoke — admin only.</summary>
[Authorize(Policy = Policies.ManageKeys)]
public sealed class ApiKeyApi(ApiKeyIssuer issuer, ApiKeyStore store, TimeProvider time, ILogger<ApiKeyApi> logger) : ApiKeyService.ApiKeyServiceBase
{
    public override async Task<CreateApiKeyResponse> CreateApiKey(CreateApiKeyRequest request, ServerCallContext context)
    {
        var expiresAt = ExpiresAt(request.ExpiresAt);
        var (row, key) = await issuer.IssueAsync(request.Role.Trim().ToLowerInvariant(), request.StationId.Trim(), expiresAt, request.Label, context.CancellationToken);
        logger.LogInformation("Key {KeyId} issued with role {Role} by {Actor}", row.Id, row.Role, GelDispenseClaims.Actor(context.GetHttpContext().User));
        return new CreateApiKeyResponse { ApiKey = ToContract(row), Key = key };
    }

    public override async Task<ListApiKeysResponse> ListApiKeys(ListApiKeysRequest request, ServerCallContext context)
    {
        var response = new ListApiKeysResponse();
        response.ApiKeys.AddRange((await store.ListAsync(context.CancellationToken)).Select(ToContract));
        return response;
    }

    public override async Task<Contracts.V1.ApiKey> RevokeApiKey(RevokeApiKeyRequest request, ServerCallContext context)
    {
        _ = await store.FindAsync(request.Id, context.CancellationToken) ?? throw ApiException.NotFound("id", request.Id, "API key");
        await store.RevokeAsync(request.Id, time.GetUtcNow(), context.CancellationToken);
        logger.LogInformation("Key {KeyId} revoked by {Actor}", request.Id, GelDispenseClaims.Actor(context.GetHttpContext().User));
        return ToContract((await store.FindAsync(request.Id, context.CancellationToken))!);
    }

    private static DateTimeOffset? ExpiresAt(Timestamp? expiresAt)
    {
        try
        {
            return expiresAt?.ToDateTimeOffset();
        }
        catch (InvalidOperationException)
        {
            throw new Chemistry.Errors.InvalidInputException("expiresAt", expiresAt!.ToString(), "not a valid instant (years 0001 to 9999, nanos 0 to 999999999)");
        }
    }

    private static Contracts.V1.ApiKey ToContract(ApiKeyRow row) => new()
    {
        Id = row.Id,
        Prefix = row.Prefix,
        Role = row.Role,
        StationId = row.StationId,
        Label = row.Label,
        CreatedAt = Timestamp.FromDateTimeOffset(TimeText.Parse(row.CreatedAt)),
        ExpiresAt = row.ExpiresAt is null ? null : Timestamp.FromDateTimeOffset(TimeText.Parse(row.ExpiresAt)),
        RevokedAt = row.RevokedAt is null ? null : Timestamp.FromDateTimeOffset(TimeText.Parse(row.RevokedAt)),
    };
}

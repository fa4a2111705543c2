using GelDispense.Contracts.V1;
using Grpc.Core;
using Microsoft.AspNetCore.Authorization;

namespace GelDispense.Service.Api;

/// <summary>POST /v1/ping — answers at once without storage or chemistry: a latency probe and the load harness's baseline.</summary>
[AllowAnonymous]
public sealed class ProbeApi : ProbeService.ProbeServiceBase
{
    private static readonly Task<PingResponse> Answer = Task.FromResult(new PingResponse());

    public override Task<PingResponse> Ping(PingRequest request, ServerCallContext context) => Answer;
}

using GelDispense.Contracts.V1;
using Grpc.Core;
using GelDispense.Service.Security;
using Microsoft.AspNetCore.Authorization;

namespace GelDispense.Service.Api;

/// <summary>POST /v1/plans — a dispensing plan without starting a batch.</summary>
[Authorize(Policy = Policies.Design)]
public sealed class PlanApi(Planner planner) : PlanService.PlanServiceBase
{
    public override Task<DispensingPlan> CreatePlan(CreatePlanRequest request, ServerCallContext context) =>
        planner.AnswerAsync(request.Recipe, request.Balance, request.Pipette, request.Air, request.Options, context.CancellationToken);
}

using GelDispense.Contracts.V1;

namespace GelDispense.Service.Batches;

/// <summary>
/// What the next addition to a batch is judged against: the batch's fixed basis and one stored plan revision
/// (0 is the first plan), with that revision's batch factor relative to the first plan.
/// </summary>
public sealed record PlanInForce(BatchBasis Basis, long Revision, DispensingPlan Plan, double ScaleFactor);

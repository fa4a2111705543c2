using Chem = GelDispense.Chemistry.Planning;
using Contract = GelDispense.Contracts.V1;

namespace GelDispense.Service.Mapping;

/// <summary>The planner's <see cref="Chem.DispensingPlan"/> as the contract's DispensingPlan message.</summary>
public static class PlanMapping
{
    public static Contract.DispensingPlan ToContract(Chem.DispensingPlan plan, Contract.BatchScale? requestedScale)
    {
        var contract = new Contract.DispensingPlan
        {
            Predicted = CompositionMapping.ToContract(plan.Predicted),
            Feasible = plan.Feasible,
        };
        contract.Steps.AddRange(plan.Steps.Select(ToContract));
        contract.Warnings.AddRange(plan.Warnings);
        if (plan.MinimumBatchScale is { } factor)
        {
            contract.MinimumBatchScale = Scaled(requestedScale, factor, plan.Predicted.GelVolumeMl);
        }

        return contract;
    }

    private static Contract.PlanStep ToContract(Chem.PlanStep step)
    {
        var contract = new Contract.PlanStep
        {
            Index = step.Index,
            ComponentIndex = step.ComponentIndex,
            ReagentId = step.ReagentId,
            Stage = step.Stage,
            Method = step.Method == Chem.DispensingMethod.Pipette ? Contract.DispensingMethod.Pipette : Contract.DispensingMethod.Balance,
            TargetMassG = step.TargetMassG,
            ToleranceG = step.ToleranceG,
            AcceptanceG = step.AcceptanceG,
            Done = step.Done,
            TargetReadingG = step.TargetReadingG,
            CumulativeReadingG = step.CumulativeReadingG,
            Feasible = step.Feasible,
            InfeasibleReason = step.Problem ?? "",
        };
        if (step.Method == Chem.DispensingMethod.Pipette)
        {
            contract.TargetVolumeMl = step.TargetVolumeMl;
        }

        contract.Cautions.AddRange(step.Cautions);
        return contract;
    }

    /// <summary>
    /// The planner gives a factor on the batch as requested; every amount scales with it, so the requested
    /// quantity does too. A recipe without a scale is expressed by its gel volume.
    /// </summary>
    private static Contract.BatchScale Scaled(Contract.BatchScale? requested, double factor, double gelVolumeMl) => requested?.SizeCase switch
    {
        Contract.BatchScale.SizeOneofCase.PrecursorMol => new Contract.BatchScale { PrecursorMol = requested.PrecursorMol * factor },
        Contract.BatchScale.SizeOneofCase.OxideMassG => new Contract.BatchScale { OxideMassG = requested.OxideMassG * factor },
        Contract.BatchScale.SizeOneofCase.GelVolumeMl => new Contract.BatchScale { GelVolumeMl = requested.GelVolumeMl * factor },
        _ => new Contract.BatchScale { GelVolumeMl = gelVolumeMl * factor },
    };
}

namespace GelDispense.Service.Storage;

/// <summary>A batch's changing columns, its additions so far in the order they were accepted, and their corrections in event order.</summary>
public sealed record BatchProgress(BatchHead Head, IReadOnlyList<AdditionRow> Additions, IReadOnlyList<CorrectionRow> Corrections);

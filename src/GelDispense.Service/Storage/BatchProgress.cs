namespace GelDispense.Service.Storage;

/// <summary>A batch's changing columns and its additions so far, in the order they were accepted.</summary>
public sealed record BatchProgress(BatchHead Head, IReadOnlyList<AdditionRow> Additions);

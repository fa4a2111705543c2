namespace GelDispense.Benchmarks.Service;

/// <summary>The seeded batches in event order: each one's last event sequence and last change time (stored text).</summary>
public sealed record SeededHistory(IReadOnlyList<(long LastEventSeq, string UpdatedAt)> Batches);

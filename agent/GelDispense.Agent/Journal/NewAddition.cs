namespace GelDispense.Agent.Journal;

/// <summary>
/// An addition confirmed at the station, before it is journaled. <see cref="AdditionId"/> is made once, at
/// confirmation, and travels unchanged through every retry and replay: it is the service's idempotency key.
/// <see cref="ReadingG"/> is the net balance reading (conventional mass) exactly as it will be sent.
/// </summary>
public sealed record NewAddition(Guid AdditionId, string BatchId, int StepIndex, double ReadingG, string Source, string LotId);

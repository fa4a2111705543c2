using GelDispense.Contracts.V1;

namespace GelDispense.Agent.Journal;

/// <summary>What became of one journaled addition in a flush: acknowledged with the service's answer, or refused.</summary>
public sealed record Delivery(JournalEntry Entry, RecordAdditionResponse? Response, string? RefusedBecause)
{
    public bool Acknowledged => Response is not null;
}

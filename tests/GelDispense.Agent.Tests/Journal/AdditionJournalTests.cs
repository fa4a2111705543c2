using GelDispense.Agent.Journal;
using GelDispense.Agent.Tests.Support;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Time.Testing;

namespace GelDispense.Agent.Tests.Journal;

public sealed class AdditionJournalTests : TempDirectoryTest
{
    private readonly FakeTimeProvider _time = new(new DateTimeOffset(2025, 3, 4, 9, 30, 0, TimeSpan.Zero));

    private string JournalFile => Path.Combine(Dir, "station", "journal.db");

    private static NewAddition Addition(int step, double readingG, string batch = "b-1") => new(Guid.NewGuid(), batch, step, readingG, "balance", $"LOT-{step}");

    [Fact]
    public void A_confirmed_addition_is_stored_as_pending_in_confirmation_order()
    {
        using var journal = AdditionJournal.Open(JournalFile, _time);

        var first = journal.AppendPending(Addition(0, 39.06));
        _time.Advance(TimeSpan.FromSeconds(5));
        var second = journal.AppendPending(Addition(1, 4.51));

        Assert.True(second.Sequence > first.Sequence);
        Assert.Equal([first.AdditionId, second.AdditionId], journal.Pending().Select(e => e.AdditionId));
        Assert.All(journal.Pending(), e => Assert.Equal(JournalState.Pending, e.State));
        Assert.Equal(_time.GetUtcNow(), journal.Pending()[1].ConfirmedAt);
    }

    [Fact]
    public void Entries_survive_closing_and_reopening_the_file_as_after_a_restart()
    {
        JournalEntry kept;
        using (var journal = AdditionJournal.Open(JournalFile, _time))
        {
            kept = journal.AppendPending(Addition(2, 71.0123456789));
            journal.MarkSent(journal.AppendPending(Addition(3, 11.2)).AdditionId, "recorded");
        }

        using var reopened = AdditionJournal.Open(JournalFile, _time);

        var pending = Assert.Single(reopened.Pending());
        Assert.Equal(kept, pending);
        Assert.Equal(2, reopened.ForBatch("b-1").Count);
    }

    [Fact]
    public void A_reading_comes_back_bit_for_bit_so_a_replay_carries_the_same_content()
    {
        const double reading = 0.1 + 0.2;
        using var journal = AdditionJournal.Open(JournalFile, _time);
        journal.AppendPending(Addition(0, reading));

        Assert.Equal(BitConverter.DoubleToInt64Bits(reading), BitConverter.DoubleToInt64Bits(journal.Pending()[0].ReadingG));
    }

    [Fact]
    public void Sent_and_rejected_entries_leave_the_replay_queue_but_stay_in_the_batch_record()
    {
        using var journal = AdditionJournal.Open(JournalFile, _time);
        var sent = journal.AppendPending(Addition(0, 1));
        var refused = journal.AppendPending(Addition(1, 2));
        var waiting = journal.AppendPending(Addition(2, 3));

        journal.MarkSent(sent.AdditionId, "recorded");
        journal.MarkRejected(refused.AdditionId, "FailedPrecondition: batch completed");

        Assert.Equal([waiting.AdditionId], journal.Pending().Select(e => e.AdditionId));
        var record = journal.ForBatch("b-1");
        Assert.Equal([JournalState.Sent, JournalState.Rejected, JournalState.Pending], record.Select(e => e.State));
        Assert.Equal("FailedPrecondition: batch completed", record[1].Detail);
    }

    [Fact]
    public void The_same_addition_id_cannot_be_journaled_twice()
    {
        using var journal = AdditionJournal.Open(JournalFile, _time);
        var addition = Addition(0, 1);
        journal.AppendPending(addition);

        Assert.Throws<SqliteException>(() => journal.AppendPending(addition));
        Assert.Single(journal.Pending());
    }

    [Fact]
    public void The_file_is_in_write_ahead_log_mode()
    {
        using var journal = AdditionJournal.Open(JournalFile, _time);
        journal.AppendPending(Addition(0, 1));

        using var other = new SqliteConnection($"Data Source={JournalFile};Pooling=False");
        other.Open();
        using var command = other.CreateCommand();
        command.CommandText = "PRAGMA journal_mode";
        Assert.Equal("wal", command.ExecuteScalar());
    }

    [Fact]
    public void A_batch_copy_is_kept_for_resuming_without_the_service()
    {
        using (var journal = AdditionJournal.Open(JournalFile, _time))
        {
            journal.SaveBatch("b-1", """{"id":"b-1"}""");
            journal.SaveBatch("b-1", """{"id":"b-1","planRevision":1}""");
        }

        using var reopened = AdditionJournal.Open(JournalFile, _time);
        Assert.Equal("""{"id":"b-1","planRevision":1}""", reopened.LoadBatch("b-1"));
        Assert.Null(reopened.LoadBatch("b-2"));
    }
}

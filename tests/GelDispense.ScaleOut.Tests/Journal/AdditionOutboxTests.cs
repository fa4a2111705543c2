using GelDispense.Agent.Configuration;
using GelDispense.Agent.Journal;
using GelDispense.Agent.Service;
using GelDispense.ScaleOut.Tests.ScaleOut;
using GelDispense.ScaleOut.Tests.Support;
using Microsoft.Data.Sqlite;

namespace GelDispense.ScaleOut.Tests.Journal;

/// <summary>
/// The station's journal and outbox against two replicas while their PostgreSQL goes down mid-batch and comes back:
/// both replicas answer UNAVAILABLE meanwhile, the additions wait in the journal, and every one is recorded once.
/// </summary>
[Collection(ScaleOutCollection.Name)]
public sealed class AdditionOutboxTests(PostgresCluster cluster) : IDisposable
{
    private const int Additions = 10;

    // A directory of its own: the journal's SQLite file has companions (-wal, -shm) that must go with it.
    private readonly string _journalDirectory = Directory.CreateTempSubdirectory("geldispense-journal-").FullName;

    private string JournalFile => Path.Combine(_journalDirectory, "journal.db");

    [Fact]
    public async Task Additions_made_while_the_database_is_down_wait_in_the_journal_and_are_recorded_once_when_it_returns()
    {
        await using var pair = await ReplicaPair.StartAsync(cluster.Server, "scaleout_database_down");
        var config = new StationConfig { ServiceAddress = pair.A.Grpc.ToString(), StandbyAddresses = [pair.B.Grpc.ToString()], ApiKey = pair.AdminKey };
        using var connection = ServiceConnection.Open(config, QuickLink.Settings, TimeProvider.System);
        var batch = await connection.Link.CreateBatchAsync(TwoReplicasTests.DemoRequest(), default);
        var planned = PlannedAddition.Split(batch, Additions, "down");
        var ids = planned.Select(_ => Guid.CreateVersion7()).ToArray();
        using var journal = AdditionJournal.Open(JournalFile, TimeProvider.System);
        var outbox = new AdditionOutbox(journal, connection.Link);
        void Journal(int k) => outbox.Journal(new NewAddition(ids[k], batch.Id, planned[k].StepIndex, planned[k].ReadingG, "balance", planned[k].LotId));

        for (var k = 0; k < Additions / 2; k++)
        {
            Journal(k);
        }

        Assert.True((await outbox.FlushAsync(default)).Complete);
        FlushReport whileDown;
        await cluster.Server.PauseAsync();
        try
        {
            for (var k = Additions / 2; k < Additions; k++)
            {
                Journal(k);
            }

            whileDown = await outbox.FlushAsync(default);
        }
        finally
        {
            await cluster.Server.ResumeAsync();
        }

        // The replicas' pools still hold connections the restart ended; each fails once, so a flush may need a retry.
        var afterwards = await outbox.FlushAsync(default);
        var flushes = 1;
        while (!afterwards.Complete && flushes < 20)
        {
            await Task.Delay(250);
            afterwards = await outbox.FlushAsync(default);
            flushes++;
        }

        Console.WriteLine($"database down: {whileDown.StillPending} additions waited; {flushes} flush(es) after it returned ({whileDown.StoppedBecause})");
        Assert.False(whileDown.Complete);
        Assert.Equal(Additions / 2, whileDown.StillPending);
        Assert.Contains("Unavailable", whileDown.StoppedBecause, StringComparison.Ordinal);
        Assert.True(afterwards.Complete, afterwards.StoppedBecause);
        Assert.Empty(journal.Pending());
        var recorded = await connection.Link.GetBatchAsync(batch.Id, default);
        Assert.Equal(ids.Select(id => id.ToString()), recorded.Additions.Select(a => a.AdditionId));
    }

    public void Dispose()
    {
        SqliteConnection.ClearAllPools();
        Directory.Delete(_journalDirectory, recursive: true);
    }
}

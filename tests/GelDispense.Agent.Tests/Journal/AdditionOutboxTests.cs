using GelDispense.Agent.Demo;
using GelDispense.Agent.Hosting;
using GelDispense.Agent.Journal;
using GelDispense.Agent.Service;
using GelDispense.Agent.Tests.Support;
using GelDispense.Contracts.V1;
using GelDispense.Service.Security;
using Grpc.Core;
using Grpc.Core.Interceptors;
using Grpc.Net.Client;
using Microsoft.Data.Sqlite;

namespace GelDispense.Agent.Tests.Journal;

/// <summary>The outbox against the real service on loopback HTTP/2 and a real journal file.</summary>
[Collection(StationCollection.Name)]
public sealed class AdditionOutboxTests : TempDirectoryTest
{
    private string JournalFile => Path.Combine(Dir, "station", "journal.db");

    private string DatabaseFile => Path.Combine(Dir, "service", "geldispense.db");

    [Fact]
    public async Task An_addition_is_already_pending_in_the_journal_file_when_its_call_leaves_the_station()
    {
        var spy = new JournalSpy(JournalFile);
        await using var bench = await ServiceBench.StartAsync(DatabaseFile, spy);
        using var journal = AdditionJournal.Open(JournalFile, TimeProvider.System);

        var entry = journal.AppendPending(bench.Addition(0));
        var report = await new AdditionOutbox(journal, bench.Link).FlushAsync(default);

        Assert.True(report.Complete);
        Assert.Equal([(entry.AdditionId, "Pending")], spy.SeenAtSend);
        Assert.Equal(JournalState.Sent, journal.ForBatch(bench.Batch.Id).Single().State);
    }

    [Fact]
    public async Task Pending_entries_are_replayed_in_journal_order_and_recorded_once_however_often_the_journal_is_flushed()
    {
        await using var bench = await ServiceBench.StartAsync(DatabaseFile);
        using var journal = AdditionJournal.Open(JournalFile, TimeProvider.System);
        var ids = Enumerable.Range(0, 3).Select(step => journal.AppendPending(bench.Addition(step)).AdditionId).ToList();
        var outbox = new AdditionOutbox(journal, bench.Link);

        var first = await outbox.FlushAsync(default);
        var second = await outbox.FlushAsync(default);

        Assert.Equal(ids, first.Deliveries.Select(d => d.Entry.AdditionId));
        Assert.Empty(second.Deliveries);
        Assert.Equal(ids, (await bench.Link.GetBatchAsync(bench.Batch.Id, default)).Additions.Select(a => a.AdditionId));
    }

    [Fact]
    public async Task An_addition_whose_reply_was_lost_is_answered_as_a_replay_and_recorded_once()
    {
        await using var bench = await ServiceBench.StartAsync(DatabaseFile);
        using var journal = AdditionJournal.Open(JournalFile, TimeProvider.System);
        var entry = journal.AppendPending(bench.Addition(0));

        // The service got it, but the station never saw the answer (the entry is still pending here).
        var firstAnswer = await bench.Link.RecordAdditionAsync(entry.ToRequest(), default);
        var report = await new AdditionOutbox(journal, bench.Link).FlushAsync(default);

        var delivery = Assert.Single(report.Deliveries);
        Assert.True(delivery.Response!.Replayed);
        Assert.Equal(firstAnswer.Addition.TrueMassG, delivery.Response.Addition.TrueMassG);
        Assert.Single((await bench.Link.GetBatchAsync(bench.Batch.Id, default)).Additions);
        Assert.Equal("already recorded (replay)", journal.ForBatch(bench.Batch.Id).Single().Detail);
    }

    [Fact]
    public async Task Entries_journaled_while_the_service_is_down_survive_an_agent_restart_and_are_recorded_once_when_it_returns()
    {
        var bench = await ServiceBench.StartAsync(DatabaseFile);
        var port = bench.Service.Port;
        List<string> ids;
        await using (bench)
        {
            await bench.Service.DisposeAsync();
            using var journal = AdditionJournal.Open(JournalFile, TimeProvider.System);
            ids = [journal.AppendPending(bench.Addition(0)).AdditionId, journal.AppendPending(bench.Addition(1)).AdditionId];

            var offline = await new AdditionOutbox(journal, bench.Link).FlushAsync(default);

            Assert.False(offline.Complete);
            Assert.Equal(2, offline.StillPending);
            Assert.Equal(ServiceStatus.Offline, bench.Link.Status);
        }

        await using var restarted = await EmbeddedService.StartAsync(DatabaseFile, port);
        using var channel = GrpcChannel.ForAddress(restarted.Address);
        using var reopened = AdditionJournal.Open(JournalFile, TimeProvider.System);
        var link = new ServiceLink(channel.CreateCallInvoker(), "test", StationRig.QuickLink, TimeProvider.System, await restarted.IssueKeyAsync(Roles.Station, DemoScenario.StationId));

        var report = await new AdditionOutbox(reopened, link).FlushAsync(default);

        Assert.True(report.Complete);
        Assert.Empty(reopened.Pending());
        Assert.Equal(ids, (await link.GetBatchAsync(bench.Batch.Id, default)).Additions.Select(a => a.AdditionId));
    }

    [Fact]
    public async Task An_entry_whose_connection_closes_under_its_call_stays_pending_and_is_not_rejected()
    {
        // The agent's own channel, which reports the first such call as Internal too.
        await using var peer = new ClosingHttp2Peer();
        using var channel = ServiceChannel.Create(peer.Address, StationRig.QuickLink);
        using var journal = AdditionJournal.Open(JournalFile, TimeProvider.System);
        var entry = journal.AppendPending(new NewAddition(Guid.CreateVersion7(), "b-closing", 0, 12.5, "balance", "lot-c1"));
        var link = new ServiceLink(channel.CreateCallInvoker(), "closing", StationRig.QuickLink, TimeProvider.System);

        var report = await new AdditionOutbox(journal, link).FlushAsync(default);

        Assert.False(report.Complete);
        Assert.Equal(1, report.StillPending);
        Assert.Equal(entry.AdditionId, Assert.Single(journal.Pending()).AdditionId);
        Assert.True(peer.CallsTaken >= 1);
    }

    [Fact]
    public async Task A_refused_entry_is_kept_as_rejected_with_the_reason_and_does_not_hold_back_later_ones()
    {
        await using var bench = await ServiceBench.StartAsync(DatabaseFile);
        using var journal = AdditionJournal.Open(JournalFile, TimeProvider.System);
        var bad = journal.AppendPending(bench.Addition(0) with { StepIndex = 99 });
        var good = journal.AppendPending(bench.Addition(0));

        var report = await new AdditionOutbox(journal, bench.Link).FlushAsync(default);

        Assert.True(report.Complete);
        var record = journal.ForBatch(bench.Batch.Id);
        Assert.Equal(JournalState.Rejected, record.Single(e => e.AdditionId == bad.AdditionId).State);
        Assert.Contains("stepIndex", record.Single(e => e.AdditionId == bad.AdditionId).Detail, StringComparison.Ordinal);
        Assert.Equal(JournalState.Sent, record.Single(e => e.AdditionId == good.AdditionId).State);
        Assert.Equal([good.AdditionId], (await bench.Link.GetBatchAsync(bench.Batch.Id, default)).Additions.Select(a => a.AdditionId));
    }

    [Fact]
    public async Task Additions_the_service_refuses_for_the_stations_key_stay_pending_for_when_the_key_is_put_right()
    {
        await using var bench = await ServiceBench.StartAsync(DatabaseFile);
        var otherStation = new ServiceLink(bench.Channel.CreateCallInvoker(), "test", StationRig.QuickLink, TimeProvider.System, await bench.Service.IssueKeyAsync(Roles.Station, "south-bench-1"));
        using var journal = AdditionJournal.Open(JournalFile, TimeProvider.System);
        journal.AppendPending(bench.Addition(0));
        journal.AppendPending(bench.Addition(1));

        var report = await new AdditionOutbox(journal, otherStation).FlushAsync(default);

        Assert.False(report.Complete);
        Assert.Contains("refuses this station's key", report.StoppedBecause, StringComparison.Ordinal);
        Assert.Equal(2, report.StillPending);
        Assert.Equal(2, journal.Pending().Count);
    }

    /// <summary>Reads the journal file through a connection of its own at the moment each addition call goes out.</summary>
    private sealed class JournalSpy(string journalFile) : Interceptor
    {
        public List<(string AdditionId, string State)> SeenAtSend { get; } = [];

        public override AsyncUnaryCall<TResponse> AsyncUnaryCall<TRequest, TResponse>(
            TRequest request, ClientInterceptorContext<TRequest, TResponse> context, AsyncUnaryCallContinuation<TRequest, TResponse> continuation)
        {
            if (request is RecordAdditionRequest addition)
            {
                using var connection = new SqliteConnection($"Data Source={journalFile};Mode=ReadOnly;Pooling=False");
                connection.Open();
                using var command = connection.CreateCommand();
                command.CommandText = "SELECT state FROM additions WHERE addition_id = $id";
                command.Parameters.AddWithValue("$id", addition.AdditionId);
                SeenAtSend.Add((addition.AdditionId, command.ExecuteScalar() as string ?? "absent"));
            }

            return continuation(request, context);
        }
    }
}

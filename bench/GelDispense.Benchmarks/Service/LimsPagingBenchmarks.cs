using System.Collections.Concurrent;
using BenchmarkDotNet.Attributes;
using BenchmarkDotNet.Columns;
using BenchmarkDotNet.Configs;
using BenchmarkDotNet.Jobs;
using BenchmarkDotNet.Toolchains.InProcess.Emit;
using GelDispense.Contracts.V1;
using GelDispense.Service.Batches;
using GelDispense.Service.Storage;
using Google.Protobuf.WellKnownTypes;

namespace GelDispense.Benchmarks.Service;

/// <summary>
/// What a LIMS pays for one page of 100 batches (each with its 10 additions) through ListBatches, by a real gRPC
/// call to the service on loopback, with 10,000 and with 1,000,000 additions stored in PostgreSQL. Three pages:
/// the first page of "changed since" the middle of the history (updatedAfter, no token), the page after a token
/// from the middle, and the last page (token 100 batches before the end). Goal: a page at 1M within 20 % of 10k.
/// Runs in this process, so each seeded database is built once and serves all three pages.
/// </summary>
[Config(typeof(PagingConfig))]
public class LimsPagingBenchmarks
{
    public const int PageSize = 100;
    private static readonly ConcurrentDictionary<int, Lazy<Task<LimsHistory>>> Histories = new();
    private LimsHistory _history = null!;
    private ListBatchesRequest _sinceMiddle = null!;
    private ListBatchesRequest _tokenMiddle = null!;
    private ListBatchesRequest _tokenEnd = null!;

    [Params(10_000, 1_000_000)]
    public int Additions { get; set; }

    [GlobalSetup]
    public async Task SetupAsync()
    {
        _history = await Histories.GetOrAdd(Additions, n => new Lazy<Task<LimsHistory>>(() => StartAsync(n))).Value;
        var batches = _history.History.Batches;
        var middle = batches[batches.Count / 2];
        _sinceMiddle = new ListBatchesRequest { UpdatedAfter = Timestamp.FromDateTimeOffset(TimeText.Parse(middle.UpdatedAt)), PageSize = PageSize };
        _tokenMiddle = new ListBatchesRequest { PageToken = PageToken.Encode(middle.LastEventSeq), PageSize = PageSize };
        _tokenEnd = new ListBatchesRequest { PageToken = PageToken.Encode(batches[^(PageSize + 1)].LastEventSeq), PageSize = PageSize };
        Check(await SinceMiddle(), hasMore: true);
        Check(await TokenMiddle(), hasMore: true);
        Check(await TokenEnd(), hasMore: false);

        // The first cases of a process would otherwise also pay for tiering up the JIT of the whole call path
        // (gRPC on both ends, Npgsql, Dapper, the JSON parser), which the 10k cases, run first, would carry alone.
        for (var i = 0; i < 40; i++)
        {
            await SinceMiddle();
            await TokenMiddle();
            await TokenEnd();
        }
    }

    [Benchmark(Description = "first page changed since mid-history (updatedAfter)")]
    public Task<ListBatchesResponse> SinceMiddle() => ListAsync(_sinceMiddle);

    [Benchmark(Description = "page after a mid-history token")]
    public Task<ListBatchesResponse> TokenMiddle() => ListAsync(_tokenMiddle);

    [Benchmark(Description = "last page (token 100 batches before the end)")]
    public Task<ListBatchesResponse> TokenEnd() => ListAsync(_tokenEnd);

    private static async Task<LimsHistory> StartAsync(int additions)
    {
        var history = await LimsHistory.StartAsync(additions);
        AppDomain.CurrentDomain.ProcessExit += (_, _) => history.DisposeAsync().AsTask().GetAwaiter().GetResult();
        return history;
    }

    private async Task<ListBatchesResponse> ListAsync(ListBatchesRequest request) =>
        await _history.Client.ListBatchesAsync(request, _history.Lims);

    /// <summary>A page that is not full of whole batches would make the timing meaningless.</summary>
    private static void Check(ListBatchesResponse page, bool hasMore)
    {
        if (page.Batches.Count != PageSize || page.HasMore != hasMore
            || page.Batches.Any(b => b.Additions.Count != HistorySeeder.AdditionsPerBatch || b.Steps.Count == 0))
        {
            throw new InvalidOperationException($"unexpected page: {page.Batches.Count} batches, hasMore {page.HasMore}, additions per batch {string.Join(",", page.Batches.Select(b => b.Additions.Count).Distinct())}");
        }
    }

    /// <summary>In-process (one seeding per size), 5 warm-ups and 10 measured iterations, with min, median and the ratio to the 10k page.</summary>
    private sealed class PagingConfig : ManualConfig
    {
        public PagingConfig()
        {
            AddJob(Job.Default.WithToolchain(InProcessEmitToolchain.Instance).WithWarmupCount(5).WithIterationCount(10).WithId("InProcess"));
            // On a shared machine the minimum is the figure other work disturbs least.
            AddColumn(StatisticColumn.Min, StatisticColumn.Median, new RatioToSmallestColumn(nameof(Additions)));
        }
    }
}

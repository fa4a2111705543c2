using System.Globalization;
using System.Net;
using Npgsql;

namespace GelDispense.LoadHarness;

/// <summary>
/// What one run does. Every option is bounded so a run stays short and its load small: at most 64 clients or
/// stations, 60 s per scenario (split into interleaved rounds), a capped warm-up and a cap on the requests of each
/// scenario, always against the in-process service and a database on 127.0.0.1. A warm-up pass runs each scenario
/// for <c>Warmup</c>; passes repeat until the JIT has settled or <c>MaxWarmup</c> has run.
/// </summary>
public sealed record HarnessOptions(
    int Clients, TimeSpan Duration, int Rounds, TimeSpan Warmup, TimeSpan MaxWarmup, int MaxRequests, bool Additions, bool AdditionsOnly, bool Ingest,
    int Stations, string? Postgres, string? Only)
{
    public const string Usage =
        "usage: GelDispense.LoadHarness [--clients 1..64 (8)] [--seconds 1..60 (8)] [--rounds 1..20 (4)] [--warmup-seconds 0..10 (2)] [--max-warmup-seconds 0..600 (180)] " +
        "[--max-requests 1..1000000 (500000)] [--only \"text in a scenario's name or protocol\"] [--no-additions | --additions-only | --ingest [--stations 1..64 (50)] " +
        "[--postgres \"Host=127.0.0.1;...\" (default: a throwaway local cluster)]]";

    public static HarnessOptions Parse(IReadOnlyList<string> args)
    {
        var options = new HarnessOptions(8, TimeSpan.FromSeconds(8), 4, TimeSpan.FromSeconds(2), TimeSpan.FromSeconds(180), 500_000, Additions: true, AdditionsOnly: false,
            Ingest: false, Stations: 50, Postgres: null, Only: null);
        for (var i = 0; i < args.Count; i++)
        {
            var name = args[i];
            options = name switch
            {
                "--clients" => options with { Clients = Number(name, Value(args, ref i), 1, 64) },
                "--seconds" => options with { Duration = TimeSpan.FromSeconds(Number(name, Value(args, ref i), 1, 60)) },
                "--rounds" => options with { Rounds = Number(name, Value(args, ref i), 1, 20) },
                "--warmup-seconds" => options with { Warmup = TimeSpan.FromSeconds(Number(name, Value(args, ref i), 0, 10)) },
                "--max-warmup-seconds" => options with { MaxWarmup = TimeSpan.FromSeconds(Number(name, Value(args, ref i), 0, 600)) },
                "--max-requests" => options with { MaxRequests = Number(name, Value(args, ref i), 1, 1_000_000) },
                "--no-additions" => options with { Additions = false, AdditionsOnly = false },
                "--additions-only" => options with { Additions = true, AdditionsOnly = true },
                "--ingest" => options with { Ingest = true },
                "--stations" => options with { Stations = Number(name, Value(args, ref i), 1, 64) },
                "--only" => options with { Only = Value(args, ref i) },
                "--postgres" => options with { Postgres = Loopback(name, Value(args, ref i)) },
                _ => throw new ArgumentException($"{name}: unknown option. {Usage}"),
            };
        }

        return options;
    }

    private static string Value(IReadOnlyList<string> args, ref int i) =>
        ++i < args.Count ? args[i] : throw new ArgumentException($"{args[i - 1]}: a value is required. {Usage}");

    private static int Number(string name, string text, int min, int max) =>
        int.TryParse(text, NumberStyles.None, CultureInfo.InvariantCulture, out var value) && value >= min && value <= max
            ? value
            : throw new ArgumentException($"{name} '{text}': must be a whole number from {min} to {max}.");

    /// <summary>The harness loads nothing but this machine: the connection string must name a loopback host.</summary>
    private static string Loopback(string name, string connectionString)
    {
        string? host;
        try
        {
            host = new NpgsqlConnectionStringBuilder(connectionString).Host;
        }
        catch (ArgumentException e)
        {
            throw new ArgumentException($"{name}: not a PostgreSQL connection string ({e.Message}).");
        }

        return host is "localhost" || (IPAddress.TryParse(host, out var address) && IPAddress.IsLoopback(address))
            ? connectionString
            : throw new ArgumentException($"{name} host '{host}': the harness only loads 127.0.0.1, ::1 or localhost.");
    }
}

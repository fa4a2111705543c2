using System.CommandLine;
using GelDispense.Agent.Sequencing;
using GelDispense.Agent.Station;
using GelDispense.Chemistry.Errors;
using GelDispense.Contracts.V1;

namespace GelDispense.Agent.Commands;

/// <summary>The options of <c>run</c> beyond the balance: what to make, how to confirm, lots, journal, and the balance's
/// figures the service plans with when a new batch is started.</summary>
internal sealed class RunOptions
{
    public Option<FileInfo?> Recipe { get; } = new("--recipe", "-r") { Description = "Start a new batch from this recipe file (JSON, as in POST /v1/batches)" };

    public Option<string?> Batch { get; } = new("--batch", "-b") { Description = "Resume the batch with this id (works offline from the journal's copy)" };

    public Option<string> Confirm { get; } = new("--confirm") { Description = "auto: confirm on a stable reading in or past the window; key: only when you press Enter", DefaultValueFactory = _ => "auto" };

    public Option<string[]> Lot { get; } = new("--lot") { Description = "Lot of a reagent, reagent=lot (repeat for each reagent), e.g. --lot teos=A-117" };

    public Option<FileInfo?> Journal { get; } = new("--journal") { Description = "Journal file (default: geldispense/journal-<station>.db in the local data folder)" };

    public Option<string> BalanceId { get; } = new("--balance-id") { Description = "Asset tag of the balance, for the record", DefaultValueFactory = _ => "balance" };

    public Option<double> CapacityG { get; } = new("--capacity") { Description = "Balance capacity in g (for planning a new batch)", DefaultValueFactory = _ => 220 };

    public Option<double?> RepeatabilityG { get; } = new("--repeatability") { Description = "Balance repeatability s in g, if known (sets the USP <41> minimum weight)" };

    public Option<bool> Plain { get; } = new("--plain") { Description = "Plain log lines even on a terminal" };

    public Option<bool> NoComplete { get; } = new("--no-complete") { Description = "Leave the batch open at the service when every step is made" };

    public void AddTo(Command command)
    {
        foreach (var option in new Option[] { Recipe, Batch, Confirm, Lot, Journal, BalanceId, CapacityG, RepeatabilityG, Plain, NoComplete })
        {
            command.Options.Add(option);
        }
    }

    public BatchStart Start(ParseResult parse, double readabilityG, Configuration.PipetteConfig? pipette, Configuration.VesselConfig? vessel)
    {
        var recipe = parse.GetValue(Recipe);
        var batch = parse.GetValue(Batch);
        if ((recipe is null) == string.IsNullOrWhiteSpace(batch))
        {
            throw new InvalidInputException("--recipe", recipe?.FullName ?? "", "give either --recipe FILE (a new batch) or --batch ID (resume one), not both");
        }

        var balance = new BalanceProfile { Id = parse.GetValue(BalanceId)!, ReadabilityG = readabilityG, CapacityG = parse.GetValue(CapacityG) };
        if (parse.GetValue(RepeatabilityG) is { } s)
        {
            balance.RepeatabilityG = s;
        }

        var pipetteProfile = pipette is null ? null : new PipetteProfile { Id = pipette.Name, NominalVolumeUl = pipette.NominalVolumeUl, MinVolumeUl = pipette.MinVolumeUl };
        return new BatchStart(recipe is null ? null : RecipeFile.Load(recipe.FullName), batch, balance, pipetteProfile, Options: vessel?.ToPlanOptions());
    }

    public ConfirmMode Mode(ParseResult parse) => parse.GetValue(Confirm)?.ToLowerInvariant() switch
    {
        "auto" => ConfirmMode.Auto,
        "key" => ConfirmMode.Key,
        var other => throw new InvalidInputException("--confirm", other ?? "", "use auto or key"),
    };

    public IReadOnlyDictionary<string, string> Lots(ParseResult parse)
    {
        var lots = new Dictionary<string, string>(StringComparer.OrdinalIgnoreCase);
        foreach (var pair in parse.GetValue(Lot) ?? [])
        {
            var equals = pair.IndexOf('=', StringComparison.Ordinal);
            if (equals <= 0 || equals == pair.Length - 1 || pair.Length - equals - 1 > 64)
            {
                throw new InvalidInputException("--lot", pair, "write reagent=lot, e.g. teos=A-117 (a lot has at most 64 characters)");
            }

            lots[pair[..equals].Trim()] = pair[(equals + 1)..].Trim();
        }

        return lots;
    }

    public string JournalPath(ParseResult parse, string stationId) =>
        parse.GetValue(Journal)?.FullName
        ?? Path.Combine(Environment.GetFolderPath(Environment.SpecialFolder.LocalApplicationData, Environment.SpecialFolderOption.Create), "geldispense", $"journal-{stationId}.db");
}

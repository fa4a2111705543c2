using GelDispense.Agent.Formats;
using GelDispense.Agent.Links;
using GelDispense.Agent.Stability;
using GelDispense.Chemistry.Errors;

namespace GelDispense.Agent.Configuration;

/// <summary>
/// A station config checked and turned into working parts: a connector, a compiled line parser, stability
/// settings. <see cref="From"/> reports every problem at once, each with field, value and reason.
/// </summary>
public sealed record BalanceSetup(
    IBalanceConnector Connector,
    LineParser Parser,
    LineEnding CommandEnding,
    ReconnectSettings Reconnect,
    StabilitySettings Stability,
    CommandsConfig Commands,
    double ReadabilityG)
{
    public static BalanceSetup From(StationConfig config)
    {
        var errors = new ErrorList();
        var balance = config.Balance;
        var parser = ResolveFormat(balance, errors);
        var ending = parser?.Format.LineEnding ?? LineEnding.CrLf;
        if (balance.LineEnding is { } text && !LineEndingText.TryParse(text, out ending))
        {
            errors.Add("balance.lineEnding", text, "use crlf, lf or cr");
        }

        var connector = ConnectorChecks.Resolve(balance, errors);
        errors.Require(balance.ReadabilityG is > 0 and <= 1, "balance.readabilityG", balance.ReadabilityG, "must be above 0 and at most 1 g");
        errors.Require(balance.SilenceLimitS is null or > 0, "balance.silenceLimitS", balance.SilenceLimitS, "must be above 0 s when set");
        var stability = StabilityChecks.Resolve(config.Stability, errors);
        StationChecks.Check(config, errors);
        errors.ThrowIfAny();
        var reconnect = new ReconnectSettings { SilenceLimit = balance.SilenceLimitS is { } s ? TimeSpan.FromSeconds(s) : null };
        return new BalanceSetup(connector!, parser!, ending, reconnect, stability, balance.Commands, balance.ReadabilityG);
    }

    public BalanceLink CreateLink(TimeProvider time) =>
        new(Connector, CommandEnding, Parser.Format.MaxLineLength, Reconnect, time);

    private static LineParser? ResolveFormat(BalanceConfig balance, ErrorList errors)
    {
        LineParser? chosen = null;
        var names = new HashSet<string>(StringComparer.OrdinalIgnoreCase);
        for (var i = 0; i < balance.Formats.Count; i++)
        {
            var custom = balance.Formats[i];
            var field = $"balance.formats[{i}]";
            if (BuiltInFormats.Find(custom.Name) is not null || !names.Add(custom.Name))
            {
                errors.Add($"{field}.name", custom.Name, "name already used by a built-in or earlier format");
                continue;
            }

            if (!LineEndingText.TryParse(custom.LineEnding, out var ending))
            {
                errors.Add($"{field}.lineEnding", custom.LineEnding, "use crlf, lf or cr");
            }

            try
            {
                var parser = new LineParser(ToFormat(custom, ending), field);
                chosen = string.Equals(custom.Name, balance.Format, StringComparison.OrdinalIgnoreCase) ? parser : chosen;
            }
            catch (InvalidInputException ex)
            {
                errors.AddAll(ex.Errors);
            }
        }

        if (chosen is null && BuiltInFormats.Find(balance.Format) is { } builtIn)
        {
            chosen = new LineParser(builtIn);
        }

        if (chosen is null && !names.Contains(balance.Format))
        {
            var known = string.Join(", ", BuiltInFormats.All.Select(f => f.Name).Concat(names));
            errors.Add("balance.format", balance.Format, $"unknown format; known: {known}");
        }

        return chosen;
    }

    private static LineFormat ToFormat(FormatConfig c, LineEnding ending) => new()
    {
        Name = c.Name,
        Pattern = c.Pattern,
        StableFlag = c.StableFlag,
        OverloadPattern = c.OverloadPattern,
        UnderloadPattern = c.UnderloadPattern,
        ErrorPattern = c.ErrorPattern,
        DefaultUnit = c.DefaultUnit,
        LineEnding = ending,
        MaxLineLength = c.MaxLineLength,
    };
}

namespace GelDispense.Agent.Formats;

/// <summary>
/// Three generic line formats of our own design, one per common shape of balance output: fixed columns
/// with a stability flag, key=value pairs, and a bare number with no flag (software stability decides).
/// </summary>
public static class BuiltInFormats
{
    /// <summary>
    /// <c>"= +   12.3456 g"</c>: flag ('=' settled, '~' moving), space, sign, value right-aligned in ten
    /// characters, space, unit. Markers: <c>"&gt; OVER"</c>, <c>"&lt; UNDER"</c>, <c>"! E&lt;code&gt;"</c>.
    /// </summary>
    public static LineFormat Column { get; } = new()
    {
        Name = "column",
        Pattern = @"^(?<flag>[=~]) (?<sign>[+-]) *(?<value>\d+(?:\.\d+)?) (?<unit>[A-Za-z]{1,3}) *$",
        StableFlag = "=",
        OverloadPattern = @"^> OVER *$",
        UnderloadPattern = @"^< UNDER *$",
        ErrorPattern = @"^! E\d+ *$",
        Description = "fixed columns: flag (= settled, ~ moving), sign, value, unit",
    };

    /// <summary>
    /// <c>"mass=12.3456,unit=g,steady=1"</c>: comma-separated key=value pairs, mass before unit before steady;
    /// other keys (a sequence number, a temperature) may stand anywhere and are ignored.
    /// Markers: <c>status=over</c>, <c>status=under</c>, <c>status=fault</c>.
    /// </summary>
    public static LineFormat Keyed { get; } = new()
    {
        Name = "keyed",

        // One forward pass: a fixed key order lets the engine skip unknown fields without lookaheads, and the
        // markers start with a literal, which the engine finds with a vectorised search.
        Pattern = @"^(?:[a-z]+=[^,]*,)*?mass=(?<value>[+-]?\d+(?:\.\d+)?),(?:[a-z]+=[^,]*,)*?unit=(?<unit>[A-Za-z]{1,3}),(?:[a-z]+=[^,]*,)*?steady=(?<flag>[01])(?:,[a-z]+=[^,]*)*$",
        StableFlag = "1",
        OverloadPattern = @"(?<![^,])status=over(?![^,])",
        UnderloadPattern = @"(?<![^,])status=under(?![^,])",
        ErrorPattern = @"(?<![^,])status=fault(?![^,])",
        Description = "key=value pairs: mass, unit, steady (1 settled, 0 moving) in that order; status for markers",
    };

    /// <summary>
    /// <c>"12.3456"</c> or <c>"-0.0012"</c>: a bare number in grams with no flag, for balances that only stream
    /// the display. Markers: <c>"OVER"</c>, <c>"UNDER"</c>, <c>"ERR"</c>.
    /// </summary>
    public static LineFormat Bare { get; } = new()
    {
        Name = "bare",
        Pattern = @"^ *(?<value>[+-]?\d+(?:\.\d+)?) *$",
        DefaultUnit = "g",
        OverloadPattern = "^ *OVER *$",
        UnderloadPattern = "^ *UNDER *$",
        ErrorPattern = "^ *ERR",
        LineEnding = LineEnding.Lf,
        Description = "a bare number in grams, no stability flag (software stability decides)",
    };

    public static IReadOnlyList<LineFormat> All { get; } = [Column, Keyed, Bare];

    public static LineFormat? Find(string name) =>
        All.FirstOrDefault(f => string.Equals(f.Name, name, StringComparison.OrdinalIgnoreCase));
}

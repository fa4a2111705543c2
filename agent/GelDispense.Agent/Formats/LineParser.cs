using System.Globalization;
using System.Text.RegularExpressions;
using GelDispense.Chemistry.Errors;

namespace GelDispense.Agent.Formats;

/// <summary>
/// The compiled, pure codec for one <see cref="LineFormat"/>: a line in, a reading or a failure with a reason out.
/// Construction validates the format and names the offending field; parsing never throws.
/// </summary>
public sealed partial class LineParser
{
    // A user pattern with catastrophic backtracking must not freeze the agent on a noisy line. The limit is
    // wall-clock time, so it is generous: a busy machine must not turn a good line into a timeout.
    private static readonly TimeSpan MatchTimeout = TimeSpan.FromSeconds(1);

    private const NumberStyles ValueStyles =
        NumberStyles.AllowLeadingSign | NumberStyles.AllowDecimalPoint |
        NumberStyles.AllowLeadingWhite | NumberStyles.AllowTrailingWhite;

    private readonly Regex _reading;
    private readonly Regex? _overload;
    private readonly Regex? _underload;
    private readonly Regex? _error;
    private readonly Regex? _anyMarker;
    private readonly int _valueGroup;
    private readonly int _signGroup;
    private readonly int _unitGroup;
    private readonly int _flagGroup;

    /// <param name="format">The format to compile.</param>
    /// <param name="fieldPath">Where the format came from (e.g. <c>balance.formats[0]</c>), for error messages.</param>
    public LineParser(LineFormat format, string fieldPath = "format")
    {
        Format = format;
        _reading = Compile(format.Pattern, $"{fieldPath}.pattern")!;
        _overload = Compile(format.OverloadPattern, $"{fieldPath}.overloadPattern");
        _underload = Compile(format.UnderloadPattern, $"{fieldPath}.underloadPattern");
        _error = Compile(format.ErrorPattern, $"{fieldPath}.errorPattern");
        _anyMarker = CombineMarkers(format);
        _valueGroup = _reading.GroupNumberFromName("value");
        _signGroup = _reading.GroupNumberFromName("sign");
        _unitGroup = _reading.GroupNumberFromName("unit");
        _flagGroup = _reading.GroupNumberFromName("flag");
        LineFormatRules.Check(format, fieldPath, hasValue: _valueGroup >= 0, hasUnit: _unitGroup >= 0, hasFlag: _flagGroup >= 0);
    }

    public LineFormat Format { get; }

    /// <summary>True when the format carries the balance's own stability flag.</summary>
    public bool HasStabilityFlag => _flagGroup >= 0;

    public LineParseResult Parse(string line)
    {
        if (line.Length > Format.MaxLineLength)
        {
            return LineParseResult.Fail(ParseFailureReason.TooLong, $"{line.Length} characters, limit {Format.MaxLineLength}", line[..Format.MaxLineLength]);
        }

        try
        {
            // Most lines are readings: one combined check clears all three markers at once.
            if (_anyMarker?.IsMatch(line) == false)
            {
                return ReadingFrom(line);
            }

            if (_overload?.IsMatch(line) == true)
            {
                return LineParseResult.Ok(BalanceReading.Marker(ReadingKind.Overload, line));
            }

            if (_underload?.IsMatch(line) == true)
            {
                return LineParseResult.Ok(BalanceReading.Marker(ReadingKind.Underload, line));
            }

            if (_error?.IsMatch(line) == true)
            {
                return LineParseResult.Ok(BalanceReading.Marker(ReadingKind.Error, line));
            }

            return ReadingFrom(line);
        }
        catch (RegexMatchTimeoutException)
        {
            return LineParseResult.Fail(ParseFailureReason.PatternTimeout, $"pattern of format '{Format.Name}' timed out", line);
        }
    }

    public LineParseResult Parse(SplitLine line)
    {
        if (line.Overlong)
        {
            return LineParseResult.Fail(ParseFailureReason.TooLong, $"line exceeded {Format.MaxLineLength} characters", line.Text);
        }

        return line.NonTextBytes > 0
            ? LineParseResult.Fail(ParseFailureReason.NonText, $"{line.NonTextBytes} non-text byte(s) in line", line.Text)
            : Parse(line.Text);
    }

    private LineParseResult ReadingFrom(string line)
    {
        var match = _reading.Match(line);
        return match.Success
            ? FromMatch(match, line)
            : LineParseResult.Fail(ParseFailureReason.NoMatch, $"does not match format '{Format.Name}'", line);
    }

    private LineParseResult FromMatch(Match match, string line)
    {
        var valueText = match.Groups[_valueGroup].ValueSpan;
        if (!double.TryParse(valueText, ValueStyles, CultureInfo.InvariantCulture, out var value) || !double.IsFinite(value))
        {
            return LineParseResult.Fail(ParseFailureReason.BadNumber, $"value '{valueText}' is not a decimal number", line);
        }

        if (_signGroup >= 0 && match.Groups[_signGroup].ValueSpan is "-")
        {
            value = -value;
        }

        var unit = _unitGroup >= 0 && match.Groups[_unitGroup].Success
            ? match.Groups[_unitGroup].ValueSpan
            : Format.DefaultUnit.AsSpan();
        if (!MassUnits.TryToGrams(value, unit, out var valueG))
        {
            return LineParseResult.Fail(ParseFailureReason.UnknownUnit, $"unit '{unit}' cannot be converted to g", line);
        }

        bool? stable = _flagGroup >= 0
            ? match.Groups[_flagGroup].ValueSpan.Trim().SequenceEqual(Format.StableFlag)
            : null;
        return LineParseResult.Ok(new BalanceReading(valueG, stable, ReadingKind.Weight, line));
    }

    /// <summary>
    /// The marker patterns as one alternation, used only to rule all of them out in one pass. Left out when a
    /// pattern has a backreference, whose group number would shift once the patterns are joined.
    /// </summary>
    private static Regex? CombineMarkers(LineFormat format)
    {
        string[] markers = [.. new[] { format.OverloadPattern, format.UnderloadPattern, format.ErrorPattern }.OfType<string>()];
        if (markers.Length < 2 || markers.Any(m => BackReference().IsMatch(m)))
        {
            return null;
        }

        return new Regex(string.Join('|', markers.Select(m => $"(?:{m})")), RegexOptions.Compiled | RegexOptions.CultureInvariant, MatchTimeout);
    }

    [GeneratedRegex(@"\\(?:[1-9]|k<)")]
    private static partial Regex BackReference();

    private static Regex? Compile(string? pattern, string field)
    {
        if (pattern is null)
        {
            return null;
        }

        try
        {
            return new Regex(pattern, RegexOptions.Compiled | RegexOptions.CultureInvariant, MatchTimeout);
        }
        catch (ArgumentException ex)
        {
            throw new InvalidInputException(field, pattern, $"not a valid regular expression: {ex.Message}");
        }
    }
}

using GelDispense.Agent.Formats;
using GelDispense.Agent.Links;
using GelDispense.Agent.Stability;

namespace GelDispense.Agent.Readings;

/// <summary>One line off the balance with everything known about it: raw text, parse outcome, and, for a
/// reading, the stability verdict (null for a line that did not parse).</summary>
public sealed record ReadingEvent(ReceivedLine Line, LineParseResult Parse, StabilityVerdict? Verdict);

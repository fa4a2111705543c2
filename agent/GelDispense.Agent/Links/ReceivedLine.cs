using GelDispense.Agent.Formats;

namespace GelDispense.Agent.Links;

/// <summary>
/// A line as it came off the link. <see cref="ConnectionEpoch"/> goes up by one on every (re)connection, so
/// a consumer knows to forget its stability window: nothing seen before a hang-up vouches for what comes after.
/// </summary>
public readonly record struct ReceivedLine(SplitLine Line, int ConnectionEpoch, DateTimeOffset ReceivedAt);

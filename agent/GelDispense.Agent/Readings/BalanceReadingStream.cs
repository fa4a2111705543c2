using System.Runtime.CompilerServices;
using GelDispense.Agent.Formats;
using GelDispense.Agent.Links;
using GelDispense.Agent.Stability;

namespace GelDispense.Agent.Readings;

/// <summary>
/// Link → codec → stability, for one consumer. A new connection epoch resets the stability detector, so
/// readings from before a hang-up can never complete a stable window after it. A confirmation must still
/// check that the link is <see cref="LinkStatus.Connected"/> at that moment.
/// </summary>
public sealed class BalanceReadingStream(IBalanceLink link, LineParser parser, StabilityDetector detector)
{
    public ReadingCounters Counters { get; } = new();

    public async IAsyncEnumerable<ReadingEvent> ReadAsync([EnumeratorCancellation] CancellationToken cancellationToken)
    {
        var epoch = 0;
        await foreach (var line in link.ReadLinesAsync(cancellationToken).ConfigureAwait(false))
        {
            if (line.ConnectionEpoch != epoch)
            {
                detector.Reset();
                Counters.Reconnects += epoch == 0 ? 0 : 1;
                epoch = line.ConnectionEpoch;
            }

            Counters.Lines++;
            Counters.NonTextBytes += line.Line.NonTextBytes;
            var parse = parser.Parse(line.Line);
            StabilityVerdict? verdict = null;
            if (parse.Reading is { } reading)
            {
                Counters.Readings++;
                verdict = detector.Add(reading);
            }
            else
            {
                Counters.Garbage++;
            }

            yield return new ReadingEvent(line, parse, verdict);
        }
    }
}

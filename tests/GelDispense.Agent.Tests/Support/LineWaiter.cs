using GelDispense.Agent.Links;

namespace GelDispense.Agent.Tests.Support;

/// <summary>Takes lines from a link with a deadline, so a broken link fails a test instead of hanging it.</summary>
internal static class LineWaiter
{
    public static async Task<List<ReceivedLine>> TakeAsync(IBalanceLink link, int count, double seconds = 10)
    {
        using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(seconds));
        var lines = new List<ReceivedLine>();
        try
        {
            await foreach (var line in link.ReadLinesAsync(timeout.Token))
            {
                lines.Add(line);
                if (lines.Count == count)
                {
                    break;
                }
            }
        }
        catch (OperationCanceledException)
        {
            throw new TimeoutException($"got {lines.Count} of {count} lines in {seconds} s: {string.Join(" | ", lines.Select(l => l.Line.Text))}");
        }

        return lines;
    }
}

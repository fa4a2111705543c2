using GelDispense.Agent.Service;
using Grpc.Core;

namespace GelDispense.Agent.Journal;

/// <summary>
/// Journal first, then the service, always in journal order. <see cref="Journal(NewAddition)"/> makes an addition
/// durable before any send; <see cref="FlushAsync"/> offers every pending entry, oldest first, and stops at the
/// first one the service cannot be reached for (or refuses the station's key for), so a later addition never
/// overtakes an earlier one. Each entry is
/// sent with its own addition id every time; the service records it once and answers repeats with the first
/// result, so a reply lost in transit costs nothing but a repeat. Flushes never overlap.
/// </summary>
public sealed class AdditionOutbox(AdditionJournal journal, ServiceLink service)
{
    private readonly SemaphoreSlim _flushing = new(1, 1);

    public AdditionJournal Store => journal;

    public int PendingCount => journal.Pending().Count;

    public JournalEntry Journal(NewAddition addition) => journal.AppendPending(addition);

    public async Task<FlushReport> FlushAsync(CancellationToken cancellationToken)
    {
        await _flushing.WaitAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            var pending = journal.Pending();
            var deliveries = new List<Delivery>();
            for (var i = 0; i < pending.Count; i++)
            {
                var entry = pending[i];
                try
                {
                    var response = await service.RecordAdditionAsync(entry.ToRequest(), cancellationToken).ConfigureAwait(false);
                    journal.MarkSent(entry.AdditionId, response.Replayed ? "already recorded (replay)" : "recorded");
                    deliveries.Add(new Delivery(entry, response, null));
                }
                catch (Exception ex) when (ServiceFaults.IsUnreachable(ex) && !cancellationToken.IsCancellationRequested)
                {
                    return new FlushReport(deliveries, ServiceFaults.Describe(ex), pending.Count - i);
                }
                catch (RpcException ex) when (ServiceFaults.IsAccessRefused(ex))
                {
                    return new FlushReport(deliveries, $"the service refuses this station's key: {ServiceFaults.Describe(ex)}", pending.Count - i);
                }
                catch (RpcException ex) when (ex.StatusCode != StatusCode.Cancelled)
                {
                    // A refusal will not change on a retry; keep the entry, with the reason, and let the rest through.
                    var reason = ServiceFaults.Describe(ex);
                    journal.MarkRejected(entry.AdditionId, reason);
                    deliveries.Add(new Delivery(entry, null, reason));
                }
            }

            return new FlushReport(deliveries, null, 0);
        }
        finally
        {
            _flushing.Release();
        }
    }
}

using GelDispense.Contracts.V1;
using GelDispense.Service.Errors;
using GelDispense.Service.Storage;

namespace GelDispense.Service.Batches;

/// <summary>
/// Recomputes a batch's hash chain from what is stored now and names the first event that no longer matches: a
/// broken link (its prev_hash is not the hash of the event before it), a missing addition or correction, or content
/// (the event, or the addition or correction it records) changed after it was written.
/// </summary>
public sealed class AuditVerifier(BatchStore store)
{
    public async Task<VerifyBatchAuditResponse> VerifyAsync(string batchId, CancellationToken cancellationToken)
    {
        var batch = await store.FindAsync(batchId, cancellationToken) ?? throw ApiException.NotFound("batchId", batchId, "batch");
        var (events, additions, corrections) = await store.AuditTrailAsync(batch.Id, cancellationToken);
        var prevHash = "";
        for (var index = 0; index < events.Count; index++)
        {
            var entry = events[index];
            if (Fault(entry, prevHash, additions, corrections) is { } reason)
            {
                return new VerifyBatchAuditResponse
                {
                    Ok = false, EventsChecked = index + 1, FirstBrokenSequence = entry.Seq, FirstBrokenIndex = index, Reason = reason,
                };
            }

            prevHash = entry.Hash;
        }

        return new VerifyBatchAuditResponse { Ok = true, EventsChecked = events.Count };
    }

    private static string? Fault(
        EventRow entry, string expectedPrevHash, IReadOnlyDictionary<string, AdditionRow> additions, IReadOnlyDictionary<string, CorrectionRow> corrections)
    {
        if (entry.Hash.Length == 0)
        {
            return $"event {entry.Seq} has no hash (written before the audit trail, or the hash was erased)";
        }

        if (!string.Equals(entry.PrevHash, expectedPrevHash, StringComparison.Ordinal))
        {
            return $"event {entry.Seq}: prev_hash does not equal the hash of the batch's previous event";
        }

        AdditionRow? addition = null;
        if (entry.AdditionId.Length > 0 && !additions.TryGetValue(entry.AdditionId, out addition))
        {
            return $"event {entry.Seq}: addition '{entry.AdditionId}' it records is missing";
        }

        CorrectionRow? correction = null;
        if (entry.CorrectionId.Length > 0 && !corrections.TryGetValue(entry.CorrectionId, out correction))
        {
            return $"event {entry.Seq}: correction '{entry.CorrectionId}' it records is missing";
        }

        var hash = AuditChain.Link(entry.PrevHash, AuditChain.Canonical(entry, addition, correction));
        return string.Equals(hash, entry.Hash, StringComparison.Ordinal)
            ? null
            : $"event {entry.Seq} ({entry.Type}): stored content no longer matches its hash"
              + (addition is null ? "" : $" (event or addition '{entry.AdditionId}' changed)")
              + (correction is null ? "" : $" (event or correction '{entry.CorrectionId}' changed)");
    }
}

using GelDispense.Contracts.V1;
using GelDispense.Service.Batches;
using Google.Protobuf;

namespace GelDispense.Service.Tests.Batches;

public sealed class StoredResponseTests
{
    private static readonly RecordAdditionResponse Response = new()
    {
        Addition = new Addition { AdditionId = "s1", StepIndex = 2, ReadingG = 7.2015, TrueMassG = 7.20908, PlanRevision = 1 },
        Replanned = true,
        PlanRevision = 1,
        ScaleFactor = 1.05,
        Warnings = { "Predicted hydrolysisRatio 4.4 is outside the spec 4 ± 2 %." },
    };

    [Fact]
    public void A_response_read_back_equals_the_one_written()
    {
        var stored = StoredResponse.Write(Response);

        Assert.Equal(Response, StoredResponse.Read(stored));
        Assert.DoesNotContain('{', stored);
    }

    [Fact]
    public void A_response_stored_as_JSON_by_an_earlier_version_still_reads()
    {
        Assert.Equal(Response, StoredResponse.Read(JsonFormatter.Default.Format(Response)));
    }
}

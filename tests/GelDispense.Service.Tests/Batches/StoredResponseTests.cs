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
        Assert.StartsWith(StoredResponse.DeflatedPrefix, stored, StringComparison.Ordinal);
    }

    [Fact]
    public void A_response_whose_steps_repeat_their_cautions_is_stored_in_under_half_its_protobuf_size()
    {
        var response = Response.Clone();
        for (var step = 3; step < 8; step++)
        {
            response.RemainingSteps.Add(new PlanStep
            {
                Index = step,
                ReagentId = $"reagent-{step}",
                TargetMassG = 10.0 + step,
                Cautions =
                {
                    "H225 Highly flammable liquid and vapour: no open flames, earthed containers, work in a fume hood.",
                    "H319 Causes serious eye irritation: wear eye protection.",
                    "Alkoxides hydrolyse in moist air; keep the bottle closed between additions.",
                },
            });
        }

        var stored = StoredResponse.Write(response);

        Assert.Equal(response, StoredResponse.Read(stored));
        Assert.True(stored.Length * 2 < response.CalculateSize(), $"stored {stored.Length} characters for {response.CalculateSize()} protobuf bytes");
    }

    [Fact]
    public void A_response_read_back_from_its_deflated_bytes_equals_the_one_written_and_the_bytes_win_over_the_text()
    {
        var deflated = StoredResponse.Deflate(Response);

        Assert.Equal(Response, StoredResponse.Read("", deflated));
        Assert.Equal(Response, StoredResponse.Read("not read when there are bytes", deflated));
        Assert.Equal(Response, StoredResponse.Read(StoredResponse.Write(Response), null));
    }

    [Fact]
    public void A_response_stored_as_plain_base64_protobuf_by_an_earlier_version_still_reads()
    {
        Assert.Equal(Response, StoredResponse.Read(Convert.ToBase64String(Response.ToByteArray())));
    }

    [Fact]
    public void A_response_stored_as_JSON_by_an_earlier_version_still_reads()
    {
        Assert.Equal(Response, StoredResponse.Read(JsonFormatter.Default.Format(Response)));
    }

    [Fact]
    public void A_correction_response_reads_back_in_the_deflated_form_and_the_earlier_plain_form()
    {
        var correction = new CorrectAdditionResponse { Addition = Response.Addition, PlanRevision = 2, Replanned = true };

        Assert.Equal(correction, StoredResponse.ReadCorrection(StoredResponse.Write(correction)));
        Assert.Equal(correction, StoredResponse.ReadCorrection(Convert.ToBase64String(correction.ToByteArray())));
    }
}

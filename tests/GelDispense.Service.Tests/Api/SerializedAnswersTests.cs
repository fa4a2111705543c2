using GelDispense.Contracts.V1;
using GelDispense.Service.Api;
using Google.Protobuf;

namespace GelDispense.Service.Tests.Api;

public sealed class SerializedAnswersTests
{
    [Fact]
    public void Kept_bytes_are_the_message_serialised_and_belong_to_that_instance_alone()
    {
        var serialized = new SerializedAnswers();
        var plan = new DispensingPlan { Feasible = true, Warnings = { "2-propanol: highly flammable" } };

        var kept = serialized.Keep(plan);

        Assert.Equal(plan.ToByteArray(), kept);
        Assert.True(serialized.TryGet(plan, out var found));
        Assert.Same(kept, found);
        Assert.False(serialized.TryGet(plan.Clone(), out _));
    }
}

using GelDispense.Service.Extensions;
using Microsoft.Extensions.Configuration;

namespace GelDispense.Service.Tests.Extensions;

public sealed class RequestLimitsTests
{
    [Fact]
    public void Without_a_Limits_section_the_defaults_hold()
    {
        var limits = RequestLimits.From(new ConfigurationBuilder().Build());
        Assert.Equal(10, limits.RequestHeadersTimeoutSeconds);
        Assert.Equal(30, limits.RestRequestTimeoutSeconds);
        Assert.Equal(30, limits.GrpcUnaryMaxDeadlineSeconds);
    }

    [Fact]
    public void A_configured_limit_replaces_its_default_and_0_turns_a_call_timeout_off()
    {
        var limits = RequestLimits.From(Configuration(("RequestHeadersTimeoutSeconds", "2.5"), ("RestRequestTimeoutSeconds", "0")));
        Assert.Equal(2.5, limits.RequestHeadersTimeoutSeconds);
        Assert.Equal(0, limits.RestRequestTimeoutSeconds);
    }

    [Theory]
    [InlineData("RequestHeadersTimeoutSeconds", "0", "above 0")]
    [InlineData("KeepAliveTimeoutSeconds", "-1", "above 0")]
    [InlineData("MinRequestBodyBytesPerSecond", "0", "above 0")]
    // Kestrel refuses a grace period of 1 s or less (it checks the rate on a one-second heartbeat).
    [InlineData("MinRequestBodyGraceSeconds", "1", "above 1")]
    [InlineData("RestRequestTimeoutSeconds", "-0.5", "0 to turn it off")]
    [InlineData("GrpcUnaryMaxDeadlineSeconds", "NaN", "0 to turn it off")]
    [InlineData("MaxRequestBodyBytes", "0", "above 0")]
    public void An_unusable_limit_stops_the_start_naming_the_key_the_value_and_the_reason(string key, string value, string reason)
    {
        var refused = Assert.Throws<InvalidOperationException>(() => RequestLimits.From(Configuration((key, value))));
        Assert.Contains($"Limits:{key} = {value}", refused.Message, StringComparison.Ordinal);
        Assert.Contains(reason, refused.Message, StringComparison.Ordinal);
    }

    private static IConfiguration Configuration(params (string Key, string Value)[] pairs) =>
        new ConfigurationBuilder()
            .AddInMemoryCollection(pairs.Select(p => new KeyValuePair<string, string?>($"{RequestLimits.Section}:{p.Key}", p.Value)))
            .Build();
}

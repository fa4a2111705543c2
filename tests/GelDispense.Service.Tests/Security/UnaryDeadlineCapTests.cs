using GelDispense.Service.Security;

namespace GelDispense.Service.Tests.Security;

/// <summary>
/// The grpc-timeout header as the gRPC over HTTP/2 protocol defines it (grpc/grpc doc/PROTOCOL-HTTP2.md:
/// Timeout → "grpc-timeout" TimeoutValue TimeoutUnit; TimeoutValue → positive integer of at most 8 digits;
/// TimeoutUnit → H, M, S, m, u or n).
/// </summary>
public sealed class UnaryDeadlineCapTests
{
    [Theory]
    [InlineData("1H", 3_600_000.0)]
    [InlineData("2M", 120_000.0)]
    [InlineData("30S", 30_000.0)]
    [InlineData("250m", 250.0)]
    [InlineData("1500u", 1.5)]
    [InlineData("99999999n", 99.9999)]
    public void A_well_formed_timeout_is_read_in_its_unit(string header, double expectedMs)
    {
        var timeout = UnaryDeadlineCap.ParseTimeout(header);
        Assert.NotNull(timeout);
        Assert.Equal(expectedMs, timeout.Value.TotalMilliseconds, 4);
    }

    [Theory]
    [InlineData("")]
    [InlineData("S")]
    [InlineData("10")]
    [InlineData("123456789S")]
    [InlineData("-5S")]
    [InlineData("5s")]
    [InlineData("1.5S")]
    public void A_missing_or_malformed_timeout_is_read_as_none_so_the_cap_applies(string header) =>
        Assert.Null(UnaryDeadlineCap.ParseTimeout(header));
}

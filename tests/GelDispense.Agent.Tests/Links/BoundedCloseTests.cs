using GelDispense.Agent.Links;

namespace GelDispense.Agent.Tests.Links;

public class BoundedCloseTests
{
    [Fact]
    public void A_close_that_hangs_is_abandoned_at_the_bound()
    {
        using var release = new ManualResetEventSlim();
        var started = DateTime.UtcNow;

        var finished = BoundedClose.Run(() => release.Wait(), TimeSpan.FromMilliseconds(200));

        Assert.False(finished);
        Assert.True(DateTime.UtcNow - started < TimeSpan.FromSeconds(5));
        release.Set();
    }

    [Fact]
    public void A_quick_close_reports_finished_even_when_it_throws()
    {
        Assert.True(BoundedClose.Run(() => { }, TimeSpan.FromSeconds(5)));
        Assert.True(BoundedClose.Run(() => throw new IOException("already gone"), TimeSpan.FromSeconds(5)));
    }
}

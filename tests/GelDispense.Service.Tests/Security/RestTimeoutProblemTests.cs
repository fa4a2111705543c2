using GelDispense.Service.Errors;
using GelDispense.Service.Security;
using Microsoft.AspNetCore.Http;
using Microsoft.AspNetCore.Http.Timeouts;

namespace GelDispense.Service.Tests.Security;

/// <summary>
/// The step between the request-timeout middleware and a REST route served by a gRPC method. The route's own
/// outcome is written by the delegate here, as the error-mapping interceptor leaves it; the timeout is a real
/// cancelled token in the feature the request-timeout middleware installs.
/// </summary>
public sealed class RestTimeoutProblemTests
{
    private static readonly TimeSpan Limit = TimeSpan.FromSeconds(2);

    [Fact]
    public async Task A_transcoded_call_cancelled_by_the_timeout_becomes_504_DEADLINE_EXCEEDED_naming_the_limit()
    {
        var context = Context(timedOut: true);
        await new RestTimeoutProblem(Cancelled, Limit).InvokeAsync(context);

        Assert.Equal(StatusCodes.Status504GatewayTimeout, context.Response.StatusCode);
        var problem = Assert.IsType<ApiProblem>(context.Items[ApiProblem.ItemKey]);
        Assert.Equal(Grpc.Core.StatusCode.DeadlineExceeded, problem.Code);
        Assert.Equal(StatusCodes.Status504GatewayTimeout, problem.HttpStatus);
        Assert.Equal("2 s", problem.Errors.Single().Value);
    }

    [Fact]
    public async Task A_call_cancelled_by_its_client_before_the_timeout_stays_CANCELLED()
    {
        var context = Context(timedOut: false);
        await new RestTimeoutProblem(Cancelled, Limit).InvokeAsync(context);

        Assert.Equal(499, context.Response.StatusCode);
        Assert.Equal(Grpc.Core.StatusCode.Cancelled, Assert.IsType<ApiProblem>(context.Items[ApiProblem.ItemKey]).Code);
    }

    [Fact]
    public async Task A_call_that_finished_although_the_timeout_fired_keeps_its_answer()
    {
        var context = Context(timedOut: true);
        await new RestTimeoutProblem(_ => Task.CompletedTask, Limit).InvokeAsync(context);

        Assert.Equal(StatusCodes.Status200OK, context.Response.StatusCode);
        Assert.False(context.Items.ContainsKey(ApiProblem.ItemKey));
    }

    private static Task Cancelled(HttpContext context)
    {
        context.Items[ApiProblem.ItemKey] = new ApiProblem(Grpc.Core.StatusCode.Cancelled, "The call was cancelled.", []);
        context.Response.StatusCode = 499;
        return Task.CompletedTask;
    }

    private static DefaultHttpContext Context(bool timedOut)
    {
        var context = new DefaultHttpContext();
        context.Features.Set<IHttpRequestTimeoutFeature>(new TimeoutFeature(new CancellationToken(timedOut)));
        return context;
    }

    private sealed class TimeoutFeature(CancellationToken token) : IHttpRequestTimeoutFeature
    {
        public CancellationToken RequestTimeoutToken { get; } = token;

        public void DisableTimeout()
        {
        }
    }
}

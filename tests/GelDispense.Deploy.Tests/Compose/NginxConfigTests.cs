using System.Globalization;

namespace GelDispense.Deploy.Tests.Compose;

/// <summary>nginx.conf: gRPC over HTTP/2 and REST over HTTP/1.1, each to the matching Kestrel port of every replica.</summary>
public sealed class NginxConfigTests
{
    private static readonly NginxDirective Http = NginxConfig.Repository.First("http")!;
    private static readonly string ServiceName = ComposeFile.ServiceRunning(DeployReadme.Image);

    [Fact]
    public void GrpcListener_SpeaksHttp2_AndPassesGrpcToTheReplicasHttp2Port()
    {
        var server = Assert.Single(Http.All("server"), SpeaksHttp2);
        var grpcPass = Assert.Single(server.Descendants("grpc_pass"));
        var upstream = UpstreamNamed(grpcPass.Arguments[0], scheme: "grpc://");
        AssertReachesEveryReplica(upstream, Docker.DockerRuntimePorts.Http2);
    }

    [Fact]
    public void RestListener_ProxiesHttp11ToTheReplicasHttp1Port()
    {
        var server = Assert.Single(Http.All("server"), s => !SpeaksHttp2(s));
        Assert.Equal(["1.1"], server.Descendants("proxy_http_version").Single().Arguments);
        var proxyPass = Assert.Single(server.Descendants("proxy_pass"));
        var upstream = UpstreamNamed(proxyPass.Arguments[0], scheme: "http://");
        AssertReachesEveryReplica(upstream, Docker.DockerRuntimePorts.Http1);
    }

    [Fact]
    public void Upstreams_ReResolveTheServiceName_WithAnNginxThatSupportsIt()
    {
        Assert.NotNull(Http.First("resolver"));
        // The 'resolve' server parameter came to open-source nginx in 1.27.3 (nginx changelog, from memory).
        var image = ComposeFile.Service(ComposeFile.ServiceFromImage("nginx:")).Text("image")!;
        var parts = image.Split(':')[1].Split('-')[0].Split('.').Select(p => int.Parse(p, CultureInfo.InvariantCulture)).ToArray();
        var version = new Version(parts[0], parts[1], parts.Length > 2 ? parts[2] : 0);
        Assert.True(version >= new Version(1, 27, 3), $"{image} predates the upstream 'resolve' parameter");
    }

    [Fact]
    public void GrpcStreams_OutlastNginxDefaultReadTimeout()
    {
        // nginx closes an upstream that sends nothing for grpc_read_timeout, 60 s by default (nginx docs, ngx_http_grpc_module).
        var server = Assert.Single(Http.All("server"), SpeaksHttp2);
        var timeout = server.Descendants("grpc_read_timeout").Single().Arguments[0];
        Assert.True(Seconds(timeout) > 60, $"grpc_read_timeout {timeout} would cut a batch's event stream");
    }

    private static bool SpeaksHttp2(NginxDirective server) =>
        server.All("http2").Any(d => d.Arguments.SequenceEqual(["on"]))
        || server.All("listen").Any(d => d.Arguments.Contains("http2"));

    private static NginxDirective UpstreamNamed(string target, string scheme)
    {
        Assert.StartsWith(scheme, target, StringComparison.Ordinal);
        return Assert.Single(Http.All("upstream"), u => u.Arguments[0] == target[scheme.Length..]);
    }

    /// <summary>
    /// Every replica: the one server names the compose service (its DNS name answers with each replica's address)
    /// on the given port, and is re-resolved, which needs a shared-memory zone.
    /// </summary>
    private static void AssertReachesEveryReplica(NginxDirective upstream, int port)
    {
        Assert.Equal("2", ComposeFile.Service(ServiceName).Map("deploy").Text("replicas"));
        var server = Assert.Single(upstream.All("server"));
        Assert.Equal($"{ServiceName}:{port}", server.Arguments[0]);
        Assert.Contains("resolve", server.Arguments);
        Assert.NotNull(upstream.First("zone"));
    }

    private static int Seconds(string nginxTime) => nginxTime[^1] switch
    {
        'h' => 3600 * int.Parse(nginxTime[..^1], CultureInfo.InvariantCulture),
        'm' => 60 * int.Parse(nginxTime[..^1], CultureInfo.InvariantCulture),
        's' => int.Parse(nginxTime[..^1], CultureInfo.InvariantCulture),
        _ => int.Parse(nginxTime, CultureInfo.InvariantCulture),
    };
}

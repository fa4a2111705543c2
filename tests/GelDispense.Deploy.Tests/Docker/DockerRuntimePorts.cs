namespace GelDispense.Deploy.Tests.Docker;

/// <summary>The image's Kestrel endpoint ports (Rest, Grpc), taken from the runtime stage's Kestrel__Endpoints__*__Url variables.</summary>
internal static class DockerRuntimePorts
{
    public static IReadOnlyDictionary<string, int> ByEndpoint { get; } = Read();

    /// <summary>The port of the endpoint the service configures for HTTP/1.1 (REST, /healthz).</summary>
    public static int Http1 => ByEndpoint[EndpointSpeaking("Http1")];

    /// <summary>The port of the endpoint the service configures for HTTP/2 (gRPC, gRPC health).</summary>
    public static int Http2 => ByEndpoint[EndpointSpeaking("Http2")];

    private static string EndpointSpeaking(string protocols) =>
        ServiceSettings.EndpointProtocols.Single(e => e.Value == protocols).Key;

    private static Dictionary<string, int> Read()
    {
        const string prefix = "Kestrel__Endpoints__";
        const string suffix = "__Url";
        return DockerfileModel.Repository.Runtime.Env()
            .Where(e => e.Key.StartsWith(prefix, StringComparison.Ordinal) && e.Key.EndsWith(suffix, StringComparison.Ordinal))
            .ToDictionary(e => e.Key[prefix.Length..^suffix.Length], e => new Uri(e.Value, UriKind.Absolute).Port);
    }
}

using System.Text.RegularExpressions;
using System.Text.Json;
using System.Xml.Linq;

namespace GelDispense.Deploy.Tests;

/// <summary>
/// What the deploy files must agree with, read from the service itself: its Kestrel endpoint names and protocols
/// and its connection-string name (appsettings.json), its health route (its source) and its assembly name.
/// </summary>
internal static class ServiceSettings
{
    public const string ProjectPath = "src/GelDispense.Service/GelDispense.Service.csproj";

    private static readonly JsonElement AppSettings =
        JsonDocument.Parse(RepoPaths.Read("src/GelDispense.Service/appsettings.json")).RootElement;

    /// <summary>Kestrel endpoint name (Rest, Grpc) → its Protocols value.</summary>
    public static IReadOnlyDictionary<string, string> EndpointProtocols { get; } =
        AppSettings.GetProperty("Kestrel").GetProperty("Endpoints").EnumerateObject()
            .ToDictionary(e => e.Name, e => e.Value.GetProperty("Protocols").GetString()!);

    /// <summary>The single name under ConnectionStrings, which the host reads as ConnectionStrings:&lt;name&gt;.</summary>
    public static string ConnectionStringName { get; } =
        AppSettings.GetProperty("ConnectionStrings").EnumerateObject().Single().Name;

    /// <summary>The service's entry assembly: the project's AssemblyName, else the project file's name.</summary>
    public static string AssemblyName { get; } =
        XDocument.Load(RepoPaths.Of(ProjectPath)).Descendants("AssemblyName").FirstOrDefault()?.Value
        ?? Path.GetFileNameWithoutExtension(ProjectPath);

    /// <summary>True when the host's source maps an ASP.NET Core health-check route at that path.</summary>
    public static bool MapsHealthRoute(string path) =>
        Directory.EnumerateFiles(RepoPaths.Of("src/GelDispense.Service"), "*.cs", SearchOption.AllDirectories)
            .Where(file => !file.Contains($"{Path.DirectorySeparatorChar}obj{Path.DirectorySeparatorChar}", StringComparison.Ordinal)
                && !file.Contains($"{Path.DirectorySeparatorChar}bin{Path.DirectorySeparatorChar}", StringComparison.Ordinal))
            .Any(file => File.ReadAllText(file).Contains($"MapHealthChecks(\"{path}\"", StringComparison.Ordinal));

    /// <summary>The gRPC health service name the host registers for liveness (storage left out), read from its source.</summary>
    public static string GrpcLivenessService { get; } =
        Regex.Match(RepoPaths.Read("src/GelDispense.Service/Extensions/HealthExtensions.cs"), "LivenessService = \"([^\"]+)\"").Groups[1].Value;

    /// <summary>The environment variable that sets a .NET configuration path (':' becomes '__').</summary>
    public static string EnvName(string configurationPath) => configurationPath.Replace(":", "__", StringComparison.Ordinal);
}

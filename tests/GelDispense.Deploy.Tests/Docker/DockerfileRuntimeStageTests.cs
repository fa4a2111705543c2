using System.Globalization;

namespace GelDispense.Deploy.Tests.Docker;

/// <summary>The image runs the service as a non-root user, on every interface, on the ports it declares, with a health check.</summary>
public sealed class DockerfileRuntimeStageTests
{
    private static readonly DockerStage Runtime = DockerfileModel.Repository.Runtime;

    [Fact]
    public void RuntimeStage_SetsANumericNonRootUser()
    {
        var user = Runtime.Last("USER")?.Operands.Single();
        Assert.NotNull(user);
        // Numeric, so Kubernetes' runAsNonRoot can verify it without reading /etc/passwd (common practice).
        Assert.True(int.TryParse(user.Split(':')[0], CultureInfo.InvariantCulture, out var uid), $"USER {user} is not numeric");
        Assert.NotEqual(0, uid);
    }

    [Fact]
    public void KestrelUrls_CoverEveryEndpointTheServiceConfigures_OnAllInterfaces()
    {
        var env = Runtime.Env();
        Assert.All(ServiceSettings.EndpointProtocols.Keys, endpoint =>
        {
            var name = ServiceSettings.EnvName($"Kestrel:Endpoints:{endpoint}:Url");
            Assert.True(env.TryGetValue(name, out var url), $"{name} is not set in the runtime stage");
            Assert.Equal("0.0.0.0", new Uri(url).Host);
        });
    }

    [Fact]
    public void ExposedPorts_AreExactlyTheKestrelEndpointPorts()
    {
        Assert.Equal(DockerRuntimePorts.ByEndpoint.Values.ToHashSet(), Runtime.ExposedPorts());
    }

    [Fact]
    public void Environment_IsProduction_SoTheServiceLogsJson()
    {
        Assert.Equal("Production", Runtime.Env()["ASPNETCORE_ENVIRONMENT"]);
    }

    [Fact]
    public void Entrypoint_RunsTheServiceAssembly()
    {
        var entrypoint = Runtime.Last("ENTRYPOINT");
        Assert.NotNull(entrypoint);
        Assert.Equal(["dotnet", $"{ServiceSettings.AssemblyName}.dll"], entrypoint.ExecForm());
    }

    [Fact]
    public void Healthcheck_RunsTheExecutableScriptCopiedIntoTheImage_WhichAsksARouteTheServiceMaps()
    {
        var healthcheck = Runtime.Last("HEALTHCHECK");
        Assert.NotNull(healthcheck);
        var command = healthcheck.ExecForm(afterWord: "CMD");
        var copy = Assert.Single(Runtime.All("COPY"), c => c.Operands[^1] == command[0]);
        Assert.Equal(HealthcheckScript.RelativePath, copy.Operands[0]);
        Assert.Equal("0755", copy.Flag("chmod"));
        Assert.True(ServiceSettings.MapsHealthRoute(HealthcheckScript.HealthPath), $"the service maps no {HealthcheckScript.HealthPath}");
    }
}

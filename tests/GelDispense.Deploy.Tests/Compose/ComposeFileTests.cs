using System.Text.RegularExpressions;

namespace GelDispense.Deploy.Tests.Compose;

/// <summary>compose.yaml: two replicas of the service image on PostgreSQL 16, configured from the .env file.</summary>
public sealed partial class ComposeFileTests
{
    private static readonly string ServiceName = ComposeFile.ServiceRunning(DeployReadme.Image);
    private static readonly string PostgresName = ComposeFile.ServiceFromImage("postgres:");

    [Fact]
    public void Service_RunsTwoReplicasOfTheDocumentedImage_BuiltFromTheDockerfile()
    {
        var service = ComposeFile.Service(ServiceName);
        Assert.Equal("2", service.Map("deploy").Text("replicas"));
        var build = service.Map("build");
        var context = Path.GetFullPath(Path.Combine(RepoPaths.Of(ComposeFile.Folder), build.Text("context")!));
        Assert.Equal(RepoPaths.Root.TrimEnd(Path.DirectorySeparatorChar), context.TrimEnd(Path.DirectorySeparatorChar));
        Assert.Equal(Docker.DockerfileModel.RelativePath, build.Text("dockerfile"));
    }

    [Fact]
    public void Postgres_IsVersion16_WithANamedDataVolume_AndAPgIsReadyHealthcheck()
    {
        var postgres = ComposeFile.Service(PostgresName);
        Assert.Equal("postgres:16", postgres.Text("image"));
        var volume = Assert.Single(postgres.Seq("volumes").Scalars()).Split(':');
        Assert.Equal("/var/lib/postgresql/data", volume[1]);
        Assert.Contains(volume[0], ComposeFile.Root.Map("volumes").Keys());
        Assert.Contains(postgres.Map("healthcheck").Seq("test").Scalars(), part => part.Contains("pg_isready", StringComparison.Ordinal));
    }

    [Fact]
    public void ServiceReplicas_StartOnlyAfterPostgresIsHealthy()
    {
        var dependsOn = ComposeFile.Service(ServiceName).Map("depends_on");
        Assert.Equal("service_healthy", dependsOn.Map(PostgresName).Text("condition"));
    }

    [Fact]
    public void ServiceReplicas_UsePostgres_WithTheConnectionStringTheServiceReads_PointingAtThePostgresService()
    {
        var environment = ComposeFile.Service(ServiceName).Map("environment");
        Assert.Equal("Postgres", environment.Text(ServiceSettings.EnvName("Storage:Provider")));
        var connection = environment.Text(ServiceSettings.EnvName($"ConnectionStrings:{ServiceSettings.ConnectionStringName}"));
        Assert.NotNull(connection);
        Assert.Contains($"Host={PostgresName};", connection, StringComparison.Ordinal);
        Assert.Contains("Password=${POSTGRES_PASSWORD", connection, StringComparison.Ordinal);
    }

    [Fact]
    public void EveryInterpolatedVariable_IsDefinedInTheEnvExample()
    {
        var used = Interpolation().Matches(RepoPaths.Read($"{ComposeFile.Folder}/compose.yaml"))
            .Select(m => m.Groups[1].Value).ToHashSet();
        Assert.NotEmpty(used);
        Assert.All(used, name => Assert.True(ComposeFile.EnvExample.ContainsKey(name), $"${{{name}}} is not in .env.example"));
    }

    [Fact]
    public void EnvExample_HoldsOnlyAPlaceholderPassword_AndTheRealEnvFileIsGitIgnored()
    {
        Assert.Equal("change-me", ComposeFile.EnvExample["POSTGRES_PASSWORD"]);
        var ignored = RepoPaths.Read($"{ComposeFile.Folder}/.gitignore").ReplaceLineEndings("\n").Split('\n');
        Assert.Contains(".env", ignored);
    }

    [Fact]
    public void Balancer_MountsTheNginxConfig_AndPublishesExactlyItsListenPorts()
    {
        var balancer = ComposeFile.Service(ComposeFile.ServiceFromImage("nginx:"));
        var mount = Assert.Single(balancer.Seq("volumes").Scalars()).Split(':');
        Assert.Equal(NginxConfig.RelativePath, $"{ComposeFile.Folder}/{mount[0].TrimStart('.', '/')}");
        Assert.Equal("/etc/nginx/nginx.conf", mount[1]);
        var published = balancer.Seq("ports").Scalars().Select(p => int.Parse(p.Split(':')[^1], System.Globalization.CultureInfo.InvariantCulture));
        var listening = NginxConfig.Repository.Descendants("listen").Select(l => int.Parse(l.Arguments[0].Split(':')[^1], System.Globalization.CultureInfo.InvariantCulture));
        Assert.Equal(listening.Order(), published.Order());
    }

    [Fact]
    public void Balancer_StartsOnlyAfterTheReplicasAreHealthy()
    {
        var balancer = ComposeFile.Service(ComposeFile.ServiceFromImage("nginx:"));
        Assert.Equal("service_healthy", balancer.Map("depends_on").Map(ServiceName).Text("condition"));
        // The replicas' health is the image's HEALTHCHECK, unless compose overrides it.
        Assert.Null(ComposeFile.Service(ServiceName).Child("healthcheck"));
        Assert.NotNull(Docker.DockerfileModel.Repository.Runtime.Last("HEALTHCHECK"));
    }

    // ${NAME}, ${NAME:-default}, ${NAME:?error}; $${…} is an escaped dollar for the container's shell.
    [GeneratedRegex(@"(?<!\$)\$\{([A-Za-z_][A-Za-z0-9_]*)")]
    private static partial Regex Interpolation();
}

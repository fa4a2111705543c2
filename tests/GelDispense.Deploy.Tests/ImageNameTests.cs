namespace GelDispense.Deploy.Tests;

/// <summary>One image name: the one deploy/README.md builds from the Dockerfile is the one compose and Kubernetes run.</summary>
public sealed class ImageNameTests
{
    [Fact]
    public void DocumentedBuild_UsesTheDockerfile_FromTheRepositoryRoot()
    {
        Assert.Equal(Docker.DockerfileModel.RelativePath, DeployReadme.Option("-f"));
        Assert.Equal(".", DeployReadme.BuildCommand[^1]);
    }

    [Fact]
    public void ComposeService_RunsTheDocumentedImage()
    {
        var name = Compose.ComposeFile.ServiceRunning(DeployReadme.Image);
        Assert.NotNull(Compose.ComposeFile.Service(name).Child("build"));
    }

    [Fact]
    public void KubernetesDeployment_RunsTheDocumentedImage()
    {
        Assert.Equal(DeployReadme.Image, K8s.Manifests.Container.Image);
    }

    [Fact]
    public void DockerfileHeader_ShowsTheSameBuildCommand()
    {
        var header = RepoPaths.Read(Docker.DockerfileModel.RelativePath);
        Assert.Contains(string.Join(' ', DeployReadme.BuildCommand), header, StringComparison.Ordinal);
    }
}

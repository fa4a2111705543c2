namespace GelDispense.Deploy.Tests.Docker;

/// <summary>The build stage restores and publishes the service from what it copies, and copies only what exists.</summary>
public sealed class DockerfileBuildStageTests
{
    private static readonly DockerfileModel Dockerfile = DockerfileModel.Repository;
    private static readonly DockerStage Build = Dockerfile.Stage("build");
    private static readonly IReadOnlySet<string> ServiceProjects = ProjectClosure.Of(ServiceSettings.ProjectPath);

    [Fact]
    public void Image_IsBuiltWithTheDotnet10Sdk_AndRunsOnTheAspNet10Runtime()
    {
        Assert.Equal("mcr.microsoft.com/dotnet/sdk:10.0", Build.BaseImage);
        Assert.Equal("mcr.microsoft.com/dotnet/aspnet:10.0", Dockerfile.Runtime.BaseImage);
        Assert.Contains(Dockerfile.Runtime.All("COPY"), copy => copy.Flag("from") == "build");
    }

    [Fact]
    public void PublishedProject_IsTheServiceProject_AndExistsInTheRepository()
    {
        var publish = Assert.Single(Build.All("RUN"), run => run.Arguments.StartsWith("dotnet publish ", StringComparison.Ordinal));
        var project = publish.Words[2];
        Assert.Equal(ServiceSettings.ProjectPath, project);
        Assert.True(RepoPaths.Exists(project), $"{project} is not in the repository");
    }

    [Fact]
    public void Restore_SeesTheCentralBuildFiles_AndEveryProjectFileTheServiceReferences()
    {
        var copied = CopiedBefore(run => run.Contains("dotnet restore", StringComparison.Ordinal));
        string[] centralFiles = ["Directory.Build.props", "Directory.Packages.props", ".editorconfig"];
        Assert.All(centralFiles, file => Assert.Contains(file, copied));
        Assert.All(ServiceProjects, project => Assert.Contains(project, copied));
    }

    [Fact]
    public void Publish_SeesEveryProjectFolderOfTheService_AndTheProtoRoot()
    {
        var copied = CopiedBefore(run => run.Contains("dotnet publish", StringComparison.Ordinal));
        var folders = ServiceProjects.Select(project => Path.GetDirectoryName(project)!.Replace('\\', '/'));
        var protoRoots = ServiceProjects.SelectMany(ProjectClosure.ProtoRoots).ToList();
        Assert.NotEmpty(protoRoots);
        Assert.All(folders.Concat(protoRoots), folder => Assert.Contains(folder, copied));
    }

    [Fact]
    public void EveryCopiedSource_ExistsInTheRepository_AndIsInTheBuildContext()
    {
        var sources = Dockerfile.Stages.SelectMany(stage => stage.All("COPY"))
            .Where(copy => copy.Flag("from") is null)
            .SelectMany(copy => copy.Operands.SkipLast(1))
            .ToList();
        Assert.NotEmpty(sources);
        Assert.All(sources, source =>
        {
            Assert.True(RepoPaths.Exists(source), $"COPY {source}: not in the repository");
            Assert.False(DockerIgnore.Repository.IsExcluded(source), $"COPY {source}: .dockerignore leaves it out");
        });
    }

    [Fact]
    public void BuildContext_LeavesOutHostBuildOutput_OfEveryCopiedProject()
    {
        Assert.All(ServiceProjects.Select(project => Path.GetDirectoryName(project)!.Replace('\\', '/')), folder =>
        {
            Assert.True(DockerIgnore.Repository.IsExcluded($"{folder}/obj/project.assets.json"), $"{folder}/obj is in the context");
            Assert.True(DockerIgnore.Repository.IsExcluded($"{folder}/bin/Debug/net10.0/x.dll"), $"{folder}/bin is in the context");
            Assert.False(DockerIgnore.Repository.IsExcluded($"{folder}/Program.cs"), $"{folder} sources are not in the context");
        });
        Assert.True(DockerIgnore.Repository.IsExcluded(".git/HEAD"));
        Assert.True(DockerIgnore.Repository.IsExcluded("deploy/compose/.env"));
    }

    /// <summary>Normalised COPY sources (no trailing '/') in the build stage before the first RUN that matches.</summary>
    private static HashSet<string> CopiedBefore(Func<string, bool> isRun)
    {
        var end = Build.Instructions.ToList().FindIndex(i => i.Keyword == "RUN" && isRun(i.Arguments));
        Assert.True(end >= 0, "no such RUN in the build stage");
        return [.. Build.Instructions.Take(end)
            .Where(i => i.Keyword == "COPY" && i.Flag("from") is null)
            .SelectMany(copy => copy.Operands.SkipLast(1))
            .Select(source => source.TrimEnd('/'))];
    }
}

using YamlDotNet.RepresentationModel;

namespace GelDispense.Deploy.Tests.Compose;

/// <summary>deploy/compose/compose.yaml and its .env.example, loaded once.</summary>
internal static class ComposeFile
{
    public const string Folder = "deploy/compose";

    public static YamlMappingNode Root { get; } = YamlNodes.Load($"{Folder}/compose.yaml");

    public static YamlMappingNode Services => Root.Map("services");

    public static YamlMappingNode Service(string name) => Services.Map(name);

    /// <summary>The name of the one service that runs the given image.</summary>
    public static string ServiceRunning(string image) =>
        Assert.Single(Services.Keys(), name => Service(name).Text("image") == image);

    /// <summary>The service whose image starts with the given repository (e.g. "postgres:", "nginx:").</summary>
    public static string ServiceFromImage(string imagePrefix) =>
        Assert.Single(Services.Keys(), name => Service(name).Text("image")?.StartsWith(imagePrefix, StringComparison.Ordinal) == true);

    /// <summary>The KEY=value lines of .env.example.</summary>
    public static IReadOnlyDictionary<string, string> EnvExample { get; } =
        RepoPaths.Read($"{Folder}/.env.example").ReplaceLineEndings("\n").Split('\n')
            .Select(line => line.Trim())
            .Where(line => line.Length > 0 && !line.StartsWith('#'))
            .Select(line => line.Split('=', 2))
            .ToDictionary(pair => pair[0], pair => pair[1]);
}

using YamlDotNet.RepresentationModel;

namespace GelDispense.Deploy.Tests;

/// <summary>Loading YAML files and walking their untyped node trees with readable failures.</summary>
internal static class YamlNodes
{
    /// <summary>Every document of a repository YAML file, each as its root mapping.</summary>
    public static IReadOnlyList<YamlMappingNode> LoadDocuments(string relativePath)
    {
        var stream = new YamlStream();
        using (var reader = new StringReader(RepoPaths.Read(relativePath)))
        {
            stream.Load(reader);
        }

        return [.. stream.Documents.Select(d => d.RootNode as YamlMappingNode
            ?? throw new FormatException($"{relativePath}: a document is not a mapping"))];
    }

    public static YamlMappingNode Load(string relativePath) => LoadDocuments(relativePath).Single();

    public static YamlNode? Child(this YamlMappingNode node, string key) =>
        node.Children.TryGetValue(new YamlScalarNode(key), out var child) ? child : null;

    public static YamlMappingNode Map(this YamlMappingNode node, string key) =>
        node.Child(key) as YamlMappingNode ?? throw new KeyNotFoundException($"no mapping '{key}' at {node.Start}");

    public static YamlSequenceNode Seq(this YamlMappingNode node, string key) =>
        node.Child(key) as YamlSequenceNode ?? throw new KeyNotFoundException($"no sequence '{key}' at {node.Start}");

    /// <summary>A scalar value, or null when the key is absent.</summary>
    public static string? Text(this YamlMappingNode node, string key) => (node.Child(key) as YamlScalarNode)?.Value;

    /// <summary>The keys of a mapping, in file order.</summary>
    public static IReadOnlyList<string> Keys(this YamlMappingNode node) =>
        [.. node.Children.Keys.OfType<YamlScalarNode>().Select(k => k.Value!)];

    /// <summary>The scalar items of a sequence (e.g. ports, volumes, a healthcheck test).</summary>
    public static IReadOnlyList<string> Scalars(this YamlSequenceNode node) =>
        [.. node.Children.OfType<YamlScalarNode>().Select(s => s.Value!)];
}

namespace GelDispense.Deploy.Tests.Docker;

/// <summary>A build stage: its FROM image, its AS name and the instructions up to the next FROM.</summary>
internal sealed record DockerStage(string BaseImage, string? Name, IReadOnlyList<DockerInstruction> Instructions)
{
    public IEnumerable<DockerInstruction> All(string keyword) =>
        Instructions.Where(i => i.Keyword == keyword);

    public DockerInstruction? Last(string keyword) => All(keyword).LastOrDefault();

    /// <summary>Every ENV variable the stage sets (key=value form; a value may be empty or quoted).</summary>
    public IReadOnlyDictionary<string, string> Env() =>
        All("ENV").SelectMany(i => i.Words)
            .Select(word => word.Split('=', 2))
            .Where(pair => pair.Length == 2)
            .GroupBy(pair => pair[0])
            .ToDictionary(g => g.Key, g => g.Last()[1]);

    /// <summary>The ports of every EXPOSE line (a /tcp or /udp suffix dropped).</summary>
    public IReadOnlySet<int> ExposedPorts() =>
        All("EXPOSE").SelectMany(i => i.Words)
            .Select(word => int.Parse(word.Split('/')[0], System.Globalization.CultureInfo.InvariantCulture))
            .ToHashSet();
}

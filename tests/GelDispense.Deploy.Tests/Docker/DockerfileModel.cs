namespace GelDispense.Deploy.Tests.Docker;

/// <summary>
/// Just enough of the Dockerfile grammar for the checks: comment lines dropped, backslash continuations joined,
/// instructions grouped into stages by FROM.
/// </summary>
internal sealed class DockerfileModel
{
    public const string RelativePath = "deploy/docker/Dockerfile";

    private DockerfileModel(IReadOnlyList<DockerStage> stages) => Stages = stages;

    public static DockerfileModel Repository { get; } = Parse(RepoPaths.Read(RelativePath));

    public IReadOnlyList<DockerStage> Stages { get; }

    /// <summary>The stage the image is made from: the last one.</summary>
    public DockerStage Runtime => Stages[^1];

    public DockerStage Stage(string name) => Stages.Single(s => s.Name == name);

    public static DockerfileModel Parse(string text)
    {
        var stages = new List<DockerStage>();
        foreach (var instruction in Instructions(text))
        {
            if (instruction.Keyword == "FROM")
            {
                var words = instruction.Operands;
                var name = words.Count >= 3 && words[1].Equals("AS", StringComparison.OrdinalIgnoreCase) ? words[2] : null;
                stages.Add(new DockerStage(words[0], name, []));
            }
            else if (stages.Count == 0)
            {
                throw new FormatException($"{instruction.Keyword} before the first FROM");
            }
            else
            {
                var current = stages[^1];
                stages[^1] = current with { Instructions = [.. current.Instructions, instruction] };
            }
        }

        return new DockerfileModel(stages);
    }

    private static IEnumerable<DockerInstruction> Instructions(string text)
    {
        var pending = "";
        foreach (var raw in text.ReplaceLineEndings("\n").Split('\n'))
        {
            var line = raw.Trim();
            if (line.StartsWith('#') || (line.Length == 0 && pending.Length == 0))
            {
                continue;
            }

            if (line.EndsWith('\\'))
            {
                pending += line[..^1] + " ";
                continue;
            }

            var whole = (pending + line).Trim();
            pending = "";
            if (whole.Length > 0)
            {
                var space = whole.IndexOfAny([' ', '\t']);
                yield return space < 0
                    ? new DockerInstruction(whole.ToUpperInvariant(), "")
                    : new DockerInstruction(whole[..space].ToUpperInvariant(), whole[(space + 1)..].Trim());
            }
        }
    }
}

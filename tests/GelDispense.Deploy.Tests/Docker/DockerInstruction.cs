using System.Text.Json;

namespace GelDispense.Deploy.Tests.Docker;

/// <summary>One Dockerfile instruction after line continuations are joined: keyword in upper case, then its arguments.</summary>
internal sealed record DockerInstruction(string Keyword, string Arguments)
{
    /// <summary>Arguments split on whitespace, with quotes removed from quoted words.</summary>
    public IReadOnlyList<string> Words =>
        [.. Arguments.Split([' ', '\t'], StringSplitOptions.RemoveEmptyEntries).Select(w => w.Trim('"'))];

    /// <summary>The words that are not --flags.</summary>
    public IReadOnlyList<string> Operands => [.. Words.Where(w => !w.StartsWith("--", StringComparison.Ordinal))];

    /// <summary>The value of a --name=value flag, or null.</summary>
    public string? Flag(string name) =>
        Words.FirstOrDefault(w => w.StartsWith($"--{name}=", StringComparison.Ordinal))?[(name.Length + 3)..];

    /// <summary>The command of an exec-form (JSON array) argument such as CMD ["a", "b"], after any --flags.</summary>
    public IReadOnlyList<string> ExecForm(string? afterWord = null)
    {
        var text = Arguments;
        if (afterWord is not null)
        {
            var at = text.IndexOf($" {afterWord} ", StringComparison.Ordinal);
            text = at < 0 ? "" : text[(at + afterWord.Length + 2)..];
        }

        text = text.Trim();
        return text.StartsWith('[')
            ? JsonSerializer.Deserialize<string[]>(text) ?? []
            : throw new FormatException($"{Keyword} {Arguments}: expected the exec form [\"…\"]");
    }
}

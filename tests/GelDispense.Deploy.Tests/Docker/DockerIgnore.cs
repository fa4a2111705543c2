using System.Text.RegularExpressions;

namespace GelDispense.Deploy.Tests.Docker;

/// <summary>
/// The repository's .dockerignore with Docker's matching rules: patterns are relative to the context root,
/// '*' and '?' stay within one path segment, '**' spans any number of segments, a pattern that matches a folder
/// excludes everything under it, '!' re-includes, and the last matching line wins.
/// </summary>
internal sealed class DockerIgnore
{
    private readonly IReadOnlyList<(Regex Pattern, bool Include)> rules;

    private DockerIgnore(IReadOnlyList<(Regex, bool)> rules) => this.rules = rules;

    public static DockerIgnore Repository { get; } = Parse(RepoPaths.Read(".dockerignore"));

    public static DockerIgnore Parse(string text) =>
        new([.. text.ReplaceLineEndings("\n").Split('\n')
            .Select(line => line.Trim())
            .Where(line => line.Length > 0 && !line.StartsWith('#'))
            .Select(line => line.StartsWith('!') ? (ToRegex(line[1..]), true) : (ToRegex(line), false))]);

    /// <summary>True when a context-relative path (with '/') is left out of the build context.</summary>
    public bool IsExcluded(string relativePath)
    {
        var path = relativePath.Trim('/');
        var excluded = false;
        foreach (var (pattern, include) in rules)
        {
            if (SelfOrParents(path).Any(pattern.IsMatch))
            {
                excluded = !include;
            }
        }

        return excluded;
    }

    private static IEnumerable<string> SelfOrParents(string path)
    {
        for (var end = path.Length; end > 0; end = path.LastIndexOf('/', end - 1))
        {
            yield return path[..end];
        }
    }

    private static Regex ToRegex(string pattern)
    {
        var body = Regex.Escape(pattern.Trim().Trim('/'))
            .Replace(@"\*\*/", "(.*/)?", StringComparison.Ordinal)
            .Replace(@"\*\*", ".*", StringComparison.Ordinal)
            .Replace(@"\*", "[^/]*", StringComparison.Ordinal)
            .Replace(@"\?", "[^/]", StringComparison.Ordinal);
        return new Regex($"^{body}$", RegexOptions.CultureInvariant);
    }
}

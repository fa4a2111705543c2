using System.Text;

namespace GelDispense.Deploy.Tests.Compose;

/// <summary>
/// Parses nginx configuration syntax into a directive tree: words separated by blanks, quoted strings,
/// '#' comments, ';' ending a simple directive and '{ … }' holding a block's children.
/// </summary>
internal static class NginxConfig
{
    public const string RelativePath = "deploy/compose/nginx.conf";

    /// <summary>The repository's load balancer config, as the children of an unnamed root.</summary>
    public static NginxDirective Repository { get; } = Parse(RepoPaths.Read(RelativePath));

    public static NginxDirective Parse(string text)
    {
        using var tokens = Tokens(text).GetEnumerator();
        var children = ParseBlock(tokens, closedByBrace: false);
        return new NginxDirective("", [], children);
    }

    private static List<NginxDirective> ParseBlock(IEnumerator<string> tokens, bool closedByBrace)
    {
        var directives = new List<NginxDirective>();
        var words = new List<string>();
        while (tokens.MoveNext())
        {
            switch (tokens.Current)
            {
                case ";":
                    directives.Add(new NginxDirective(words[0], [.. words.Skip(1)], []));
                    words.Clear();
                    break;
                case "{":
                    directives.Add(new NginxDirective(words[0], [.. words.Skip(1)], ParseBlock(tokens, closedByBrace: true)));
                    words.Clear();
                    break;
                case "}":
                    return closedByBrace ? directives : throw new FormatException("'}' without a block");
                default:
                    words.Add(tokens.Current);
                    break;
            }
        }

        return !closedByBrace && words.Count == 0 ? directives : throw new FormatException("unterminated block or directive");
    }

    private static IEnumerable<string> Tokens(string text)
    {
        var word = new StringBuilder();
        for (var i = 0; i < text.Length; i++)
        {
            var c = text[i];
            if (c == '#')
            {
                while (i < text.Length && text[i] != '\n') i++;
            }
            else if (c is '"' or '\'')
            {
                var end = text.IndexOf(c, i + 1);
                word.Append(text, i + 1, end - i - 1);
                i = end;
                yield return word.ToString();
                word.Clear();
            }
            else if (char.IsWhiteSpace(c) || c is ';' or '{' or '}')
            {
                if (word.Length > 0) yield return word.ToString();
                word.Clear();
                if (!char.IsWhiteSpace(c)) yield return c.ToString();
            }
            else
            {
                word.Append(c);
            }
        }

        if (word.Length > 0) yield return word.ToString();
    }
}

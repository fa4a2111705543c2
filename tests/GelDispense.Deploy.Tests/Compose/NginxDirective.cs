namespace GelDispense.Deploy.Tests.Compose;

/// <summary>One nginx directive: its name, its arguments and, for a block such as <c>server { … }</c>, its children.</summary>
internal sealed record NginxDirective(string Name, IReadOnlyList<string> Arguments, IReadOnlyList<NginxDirective> Children)
{
    public IEnumerable<NginxDirective> All(string name) => Children.Where(c => c.Name == name);

    public NginxDirective? First(string name) => All(name).FirstOrDefault();

    /// <summary>Every directive of that name at any depth below this one.</summary>
    public IEnumerable<NginxDirective> Descendants(string name) =>
        Children.SelectMany(c => (c.Name == name ? [c] : Enumerable.Empty<NginxDirective>()).Concat(c.Descendants(name)));
}

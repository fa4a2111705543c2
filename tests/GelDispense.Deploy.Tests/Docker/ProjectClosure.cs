using System.Xml.Linq;

namespace GelDispense.Deploy.Tests.Docker;

/// <summary>A project and everything it references, transitively, as repository-relative project paths.</summary>
internal static class ProjectClosure
{
    public static IReadOnlySet<string> Of(string projectPath)
    {
        var found = new HashSet<string>(StringComparer.Ordinal);
        var pending = new Stack<string>([projectPath]);
        while (pending.TryPop(out var project))
        {
            if (!found.Add(project))
            {
                continue;
            }

            var folder = Path.GetDirectoryName(RepoPaths.Of(project))!;
            foreach (var reference in XDocument.Load(RepoPaths.Of(project)).Descendants("ProjectReference"))
            {
                var full = Path.GetFullPath(Path.Combine(folder, reference.Attribute("Include")!.Value.Replace('\\', '/')));
                pending.Push(Path.GetRelativePath(RepoPaths.Root, full).Replace('\\', '/'));
            }
        }

        return found;
    }

    /// <summary>The '..'-relative folders a project's Protobuf items reach outside its own folder (e.g. protos/).</summary>
    public static IEnumerable<string> ProtoRoots(string projectPath)
    {
        var folder = Path.GetDirectoryName(RepoPaths.Of(projectPath))!;
        return XDocument.Load(RepoPaths.Of(projectPath)).Descendants("Protobuf")
            .Select(p => p.Attribute("ProtoRoot")?.Value)
            .OfType<string>()
            .Select(root => Path.GetRelativePath(RepoPaths.Root, Path.GetFullPath(Path.Combine(folder, root.Replace('\\', '/')))))
            .Select(root => root.Replace('\\', '/'));
    }
}

namespace GelDispense.Deploy.Tests;

/// <summary>The image build command that deploy/README.md documents, and the tag it gives the image.</summary>
internal static class DeployReadme
{
    public const string RelativePath = "deploy/README.md";

    /// <summary>The words of the first documented <c>docker build</c> command.</summary>
    public static IReadOnlyList<string> BuildCommand { get; } =
        RepoPaths.Read(RelativePath).ReplaceLineEndings("\n").Split('\n')
            .Select(line => line.Trim())
            .First(line => line.StartsWith("docker build ", StringComparison.Ordinal))
            .Split(' ', StringSplitOptions.RemoveEmptyEntries);

    /// <summary>The value after an option such as -t or -f in the build command.</summary>
    public static string Option(string option)
    {
        var at = BuildCommand.ToList().IndexOf(option);
        Assert.True(at >= 0 && at + 1 < BuildCommand.Count, $"the documented docker build has no {option}");
        return BuildCommand[at + 1];
    }

    public static string Image => Option("-t");
}

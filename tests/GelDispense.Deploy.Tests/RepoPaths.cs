namespace GelDispense.Deploy.Tests;

/// <summary>Paths inside the repository, found from the test assembly by walking up to the solution file.</summary>
internal static class RepoPaths
{
    public static string Root { get; } = FindRoot();

    /// <summary>An absolute path from a repository-relative one written with '/'.</summary>
    public static string Of(string relativePath) =>
        Path.Combine([Root, .. relativePath.Split('/', StringSplitOptions.RemoveEmptyEntries)]);

    public static string Read(string relativePath) => File.ReadAllText(Of(relativePath));

    /// <summary>True when the repository holds that file or folder.</summary>
    public static bool Exists(string relativePath) => File.Exists(Of(relativePath)) || Directory.Exists(Of(relativePath));

    private static string FindRoot()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            if (File.Exists(Path.Combine(dir.FullName, "GelDispense.sln")))
            {
                return dir.FullName;
            }
        }

        throw new InvalidOperationException($"No GelDispense.sln above {AppContext.BaseDirectory}.");
    }
}

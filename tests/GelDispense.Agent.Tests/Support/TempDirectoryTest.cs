namespace GelDispense.Agent.Tests.Support;

/// <summary>A fresh temporary folder per test (for stable symlinks to ptys and fake /dev trees), removed after.</summary>
public abstract class TempDirectoryTest : IDisposable
{
    protected string Dir { get; } = Directory.CreateTempSubdirectory("gd-agent-").FullName;

    public void Dispose()
    {
        Directory.Delete(Dir, recursive: true);
        GC.SuppressFinalize(this);
    }
}

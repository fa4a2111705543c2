namespace GelDispense.Agent.Pty;

/// <summary>
/// Points a fixed path at the current pseudo-terminal. Each new pty gets a new /dev/pts number, so a simulator
/// that "replugs" its balance keeps one path the agent can reopen, as /dev/serial/by-id does for a USB adapter.
/// </summary>
public static class SymlinkPoint
{
    public static void Point(string linkPath, string targetPath)
    {
        // Build the link beside the final name, then rename over it: readers never see the path missing.
        var temporary = $"{linkPath}.{Environment.ProcessId}.{Guid.NewGuid():N}.tmp";
        File.CreateSymbolicLink(temporary, targetPath);
        File.Move(temporary, linkPath, overwrite: true);
    }
}

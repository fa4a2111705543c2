using System.Globalization;

namespace GelDispense.LoadHarness;

/// <summary>
/// CPU time spent by every PostgreSQL process on this machine, read from /proc: each live process's own time plus
/// the time of the children it has reaped (so a backend that exited still counts, once, through the postmaster).
/// The ingest runs use a cluster of their own on an otherwise idle engine, so the difference over a slice is what
/// that slice cost the database. Zero where /proc is missing.
/// </summary>
public static class PostgresCpu
{
    /// <summary>/proc reports times in USER_HZ ticks, 100 a second on every Linux ABI.</summary>
    private const double TicksPerSecond = 100;

    public static TimeSpan Total()
    {
        if (!Directory.Exists("/proc"))
        {
            return TimeSpan.Zero;
        }

        long ticks = 0;
        foreach (var directory in Directory.EnumerateDirectories("/proc"))
        {
            if (!int.TryParse(Path.GetFileName(directory), NumberStyles.None, CultureInfo.InvariantCulture, out _))
            {
                continue;
            }

            string stat;
            try
            {
                stat = File.ReadAllText(Path.Combine(directory, "stat"));
            }
            catch (IOException)
            {
                continue; // the process ended while we looked
            }
            catch (UnauthorizedAccessException)
            {
                continue;
            }

            ticks += PostgresTicks(stat);
        }

        return TimeSpan.FromSeconds(ticks / TicksPerSecond);
    }

    /// <summary>utime + stime + cutime + cstime (fields 14–17 of proc(5)) when the command is postgres, else 0.</summary>
    private static long PostgresTicks(string stat)
    {
        // The command sits in parentheses and may itself hold spaces or parentheses; the fields after it are plain.
        var open = stat.IndexOf('(', StringComparison.Ordinal);
        var close = stat.LastIndexOf(')');
        if (open < 0 || close < open || stat[(open + 1)..close] != "postgres")
        {
            return 0;
        }

        var fields = stat[(close + 2)..].Split(' ');
        long sum = 0;
        for (var i = 11; i <= 14; i++)
        {
            sum += long.Parse(fields[i], CultureInfo.InvariantCulture);
        }

        return sum;
    }
}

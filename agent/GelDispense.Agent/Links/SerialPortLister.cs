namespace GelDispense.Agent.Links;

/// <summary>
/// Lists serial device paths by looking in /dev, because <c>SerialPort.GetPortNames()</c> returns nothing on
/// our Linux machines. The stable names under /dev/serial/by-id survive re-plugging a USB adapter and are the
/// ones to put in a station config.
/// </summary>
public static class SerialPortLister
{
    private static readonly (string Pattern, string Kind)[] DevPatterns =
    [
        ("ttyUSB*", "USB serial adapter"),
        ("ttyACM*", "USB modem-class device"),
        ("ttyS*", "on-board UART (often present without hardware)"),
    ];

    public static IReadOnlyList<SerialPortCandidate> List(string devRoot = "/dev")
    {
        var found = new List<SerialPortCandidate>();
        var byId = Path.Combine(devRoot, "serial", "by-id");
        if (Directory.Exists(byId))
        {
            found.AddRange(Directory.EnumerateFileSystemEntries(byId)
                .Order(StringComparer.Ordinal)
                .Select(path => new SerialPortCandidate(path, "stable name", ResolveTarget(path))));
        }

        if (Directory.Exists(devRoot))
        {
            foreach (var (pattern, kind) in DevPatterns)
            {
                found.AddRange(Directory.EnumerateFileSystemEntries(devRoot, pattern)
                    .Order(NaturalOrder.Instance)
                    .Select(path => new SerialPortCandidate(path, kind, null)));
            }
        }

        return found;
    }

    private static string? ResolveTarget(string path)
    {
        var info = new FileInfo(path);
        return info.LinkTarget is null ? null : info.ResolveLinkTarget(returnFinalTarget: true)?.FullName ?? info.LinkTarget;
    }

    /// <summary>ttyS2 before ttyS10.</summary>
    private sealed class NaturalOrder : IComparer<string>
    {
        public static readonly NaturalOrder Instance = new();

        public int Compare(string? x, string? y)
        {
            var (xs, xn) = Split(x ?? "");
            var (ys, yn) = Split(y ?? "");
            var byStem = string.CompareOrdinal(xs, ys);
            return byStem != 0 ? byStem : xn.CompareTo(yn);
        }

        private static (string Stem, long Number) Split(string s)
        {
            var i = s.Length;
            while (i > 0 && char.IsAsciiDigit(s[i - 1]))
            {
                i--;
            }

            return (s[..i], i < s.Length && long.TryParse(s.AsSpan(i), out var n) ? n : -1);
        }
    }
}

using System.Globalization;

namespace GelDispense.Service.Storage;

/// <summary>
/// How instants are stored: UTC, fixed width, microseconds, e.g. 2026-03-01T09:15:02.123456Z. Fixed width makes
/// text order equal time order on SQLite and PostgreSQL alike.
/// </summary>
public static class TimeText
{
    private const string Pattern = "yyyy-MM-dd'T'HH:mm:ss.ffffff'Z'";

    public static string Format(DateTimeOffset instant) =>
        instant.UtcDateTime.ToString(Pattern, CultureInfo.InvariantCulture);

    public static DateTimeOffset Parse(string text) =>
        new(DateTime.SpecifyKind(DateTime.ParseExact(text, Pattern, CultureInfo.InvariantCulture), DateTimeKind.Utc));
}

using System.Globalization;

namespace CrossCheck.Common;

/// <summary>"Today" and "now" read from one <see cref="TimeProvider"/> (the system's, or a test's).</summary>
public static class Clock
{
    /// <summary>The local date of <paramref name="time"/>.</summary>
    public static DateOnly Today(TimeProvider time)
    {
        ArgumentNullException.ThrowIfNull(time);
        return DateOnly.FromDateTime(time.GetLocalNow().DateTime);
    }

    /// <summary><c>yyyy-MM-dd</c>.</summary>
    public static string Iso(DateOnly date) => date.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);

    /// <summary>The UTC time of <paramref name="time"/> as ISO 8601 with milliseconds: <c>2026-12-01T09:30:00.000Z</c>.</summary>
    public static string UtcStamp(TimeProvider time)
    {
        ArgumentNullException.ThrowIfNull(time);
        return time.GetUtcNow().UtcDateTime.ToString("yyyy-MM-ddTHH:mm:ss.fffZ", CultureInfo.InvariantCulture);
    }
}

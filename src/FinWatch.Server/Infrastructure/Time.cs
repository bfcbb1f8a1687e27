namespace FinWatch.Server.Infrastructure;

/// <summary>The database stores UTC epoch milliseconds; the API shows UTC ISO 8601 times ending in Z.</summary>
public static class Time
{
    public static DateTime FromMs(long ms) => DateTimeOffset.FromUnixTimeMilliseconds(ms).UtcDateTime;

    public static long ToMs(DateTimeOffset time) => time.ToUnixTimeMilliseconds();
}

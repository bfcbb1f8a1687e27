using System.Globalization;

namespace FinWatch.Server.Infrastructure;

/// <summary>The times of the files FinWatch reads (measured at, tested at): ISO 8601 with a zone.</summary>
public static class ZonedTime
{
    /// <summary>Why a text is refused as a time: its form.</summary>
    public const string NotZoned = "not an ISO 8601 time with a zone, such as 2026-11-20T09:30:00Z";

    private static readonly DateTimeOffset Earliest = new(2000, 1, 1, 0, 0, 0, TimeSpan.Zero);

    /// <summary>
    /// Why <paramref name="text"/> is not the time of something that has happened (an ISO 8601 time with a zone, from
    /// 2000 up to five minutes past the server clock), or null when it is; <paramref name="at"/> is then that time in UTC.
    /// </summary>
    public static string? ProblemWithPastTime(string text, DateTimeOffset now, out DateTimeOffset at)
    {
        if (!TryParse(text, out at))
        {
            return NotZoned;
        }

        if (at > now.AddMinutes(5) || at < Earliest)
        {
            return $"the time lies in the future (server clock {now:u}) or before 2000";
        }

        at = at.ToUniversalTime();
        return null;
    }

    /// <summary>An ISO 8601 time with a zone ("Z" or an offset); a date alone or a local time is refused as ambiguous.</summary>
    public static bool TryParse(string value, out DateTimeOffset at) =>
        TryParseUtcFast(value, out at)
        || (DateTimeOffset.TryParse(value, CultureInfo.InvariantCulture, DateTimeStyles.None, out at) && HasZone(value));

    // The form metrology tools write, 2026-11-03T14:05:00Z, parsed without the general parser (it is the hot path of a
    // million-row file); anything else goes through DateTimeOffset.TryParse.
    private static bool TryParseUtcFast(string v, out DateTimeOffset at)
    {
        at = default;
        if (v.Length != 20 || v[4] != '-' || v[7] != '-' || v[10] != 'T' || v[13] != ':' || v[16] != ':' || v[19] != 'Z')
        {
            return false;
        }

        static int Digits(string v, int start, int count)
        {
            var n = 0;
            for (var i = start; i < start + count; i++)
            {
                var d = v[i] - '0';
                if (d is < 0 or > 9)
                {
                    return -1;
                }

                n = (n * 10) + d;
            }

            return n;
        }

        int year = Digits(v, 0, 4), month = Digits(v, 5, 2), day = Digits(v, 8, 2);
        int hour = Digits(v, 11, 2), minute = Digits(v, 14, 2), second = Digits(v, 17, 2);
        if (year < 1 || month is < 1 or > 12 || day < 1 || day > DateTime.DaysInMonth(year, month)
            || hour is < 0 or > 23 || minute is < 0 or > 59 || second is < 0 or > 59)
        {
            return false;
        }

        at = new DateTimeOffset(year, month, day, hour, minute, second, TimeSpan.Zero);
        return true;
    }

    // A zone is "Z" or a +hh:mm / -hh:mm offset after the time; a date alone or a local time is ambiguous.
    private static bool HasZone(string value)
    {
        var t = value.IndexOf('T', StringComparison.OrdinalIgnoreCase);
        if (t < 0)
        {
            t = value.IndexOf(' ', StringComparison.Ordinal);
        }

        if (t < 0)
        {
            return false;
        }

        var time = value.AsSpan(t + 1);
        return time.EndsWith("Z", StringComparison.OrdinalIgnoreCase) || time.Contains('+') || time.Contains('-');
    }
}

using System.Diagnostics.CodeAnalysis;

namespace FinWatch.Server.Features.Reports;

/// <summary>One shift on one date: it belongs to the date it starts on; start inclusive, end exclusive, UTC.</summary>
public sealed record ShiftWindow(string Name, DateOnly Date, DateTimeOffset Start, DateTimeOffset End)
{
    public long StartMs => Start.ToUnixTimeMilliseconds();
    public long EndMs => End.ToUnixTimeMilliseconds();
}

/// <summary>Turns a date and a shift name of the pattern into UTC times, in the configured zone.</summary>
public static class ShiftCalendar
{
    public static bool TryZone(string? id, [NotNullWhen(true)] out TimeZoneInfo? zone)
    {
        zone = null;
        if (string.IsNullOrWhiteSpace(id))
        {
            return false;
        }

        try
        {
            zone = TimeZoneInfo.FindSystemTimeZoneById(id);
            return true;
        }
        catch (Exception e) when (e is TimeZoneNotFoundException or InvalidTimeZoneException)
        {
            return false;
        }
    }

    /// <summary>
    /// The shift <paramref name="shift"/> that starts on <paramref name="date"/> (local to the zone). A start time
    /// that a daylight-saving change skips moves on by the change; an ambiguous one is read as standard time. The
    /// length is elapsed time, so a shift across a change keeps its hours.
    /// </summary>
    public static ShiftWindow Window(ShiftDefinition shift, DateOnly date, TimeZoneInfo zone)
    {
        var local = date.ToDateTime(shift.StartTime, DateTimeKind.Unspecified);
        if (zone.IsInvalidTime(local))
        {
            local = local.AddHours(1);
        }

        var start = new DateTimeOffset(TimeZoneInfo.ConvertTimeToUtc(local, zone), TimeSpan.Zero);
        return new ShiftWindow(shift.Name, date, start, start.AddHours(shift.LengthHours));
    }

    /// <summary>The last shift that has finished at <paramref name="now"/> (the one a handover report is about).</summary>
    public static ShiftWindow LastFinished(IReadOnlyList<ShiftDefinition> pattern, TimeZoneInfo zone, DateTimeOffset now)
    {
        var today = DateOnly.FromDateTime(TimeZoneInfo.ConvertTime(now, zone).DateTime);
        return Enumerable.Range(-3, 4).SelectMany(d => pattern.Select(s => Window(s, today.AddDays(d), zone)))
            .Where(w => w.End <= now).OrderBy(w => w.End).ThenBy(w => w.Start).Last();
    }
}

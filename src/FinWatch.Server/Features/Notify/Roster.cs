using System.Globalization;
using FinWatch.Data;
using FinWatch.Server.Features.Access;
using FinWatch.Server.Features.Reports;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Notify;

/// <summary>Who is on shift at a moment: the shift of the pattern running then, and the roster's people for its date.</summary>
public sealed record OnShift(ShiftWindow? Shift, IReadOnlyList<OnShiftPerson> People)
{
    public IReadOnlyList<string> Supervisors => [.. People.Where(p => p.IsSupervisor).Select(p => p.Name)];
}

/// <summary>A person on shift, with their role; supervisors and above can take an escalation.</summary>
public sealed record OnShiftPerson(string Name, string Role)
{
    public bool IsSupervisor => Array.IndexOf(Roles.Ladder, Role) >= Array.IndexOf(Roles.Ladder, Roles.Supervisor);
}

public static class Roster
{
    public const string DateFormat = "yyyy-MM-dd";

    /// <summary>The shift running at <paramref name="at"/> (the latest started, if two overlap), or null in a gap of the pattern.</summary>
    public static ShiftWindow? Running(IReadOnlyList<ShiftDefinition> pattern, TimeZoneInfo zone, DateTimeOffset at)
    {
        var today = DateOnly.FromDateTime(TimeZoneInfo.ConvertTime(at, zone).DateTime);
        return Enumerable.Range(-2, 3).SelectMany(d => pattern.Select(s => ShiftCalendar.Window(s, today.AddDays(d), zone)))
            .Where(w => w.Start <= at && at < w.End).OrderBy(w => w.Start).LastOrDefault();
    }

    /// <summary>The roster's people (enabled accounts) of the shift running at <paramref name="at"/>, in name order.</summary>
    public static async Task<OnShift> AtAsync(FinWatchDbContext db, ShiftOptions shifts, DateTimeOffset at, CancellationToken cancellationToken)
    {
        var zone = ShiftCalendar.TryZone(shifts.TimeZone, out var z) ? z : TimeZoneInfo.Utc;
        var window = Running(shifts.EffectivePattern, zone, at);
        if (window is null)
        {
            return new OnShift(null, []);
        }

        var day = window.Date.ToString(DateFormat, CultureInfo.InvariantCulture);
        // Dates are ISO strings, so their order is the calendar's.
        var names = await db.Roster.AsNoTracking()
            .Where(r => r.Shift == window.Name && string.Compare(r.FromDate, day) <= 0 && (r.ToDate == null || string.Compare(r.ToDate, day) >= 0))
            .Select(r => r.Person).Distinct().ToListAsync(cancellationToken);
        var people = await db.Users.AsNoTracking().Where(u => names.Contains(u.UserName!) && u.DisabledAtMs == null)
            .OrderBy(u => u.UserName).Select(u => new OnShiftPerson(u.UserName!, u.Role)).ToListAsync(cancellationToken);
        return new OnShift(window, people);
    }
}

using System.Globalization;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Features.Reports;

/// <summary>
/// The shift pattern (section "FinWatch:Shifts"): named shifts, each with a start time of day and a length, in one
/// time zone. A shift belongs to the date it starts on, so a night shift from 22:00 runs into the next day.
/// </summary>
public sealed class ShiftOptions
{
    public const string Section = "FinWatch:Shifts";

    /// <summary>IANA (or Windows) time-zone id the start times are read in.</summary>
    public string TimeZone { get; set; } = "UTC";

    /// <summary>The shifts; empty means the default three 8-hour shifts (a configured list replaces them, it does not add to them).</summary>
    public List<ShiftDefinition> Pattern { get; set; } = [];

    /// <summary>Fewer points than this in a window leave its Cpk empty, with the reason.</summary>
    public int CapabilityMinPoints { get; set; } = 5;

    /// <summary>How many of the largest predicted |ΔVT sat| points the report lists.</summary>
    public int TopRisks { get; set; } = 10;

    public static IReadOnlyList<ShiftDefinition> DefaultPattern { get; } =
    [
        new() { Name = "early", Start = "06:00", LengthHours = 8 },
        new() { Name = "late", Start = "14:00", LengthHours = 8 },
        new() { Name = "night", Start = "22:00", LengthHours = 8 },
    ];

    /// <summary>The configured pattern, or the default one.</summary>
    public IReadOnlyList<ShiftDefinition> EffectivePattern => Pattern.Count > 0 ? Pattern : DefaultPattern;
}

/// <summary>One shift of the pattern: its name, start time of day ("HH:mm" in the configured zone) and length in hours.</summary>
public sealed class ShiftDefinition
{
    public string Name { get; set; } = "";
    public string Start { get; set; } = "";
    public double LengthHours { get; set; }

    public TimeOnly StartTime => TimeOnly.ParseExact(Start, "HH:mm", CultureInfo.InvariantCulture);
}

/// <summary>Checks the shift pattern at start: unique names, valid start times and lengths, a known time zone.</summary>
public sealed class ShiftOptionsValidator : IValidateOptions<ShiftOptions>
{
    public ValidateOptionsResult Validate(string? name, ShiftOptions options)
    {
        var failures = new List<string>();
        if (!ShiftCalendar.TryZone(options.TimeZone, out _))
        {
            failures.Add($"{ShiftOptions.Section}:TimeZone '{options.TimeZone}' is not a time zone this machine knows (use an IANA id such as 'Europe/Berlin' or 'UTC')");
        }

        foreach (var (shift, i) in options.EffectivePattern.Select((s, i) => (s, i)))
        {
            var where = $"{ShiftOptions.Section}:Pattern:{i}";
            if (string.IsNullOrWhiteSpace(shift.Name) || shift.Name.Length > 32 || !shift.Name.All(c => char.IsAsciiLetterOrDigit(c) || c is '-' or '_'))
            {
                failures.Add($"{where}:Name '{shift.Name}' must be 1 to 32 letters, digits, '-' or '_'");
            }

            if (!TimeOnly.TryParseExact(shift.Start, "HH:mm", CultureInfo.InvariantCulture, DateTimeStyles.None, out _))
            {
                failures.Add($"{where}:Start '{shift.Start}' is not a time of day HH:mm");
            }

            if (!(shift.LengthHours > 0 && shift.LengthHours <= 24))
            {
                failures.Add($"{where}:LengthHours {shift.LengthHours.ToString(CultureInfo.InvariantCulture)} must be above 0 and at most 24");
            }
        }

        var twice = options.EffectivePattern.GroupBy(s => s.Name, StringComparer.OrdinalIgnoreCase).Where(g => g.Count() > 1).Select(g => g.Key).ToList();
        if (twice.Count > 0)
        {
            failures.Add($"{ShiftOptions.Section}:Pattern names a shift more than once: {string.Join(", ", twice)}");
        }

        if (options.CapabilityMinPoints is < 2 or > 10_000)
        {
            failures.Add($"{ShiftOptions.Section}:CapabilityMinPoints is 2 to 10000");
        }

        if (options.TopRisks is < 1 or > 1000)
        {
            failures.Add($"{ShiftOptions.Section}:TopRisks is 1 to 1000");
        }

        return failures.Count > 0 ? ValidateOptionsResult.Fail(failures) : ValidateOptionsResult.Success;
    }
}

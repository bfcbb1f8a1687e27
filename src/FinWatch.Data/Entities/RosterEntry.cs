namespace FinWatch.Data.Entities;

/// <summary>
/// One line of the roster: a person works a shift of the configured pattern (by its name), from a date and optionally
/// until a date (inclusive, in the pattern's zone). Who is on shift at a moment is the roster's people of the shift that
/// is running then.
/// </summary>
public sealed class RosterEntry
{
    public long Id { get; set; }

    /// <summary>The shift's name in the pattern.</summary>
    public required string Shift { get; set; }

    /// <summary>The person (user name).</summary>
    public required string Person { get; set; }

    /// <summary>First date (YYYY-MM-DD) the person works this shift.</summary>
    public required string FromDate { get; set; }

    /// <summary>Last date (YYYY-MM-DD), or null for until further notice.</summary>
    public string? ToDate { get; set; }
}

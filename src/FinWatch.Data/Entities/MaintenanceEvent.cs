using FinWatch.Physics;

namespace FinWatch.Data.Entities;

/// <summary>
/// One maintenance of a process chamber or of a whole tool: when it happened, what was done, who did it, and who
/// recorded it when. <see cref="Chamber"/> is the name the measurements carry (an etch or liner chamber, or a tool),
/// so a chart's points find the maintenance of their own chamber.
/// </summary>
public sealed class MaintenanceEvent
{
    public long Id { get; set; }

    /// <summary>The chamber or tool, as named in the measurements (<c>etch_chamber</c>, <c>liner_chamber</c> or a tool).</summary>
    public required string Chamber { get; set; }

    /// <summary>What was done; stored as <see cref="MaintenanceKindText"/>.</summary>
    public MaintenanceKind Kind { get; set; }

    /// <summary>When the maintenance was done (its end, when the chamber went back to production), UTC epoch ms.</summary>
    public long OccurredAtMs { get; set; }

    /// <summary>Who did the work (a person or a team).</summary>
    public required string PerformedBy { get; set; }

    public string Note { get; set; } = "";

    /// <summary>The signed-in person who recorded it, and when (UTC epoch ms).</summary>
    public required string RecordedBy { get; set; }

    public long RecordedAtMs { get; set; }

    /// <summary>How it was recorded: the form or API (<c>api</c>) or the name of an imported file.</summary>
    public required string Source { get; set; }
}

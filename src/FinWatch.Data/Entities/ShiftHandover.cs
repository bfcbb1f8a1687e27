namespace FinWatch.Data.Entities;

/// <summary>
/// The handover of one shift (a shift name of the pattern on the date it starts on): the notes the outgoing supervisor
/// writes, and the sign-off of the outgoing and of the incoming supervisor, each with who and when (UTC epoch ms).
/// The notes are locked once the outgoing supervisor has signed; the incoming supervisor signs after the outgoing one
/// and is another person.
/// </summary>
public sealed class ShiftHandover
{
    /// <summary>Longest handover notes, characters.</summary>
    public const int MaxNotesLength = 4000;

    public long Id { get; set; }

    /// <summary>The date the shift starts on, YYYY-MM-DD in the pattern's zone.</summary>
    public required string ShiftDate { get; set; }

    /// <summary>The shift's name in the pattern.</summary>
    public required string Shift { get; set; }

    /// <summary>When the shift starts, UTC epoch ms (to list handovers in time order).</summary>
    public long ShiftStartMs { get; set; }

    public string Notes { get; set; } = "";

    /// <summary>Who last wrote the notes, and when.</summary>
    public string? NotesBy { get; set; }

    public long? NotesAtMs { get; set; }

    public string? OutgoingBy { get; set; }

    public long? OutgoingAtMs { get; set; }

    public string? IncomingBy { get; set; }

    public long? IncomingAtMs { get; set; }
}

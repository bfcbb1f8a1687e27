using FinWatch.Data.Entities;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features.Reports;

/// <summary>
/// The handover of one shift: the outgoing supervisor's notes (who wrote them last, when) and the two sign-offs. The
/// notes are locked once the outgoing supervisor has signed (<c>notes_locked</c>). Empty notes and null sign-offs when
/// nothing is stored yet.
/// </summary>
public sealed record ShiftHandoverResponse(string Shift, DateOnly Date, string Notes, string? NotesBy, DateTimeOffset? NotesAt,
    HandoverSignature? Outgoing, HandoverSignature? Incoming, bool NotesLocked)
{
    public static ShiftHandoverResponse Of(ShiftWindow w, ShiftHandover? h) => new(w.Name, w.Date, h?.Notes ?? "", h?.NotesBy,
        At(h?.NotesAtMs), Signature(h?.OutgoingBy, h?.OutgoingAtMs), Signature(h?.IncomingBy, h?.IncomingAtMs), h?.OutgoingBy is not null);

    private static DateTimeOffset? At(long? ms) => ms is { } v ? DateTimeOffset.FromUnixTimeMilliseconds(v) : null;

    private static HandoverSignature? Signature(string? by, long? atMs) => by is null || atMs is null ? null : new(by, DateTimeOffset.FromUnixTimeMilliseconds(atMs.Value));
}

/// <summary>Who signed (the signed-in person) and when.</summary>
public sealed record HandoverSignature(string By, DateTimeOffset At);

/// <summary>The outgoing supervisor's notes for the incoming shift: text, up to 4000 characters, may be empty.</summary>
public sealed record HandoverNotesRequest(string? Notes) : IValidatedRequest
{
    public void Validate(ValidationErrors errors)
    {
        if (Notes is null)
        {
            errors["notes"] = "notes is required: the handover notes as text (an empty text clears them)";
        }
        else if (Notes.Length > ShiftHandover.MaxNotesLength)
        {
            errors["notes"] = $"notes are {Notes.Length} characters long; the most is {ShiftHandover.MaxNotesLength}";
        }
    }
}

/// <summary>A sign-off: <c>role</c> is <c>outgoing</c> (the supervisor handing over) or <c>incoming</c> (the one taking over).</summary>
public sealed record HandoverSignOffRequest(string? Role) : IValidatedRequest
{
    public const string Outgoing = "outgoing";
    public const string Incoming = "incoming";

    public void Validate(ValidationErrors errors)
    {
        if (Role is null)
        {
            errors["role"] = "role is required: outgoing (handing over) or incoming (taking over)";
        }
        else if (Role is not (Outgoing or Incoming))
        {
            errors["role"] = $"role '{Role}' is not known; use outgoing (handing over) or incoming (taking over)";
        }
    }
}

using System.Globalization;
using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Server.Features.Access;
using FinWatch.Server.Features.Audit;
using FinWatch.Server.Infrastructure;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Features.Reports;

/// <summary>
/// The handover of a shift: the outgoing supervisor's notes and the sign-offs of the outgoing and the incoming
/// supervisor (supervisors and up write and sign; everyone signed in reads). Rules: notes and sign-offs only once the
/// shift has started; the outgoing supervisor signs notes that are not empty, and then they are locked; the incoming
/// supervisor signs after the outgoing one and is another person; each sign-off once. Every change is an audit entry.
/// </summary>
public static class HandoverEndpoints
{
    /// <summary>The audit trail's entity name for a handover; its key is "date/shift".</summary>
    public const string AuditEntity = "handover";

    public static void Map(IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/reports/shift/handover").WithTags("Reports").ValidateRequests();
        group.MapGet("/", GetAsync).RequireAuthorization(Permissions.Read)
            .WithSummary("The handover of a shift: notes and sign-offs (date and shift as for the report; neither gives the last finished shift)");
        group.MapPut("/", WriteNotesAsync).RequireAuthorization(Permissions.Disposition)
            .WithSummary("Write the handover notes of a shift (supervisors and up); refused once the outgoing supervisor has signed");
        group.MapPost("/sign-off", SignAsync).RequireAuthorization(Permissions.Disposition)
            .WithSummary("Sign the handover as the outgoing or the incoming supervisor (the signed-in person; not both)");
    }

    private static async Task<Results<Ok<ShiftHandoverResponse>, ValidationProblem>> GetAsync(
        string? date, string? shift, FinWatchDbContext db, IOptions<ShiftOptions> options, TimeProvider clock, CancellationToken cancellationToken)
    {
        var (w, errors) = ReportEndpoints.Resolve(date, shift, options.Value, clock);
        return w is null ? ReportEndpoints.Invalid(errors!) : TypedResults.Ok(ShiftHandoverResponse.Of(w, await FindAsync(db, w, cancellationToken)));
    }

    private static Task<Results<Ok<ShiftHandoverResponse>, ValidationProblem, ProblemHttpResult>> WriteNotesAsync(
        string? date, string? shift, HandoverNotesRequest request, FinWatchDbContext db, IOptions<ShiftOptions> options, TimeProvider clock,
        HttpContext http, CancellationToken cancellationToken) =>
        ChangeAsync(date, shift, db, options.Value, clock, http, (w, stored, who, now) =>
        {
            if (stored?.OutgoingBy is not null)
            {
                return Conflict("The handover notes are locked.",
                    $"The notes of the {w.Name} shift of {Day(w)} were signed by the outgoing supervisor {stored.OutgoingBy} at {Utc(stored.OutgoingAtMs!.Value)}; they can no longer be changed.");
            }

            var h = stored ?? New(db, w);
            (h.Notes, h.NotesBy, h.NotesAtMs) = (request.Notes!, who, now);
            return (h, "notes_written");
        }, cancellationToken);

    private static Task<Results<Ok<ShiftHandoverResponse>, ValidationProblem, ProblemHttpResult>> SignAsync(
        string? date, string? shift, HandoverSignOffRequest request, FinWatchDbContext db, IOptions<ShiftOptions> options, TimeProvider clock,
        HttpContext http, CancellationToken cancellationToken) =>
        ChangeAsync(date, shift, db, options.Value, clock, http, (w, stored, who, now) =>
        {
            var what = $"the {w.Name} shift of {Day(w)}";
            if (request.Role == HandoverSignOffRequest.Outgoing)
            {
                if (stored?.OutgoingBy is not null)
                {
                    return Conflict("The outgoing supervisor has signed already.", $"{stored.OutgoingBy} signed the handover of {what} as outgoing supervisor at {Utc(stored.OutgoingAtMs!.Value)}.");
                }

                if (stored is null || string.IsNullOrWhiteSpace(stored.Notes))
                {
                    return Conflict("There are no handover notes to sign.", $"Write the handover notes of {what} before signing as the outgoing supervisor; the incoming supervisor reads them.");
                }

                (stored.OutgoingBy, stored.OutgoingAtMs) = (who, now);
                return (stored, "signed_outgoing");
            }

            if (stored?.OutgoingBy is null)
            {
                return Conflict("The outgoing supervisor has not signed yet.", $"The outgoing supervisor signs the handover of {what} first; then the incoming supervisor.");
            }

            if (stored.IncomingBy is not null)
            {
                return Conflict("The incoming supervisor has signed already.", $"{stored.IncomingBy} signed the handover of {what} as incoming supervisor at {Utc(stored.IncomingAtMs!.Value)}.");
            }

            if (string.Equals(stored.OutgoingBy, who, StringComparison.Ordinal))
            {
                return Problems.Forbidden("The same person cannot sign both sides of a handover.",
                    $"{who} signed the handover of {what} as the outgoing supervisor; the incoming supervisor must be another person and sign in as themselves.");
            }

            (stored.IncomingBy, stored.IncomingAtMs) = (who, now);
            return (stored, "signed_incoming");
        }, cancellationToken);

    /// <summary>A change decided by <c>decide</c> from the stored handover (null when none): the changed row and its audit action, or a refusal.</summary>
    private delegate Decision Decide(ShiftWindow w, ShiftHandover? stored, string who, long nowMs);

    private readonly record struct Decision(ShiftHandover? Changed, string Action, ProblemHttpResult? Refusal)
    {
        public static implicit operator Decision((ShiftHandover Changed, string Action) change) => new(change.Changed, change.Action, null);

        public static implicit operator Decision(ProblemHttpResult refusal) => new(null, "", refusal);
    }

    // Writing and signing: a named shift that has started, the rule of the change, then the row and its audit entry in one save.
    private static async Task<Results<Ok<ShiftHandoverResponse>, ValidationProblem, ProblemHttpResult>> ChangeAsync(string? date, string? shift,
        FinWatchDbContext db, ShiftOptions options, TimeProvider clock, HttpContext http, Decide decide, CancellationToken cancellationToken)
    {
        var (w, errors) = Required(date, shift, options, clock);
        if (w is null)
        {
            return ReportEndpoints.Invalid(errors!);
        }

        if (clock.GetUtcNow() < w.Start)
        {
            return Conflict("The shift has not started yet.", $"The {w.Name} shift of {Day(w)} starts at {Utc(w.StartMs)}; its handover is written and signed from then on.");
        }

        var stored = await FindAsync(db, w, cancellationToken);
        var before = stored is null ? null : ShiftHandoverResponse.Of(w, stored);
        var (h, action, refusal) = decide(w, stored, http.User.Who(), clock.GetUtcNow().ToUnixTimeMilliseconds());
        if (refusal is not null)
        {
            return refusal;
        }

        if (h!.Id != 0)
        {
            db.ShiftHandovers.Update(h);
        }

        var after = ShiftHandoverResponse.Of(w, h);
        AuditLog.Add(db, http.User.Who(), AuditEntity, $"{Day(w)}/{w.Name}", action, before, after, clock);
        try
        {
            await db.SaveChangesAsync(cancellationToken);
        }
        catch (DbUpdateException)
        {
            // The unique (date, shift) index: someone else stored this shift's first notes at the same moment.
            return Conflict("Someone else saved this handover at the same moment.", $"Reload the handover of the {w.Name} shift of {Day(w)} and try again.");
        }

        return TypedResults.Ok(after);
    }

    /// <summary>The stored handover of the shift, or null.</summary>
    public static Task<ShiftHandover?> FindAsync(FinWatchDbContext db, ShiftWindow w, CancellationToken cancellationToken)
    {
        var day = Day(w);
        return db.ShiftHandovers.AsNoTracking().FirstOrDefaultAsync(h => h.ShiftDate == day && h.Shift == w.Name, cancellationToken);
    }

    private static ShiftHandover New(FinWatchDbContext db, ShiftWindow w)
    {
        var h = new ShiftHandover { ShiftDate = Day(w), Shift = w.Name, ShiftStartMs = w.StartMs };
        db.ShiftHandovers.Add(h);
        return h;
    }

    // Writing and signing need a named shift: no default here, unlike reading.
    private static (ShiftWindow? Window, ValidationErrors? Errors) Required(string? date, string? shift, ShiftOptions options, TimeProvider clock) =>
        date is null && shift is null
            ? (null, new ValidationErrors { ["date"] = "date is required: the date (YYYY-MM-DD) the shift starts on", ["shift"] = $"shift is required: one of {string.Join(", ", options.EffectivePattern.Select(s => s.Name))}" })
            : ReportEndpoints.Resolve(date, shift, options, clock);

    private static ProblemHttpResult Conflict(string title, string detail) => TypedResults.Problem(title: title, detail: detail,
        statusCode: StatusCodes.Status409Conflict, type: "/problems/handover-conflict");

    private static string Day(ShiftWindow w) => w.Date.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);

    private static string Utc(long ms) => DateTimeOffset.FromUnixTimeMilliseconds(ms).UtcDateTime.ToString("yyyy-MM-dd HH:mm 'UTC'", CultureInfo.InvariantCulture);
}

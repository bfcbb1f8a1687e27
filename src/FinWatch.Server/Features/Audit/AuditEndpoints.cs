using System.Globalization;
using System.Text;
using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Server.Infrastructure;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Audit;

public sealed record AuditResponse(long Id, DateTimeOffset At, string By, string Entity, string Key, string Action, string? Before, string? After);

/// <summary>Reading the audit trail (page and CSV export). Nothing in FinWatch writes to it except <see cref="AuditLog"/>.</summary>
public static class AuditEndpoints
{
    public static void Map(IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/audit").WithTags("Audit");
        group.MapGet("/", ListAsync).WithSummary("Changes, newest first; filter by entity, key, who and time");
        group.MapGet("/csv", CsvAsync).WithSummary("The same as CSV (RFC 4180), oldest first, for export");
    }

    private static IQueryable<AuditEntry> Filter(FinWatchDbContext db, string? entity, string? key, string? by, DateTimeOffset? from, DateTimeOffset? to)
    {
        var q = db.AuditEntries.AsNoTracking();
        if (!string.IsNullOrWhiteSpace(entity))
        {
            q = q.Where(a => a.Entity == entity);
        }

        if (!string.IsNullOrWhiteSpace(key))
        {
            q = q.Where(a => a.Key.Contains(key));
        }

        if (!string.IsNullOrWhiteSpace(by))
        {
            q = q.Where(a => a.By == by);
        }

        if (from is { } f)
        {
            var ms = f.ToUnixTimeMilliseconds();
            q = q.Where(a => a.AtMs >= ms);
        }

        if (to is { } t)
        {
            var ms = t.ToUnixTimeMilliseconds();
            q = q.Where(a => a.AtMs <= ms);
        }

        return q;
    }

    private static AuditResponse Describe(AuditEntry a) =>
        new(a.Id, DateTimeOffset.FromUnixTimeMilliseconds(a.AtMs), a.By, a.Entity, a.Key, a.Action, a.BeforeJson, a.AfterJson);

    private static async Task<Ok<List<AuditResponse>>> ListAsync(FinWatchDbContext db, string? entity, string? key, string? by, DateTimeOffset? from, DateTimeOffset? to,
        int? limit, CancellationToken cancellationToken)
    {
        var rows = await Filter(db, entity, key, by, from, to).OrderByDescending(a => a.Id).Take(Math.Clamp(limit ?? 500, 1, 10_000)).ToListAsync(cancellationToken);
        return TypedResults.Ok(rows.Select(Describe).ToList());
    }

    private static async Task<FileContentHttpResult> CsvAsync(FinWatchDbContext db, string? entity, string? key, string? by, DateTimeOffset? from, DateTimeOffset? to,
        CancellationToken cancellationToken)
    {
        var sb = new StringBuilder("id,at_utc,by,entity,key,action,before_json,after_json\n");
        await foreach (var a in Filter(db, entity, key, by, from, to).OrderBy(a => a.Id).AsAsyncEnumerable().WithCancellation(cancellationToken))
        {
            sb.AppendJoin(',', a.Id.ToString(CultureInfo.InvariantCulture), DateTimeOffset.FromUnixTimeMilliseconds(a.AtMs).ToString("yyyy-MM-ddTHH:mm:ss.fffZ", CultureInfo.InvariantCulture),
                Quote(a.By), Quote(a.Entity), Quote(a.Key), Quote(a.Action), Quote(a.BeforeJson), Quote(a.AfterJson)).Append('\n');
        }

        return TypedResults.File(Encoding.UTF8.GetBytes(sb.ToString()), "text/csv; charset=utf-8", "finwatch-audit.csv");
    }

    /// <summary>A text field (<see cref="CsvField"/>); a leading = + - @ is prefixed with ' so a spreadsheet does not run it as a formula.</summary>
    public static string Quote(string? value) =>
        CsvField.Of(value is [ '=' or '+' or '-' or '@', ..] ? "'" + value : value);
}

using FinWatch.Data;
using FinWatch.Server.Features.Access;
using FinWatch.Server.Features.Audit;
using FinWatch.Server.Infrastructure;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Features.Monitor;

/// <summary>A context's limit versions: computed as drafts from chosen points, approved (frozen) by an engineer.</summary>
public static class LimitEndpoints
{
    public static void Map(IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/contexts/{code}").WithTags("Monitor");
        group.MapGet("/limits", LimitsAsync).WithSummary("Every limit version of the context, newest first");
        group.MapPost("/limits", ComputeLimitsAsync).RequireAuthorization(Permissions.Engineer).WithSummary("Compute a draft limit version from chosen points");
        group.MapPost("/limits/{version:int}/approve", ApproveAsync).RequireAuthorization(Permissions.Engineer).WithSummary("Approve (freeze) a draft limit version");
    }

    private static async Task<Results<Ok<List<LimitResponse>>, ProblemHttpResult>> LimitsAsync(string code, FinWatchDbContext db, CancellationToken cancellationToken)
    {
        var context = await db.ChartContexts.AsNoTracking().SingleOrDefaultAsync(c => c.Code == code, cancellationToken);
        if (context is null)
        {
            return ContextEndpoints.NotFound(code);
        }

        var versions = await db.LimitVersions.AsNoTracking().Where(l => l.ContextId == context.Id).OrderByDescending(l => l.Version).ToListAsync(cancellationToken);
        return TypedResults.Ok(versions.Select(v => BaselineLimits.Describe(context, v)).ToList());
    }

    private static async Task<Results<Created<LimitResponse>, ValidationProblem, ProblemHttpResult>> ComputeLimitsAsync(
        string code, LimitComputeRequest r, HttpContext http, FinWatchDbContext db, TimeProvider clock, CancellationToken cancellationToken)
    {
        var context = await db.ChartContexts.AsNoTracking().SingleOrDefaultAsync(c => c.Code == code, cancellationToken);
        if (context is null)
        {
            return ContextEndpoints.NotFound(code);
        }

        var from = r.FromSeq ?? 1;
        var to = r.ToSeq ?? long.MaxValue;
        var points = await db.ChartPoints.AsNoTracking().Where(p => p.ContextId == context.Id && p.Seq >= from && p.Seq <= to)
            .OrderBy(p => p.Seq).ToListAsync(cancellationToken);
        var errors = new ValidationErrors();
        var exclude = r.Exclude ?? [];
        var seqs = points.Select(p => p.Seq).ToHashSet();
        var badExclusions = exclude.Where(e => !seqs.Contains(e.Seq) || string.IsNullOrWhiteSpace(e.Reason)).Select(e => e.Seq).ToList();
        if (badExclusions.Count > 0)
        {
            errors["exclude"] = $"each excluded point needs a seq in the chosen range and a reason; not so for {string.Join(", ", badExclusions)}";
        }

        if (string.IsNullOrWhiteSpace(r.Reason))
        {
            errors["reason"] = "say why these limits are computed (kept with the version)";
        }

        var used = points.Where(p => !exclude.Any(e => e.Seq == p.Seq)).ToList();
        var (centre, sigma) = BaselineLimits.Estimate(context, used);
        if (sigma is not > 0)
        {
            errors["points"] = $"{used.Count} usable points in seq {from}..{(r.ToSeq is null ? "last" : r.ToSeq)}: too few to estimate σ (an xbar chart needs a subgroup of 2 or more sites, an individuals chart 2 points)";
        }

        if (errors.Count > 0)
        {
            return Problems.Invalid(errors);
        }

        var version = 1 + (await db.LimitVersions.Where(l => l.ContextId == context.Id).MaxAsync(l => (int?)l.Version, cancellationToken) ?? 0);
        var limit = BaselineLimits.Draft(context, version, centre, sigma!.Value, used, exclude, http.User.Who(),
            clock.GetUtcNow().ToUnixTimeMilliseconds(), r.Reason!.Trim());
        BaselineLimits.Check(context, limit, used);
        db.LimitVersions.Add(limit);
        await db.SaveChangesAsync(cancellationToken);
        AuditLog.Add(db, http.User.Who(), "limits", $"{code} v{version}", "computed", null, BaselineLimits.Describe(context, limit), clock);
        await db.SaveChangesAsync(cancellationToken);
        return TypedResults.Created($"/api/contexts/{Uri.EscapeDataString(code)}/limits", BaselineLimits.Describe(context, limit));
    }

    private static async Task<Results<Ok<LimitResponse>, ValidationProblem, ProblemHttpResult>> ApproveAsync(
        string code, int version, ApproveRequest r, HttpContext http, FinWatchDbContext db, TimeProvider clock, MonitorEvaluator evaluator,
        IOptions<MonitorOptions> options, CancellationToken cancellationToken)
    {
        var context = await db.ChartContexts.AsNoTracking().SingleOrDefaultAsync(c => c.Code == code, cancellationToken);
        var limit = context is null ? null : await db.LimitVersions.SingleOrDefaultAsync(l => l.ContextId == context.Id && l.Version == version, cancellationToken);
        if (context is null || limit is null)
        {
            return ContextEndpoints.NotFound($"{code} limits v{version}");
        }

        var now = clock.GetUtcNow();
        var effective = r.EffectiveFrom ?? now;
        if (limit.Status != "draft")
        {
            return Problems.Invalid("version", $"v{version} is {limit.Status}: approved limits are frozen; compute a new version to revise them");
        }

        if (effective > now || effective.ToUnixTimeMilliseconds() < limit.ToMs)
        {
            return Problems.Invalid("effective_from", $"effective_from lies between the last point the limits were computed from ({DateTimeOffset.FromUnixTimeMilliseconds(limit.ToMs):u}) and now");
        }

        if (limit.Verdict == BaselineLimits.NotStable && string.IsNullOrWhiteSpace(r.Justification))
        {
            return Problems.Invalid("justification", $"the baseline of v{version} is not stable ({string.Join("; ", BaselineLimits.Describe(context, limit).Warnings)}); "
                + "write why these limits may be approved anyway, or compute a new version from a stable baseline");
        }

        if (r.Justification is { Length: > 4000 })
        {
            return Problems.Invalid("justification", "the justification is at most 4000 characters");
        }

        var who = http.User.Who();
        if (options.Value.ApproverMustDiffer && string.Equals(limit.ComputedBy, who, StringComparison.OrdinalIgnoreCase))
        {
            return Problems.Forbidden("Limits need a second engineer.",
                $"{code} v{version} was computed by {limit.ComputedBy}; another engineer approves it (four-eyes rule of this site).");
        }

        var before = BaselineLimits.Describe(context, limit);
        limit.Status = "approved";
        limit.Justification = string.IsNullOrWhiteSpace(r.Justification) ? null : r.Justification.Trim();
        limit.ApprovedBy = who;
        limit.ApprovedAtMs = now.ToUnixTimeMilliseconds();
        limit.ApprovalComment = r.Comment?.Trim();
        limit.EffectiveFromMs = effective.ToUnixTimeMilliseconds();
        AuditLog.Add(db, who, "limits", $"{code} v{version}", "approved", before, BaselineLimits.Describe(context, limit), clock);
        await db.SaveChangesAsync(cancellationToken);
        await evaluator.EvaluatePendingAsync(cancellationToken);
        return TypedResults.Ok(BaselineLimits.Describe(context, limit));
    }
}

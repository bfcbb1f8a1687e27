using FinWatch.Server.Features.Audit;
using FinWatch.Server.Features.Access;
using FinWatch.Server.Features.Maintenance;
using System.Text.RegularExpressions;
using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Server.Features.Parameters;
using FinWatch.Server.Infrastructure;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Mvc;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Monitor;

/// <summary>Chart contexts (what a chart watches, its rules and reaction plan, its state) and their points.</summary>
public static partial class ContextEndpoints
{
    public static void Map(IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/contexts").WithTags("Monitor");
        group.MapGet("/", ListAsync).RequireAuthorization(Permissions.Floor).WithSummary("Every chart context with its state, worst first");
        group.MapPost("/", CreateAsync).RequireAuthorization(Permissions.Engineer).WithSummary("Create a chart context (it starts in its baseline phase)");
        group.MapGet("/{code}", GetAsync).RequireAuthorization(Permissions.Floor).WithSummary("One chart context with its limits in force and its state");
        group.MapPut("/{code}", UpdateAsync).RequireAuthorization(Permissions.Engineer).WithSummary("Change a context's title, rules, reaction plan or electrical concern");
        group.MapGet("/{code}/points", PointsAsync).RequireAuthorization(Permissions.Floor).WithSummary("The context's points in order, each with the limits it was judged by");
    }

    [GeneratedRegex("^[A-Za-z0-9][A-Za-z0-9._-]{0,99}$")]
    private static partial Regex CodePattern();

    private static async Task<Ok<List<ContextResponse>>> ListAsync(FinWatchDbContext db, CancellationToken cancellationToken)
    {
        var contexts = await db.ChartContexts.AsNoTracking().ToListAsync(cancellationToken);
        var list = new List<ContextResponse>();
        foreach (var c in contexts)
        {
            list.Add(await DescribeAsync(db, c, cancellationToken));
        }

        return TypedResults.Ok(list.OrderByDescending(c => c.State == ContextStates.OutOfControl).ThenByDescending(c => Array.IndexOf(Severity.Names, c.WorstSeverity))
            .ThenByDescending(c => c.UnacknowledgedAlerts).ThenBy(c => c.Code, StringComparer.Ordinal).ToList());
    }

    private static async Task<Results<Ok<ContextResponse>, ProblemHttpResult>> GetAsync(string code, FinWatchDbContext db, CancellationToken cancellationToken) =>
        await db.ChartContexts.AsNoTracking().SingleOrDefaultAsync(c => c.Code == code, cancellationToken) is { } c
            ? TypedResults.Ok(await DescribeAsync(db, c, cancellationToken))
            : NotFound(code);

    private static async Task<Results<Created<ContextResponse>, ValidationProblem>> CreateAsync(
        ContextRequest r, FinWatchDbContext db, TimeProvider clock, MonitorEvaluator evaluator, HttpContext http, CancellationToken cancellationToken)
    {
        var errors = new ValidationErrors();
        if (r.Code is null || !CodePattern().IsMatch(r.Code))
        {
            errors["code"] = "code is 1 to 100 letters, digits, '.', '_' or '-', starting with a letter or digit";
        }
        else if (await db.ChartContexts.AnyAsync(c => c.Code == r.Code, cancellationToken))
        {
            errors["code"] = $"a context '{r.Code}' exists already";
        }

        var product = r.Product is null ? null : await db.Products.AsNoTracking().SingleOrDefaultAsync(p => p.Code == r.Product, cancellationToken);
        if (product is null)
        {
            errors["product"] = Problems.NotAProduct(r.Product);
        }

        if (string.IsNullOrWhiteSpace(r.Step) || r.Step.Length > 64)
        {
            errors["step"] = "step is required (1 to 64 characters)";
        }

        if (r.Parameter is null || !FinParameters.TryGet(r.Parameter, out _))
        {
            errors["parameter"] = $"'{r.Parameter}' is not a parameter; the parameters are {FinParameters.NameList}";
        }

        if (r.Chamber is { Length: > 64 })
        {
            errors["chamber"] = "chamber is at most 64 characters";
        }

        CheckCommon(r, errors, creating: true);
        if (errors.Count > 0)
        {
            return Problems.Invalid(errors);
        }

        var now = clock.GetUtcNow().ToUnixTimeMilliseconds();
        var context = new ChartContext
        {
            Code = r.Code!, Title = string.IsNullOrWhiteSpace(r.Title) ? $"{r.Product} {r.Step} {r.Parameter}{(r.Chamber is null ? "" : " " + r.Chamber)}" : r.Title.Trim(),
            ProductId = product!.Id, Step = r.Step!.Trim(), Parameter = r.Parameter!, Chamber = string.IsNullOrWhiteSpace(r.Chamber) ? null : r.Chamber.Trim(),
            ChartType = r.ChartType ?? "xbar", Subgroup = r.Subgroup ?? "wafer", Rules = NormaliseRules(r.Rules ?? "westernElectric"),
            ReactionPlan = string.Join('\n', (r.ReactionPlan ?? []).Select(s => s.Trim()).Where(s => s.Length > 0)),
            ElectricalConcernMv = r.ElectricalConcernMv ?? 10, CreatedAtMs = now, UpdatedAtMs = now,
        };
        db.ChartContexts.Add(context);
        await db.SaveChangesAsync(cancellationToken);
        AuditLog.Add(db, http.User.Who(), "context", context.Code, "created", null, await DescribeAsync(db, context, cancellationToken), clock);
        await db.SaveChangesAsync(cancellationToken);
        await evaluator.EvaluatePendingAsync(cancellationToken); // the stored history becomes its baseline points
        var saved = await db.ChartContexts.AsNoTracking().SingleAsync(c => c.Id == context.Id, cancellationToken);
        return TypedResults.Created($"/api/contexts/{Uri.EscapeDataString(context.Code)}", await DescribeAsync(db, saved, cancellationToken));
    }

    private static async Task<Results<Ok<ContextResponse>, ValidationProblem, ProblemHttpResult>> UpdateAsync(
        string code, ContextRequest r, FinWatchDbContext db, TimeProvider clock, HttpContext http, CancellationToken cancellationToken)
    {
        var context = await db.ChartContexts.SingleOrDefaultAsync(c => c.Code == code, cancellationToken);
        if (context is null)
        {
            return NotFound(code);
        }

        var errors = new ValidationErrors();
        CheckCommon(r, errors, creating: false);
        var productCode = await db.Products.Where(p => p.Id == context.ProductId).Select(p => p.Code).SingleAsync(cancellationToken);
        foreach (var (name, given, current) in new[] { ("product", r.Product, (string?)productCode), ("step", r.Step, context.Step), ("parameter", r.Parameter, context.Parameter), ("chamber", r.Chamber, context.Chamber) })
        {
            if (given is not null && given != current)
            {
                errors[name] = $"{name} cannot change: it defines what the chart watches; create a new context instead";
            }
        }

        if (errors.Count > 0)
        {
            return Problems.Invalid(errors);
        }

        var before = await DescribeAsync(db, context, cancellationToken);
        context.Title = string.IsNullOrWhiteSpace(r.Title) ? context.Title : r.Title.Trim();
        context.Rules = r.Rules is null ? context.Rules : NormaliseRules(r.Rules);
        context.ReactionPlan = r.ReactionPlan is null ? context.ReactionPlan : string.Join('\n', r.ReactionPlan.Select(s => s.Trim()).Where(s => s.Length > 0));
        context.ElectricalConcernMv = r.ElectricalConcernMv ?? context.ElectricalConcernMv;
        context.UpdatedAtMs = clock.GetUtcNow().ToUnixTimeMilliseconds();
        var after = await DescribeAsync(db, context, cancellationToken);
        AuditLog.Add(db, http.User.Who(), "context", context.Code, "changed", before, after, clock); // title, rules, reaction plan, concern
        await db.SaveChangesAsync(cancellationToken);
        return TypedResults.Ok(after);
    }

    private static void CheckCommon(ContextRequest r, ValidationErrors errors, bool creating)
    {
        if (r.ChartType is not null && !ContextRules.ChartTypes.Contains(r.ChartType))
        {
            errors["chart_type"] = $"chart_type is {string.Join(" or ", ContextRules.ChartTypes)}";
        }

        if (r.Subgroup is not null && !ContextRules.Subgroups.Contains(r.Subgroup))
        {
            errors["subgroup"] = $"subgroup is {string.Join(" or ", ContextRules.Subgroups)}";
        }

        if (!creating && (r.ChartType is not null || r.Subgroup is not null))
        {
            errors["chart_type"] = "chart type and subgrouping are fixed once points exist; create a new context instead";
        }

        if (r.Rules is not null)
        {
            var bad = r.Rules.Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries)
                .Where(id => !Statistics.Rules.RunRules.TryParse(id, out _)).ToList();
            if (bad.Count > 0 || ContextRules.Parse(r.Rules).Count == 0)
            {
                errors["rules"] = $"unknown rules: {string.Join(", ", bad)}; use WE1..WE4, N1..N8, westernElectric or nelson, comma separated";
            }
        }

        if (r.ReactionPlan is { } plan && (plan.Count > 50 || plan.Any(s => s is null || s.Length > 500)))
        {
            errors["reaction_plan"] = "the reaction plan has at most 50 steps of at most 500 characters";
        }

        if (r.ElectricalConcernMv is { } e && !(e > 0 && e <= 1000))
        {
            errors["electrical_concern_mv"] = "electrical_concern_mv is above 0 and at most 1000 mV";
        }

        if (r.Title is { Length: > 200 })
        {
            errors["title"] = "title is at most 200 characters";
        }
    }

    private static string NormaliseRules(string rules) => string.Join(',', ContextRules.Parse(rules).Select(Statistics.Rules.RunRules.Id));

    private static async Task<Results<Ok<List<PointMessage>>, ProblemHttpResult>> PointsAsync(
        string code, [FromQuery(Name = "after_seq")] long? afterSeq, DateTimeOffset? from, DateTimeOffset? to, int? limit, FinWatchDbContext db, CancellationToken cancellationToken)
    {
        var context = await db.ChartContexts.AsNoTracking().SingleOrDefaultAsync(c => c.Code == code, cancellationToken);
        if (context is null)
        {
            return NotFound(code);
        }

        var q = db.ChartPoints.AsNoTracking().Where(p => p.ContextId == context.Id && p.Seq > (afterSeq ?? 0));
        if (from is { } f)
        {
            var ms = f.ToUnixTimeMilliseconds();
            q = q.Where(p => p.MeasuredAtMs >= ms);
        }

        if (to is { } t)
        {
            var ms = t.ToUnixTimeMilliseconds();
            q = q.Where(p => p.MeasuredAtMs <= ms);
        }

        var max = Math.Clamp(limit ?? 5000, 1, 50_000);
        var points = await q.OrderByDescending(p => p.Seq).Take(max).ToListAsync(cancellationToken);
        var limits = await db.LimitVersions.AsNoTracking().Where(l => l.ContextId == context.Id).ToDictionaryAsync(l => l.Id, cancellationToken);
        return TypedResults.Ok(points.OrderBy(p => p.Seq)
            .Select(p => ContextRules.ToMessage(context, p, p.LimitVersionId is { } id ? limits[id] : null)).ToList());
    }

    internal static async Task<ContextResponse> DescribeAsync(FinWatchDbContext db, ChartContext c, CancellationToken cancellationToken)
    {
        var product = await db.Products.AsNoTracking().Where(p => p.Id == c.ProductId).Select(p => p.Code).SingleAsync(cancellationToken);
        var limit = await db.LimitVersions.AsNoTracking().Where(l => l.ContextId == c.Id && l.Status == "approved")
            .OrderByDescending(l => l.EffectiveFromMs).FirstOrDefaultAsync(cancellationToken);
        var alerts = await db.Alerts.AsNoTracking().Where(a => a.ContextId == c.Id && a.State != AlertStates.Closed).ToListAsync(cancellationToken);
        var recent = await db.ChartPoints.AsNoTracking().Where(p => p.ContextId == c.Id).OrderByDescending(p => p.Seq).Take(RecentPoints).ToListAsync(cancellationToken);
        var last = recent.FirstOrDefault();
        var count = last?.Seq ?? 0;
        var versions = recent.Select(p => p.LimitVersionId).OfType<int>().Distinct().ToList();
        var judgedBy = await db.LimitVersions.AsNoTracking().Where(l => versions.Contains(l.Id)).ToDictionaryAsync(l => l.Id, cancellationToken);
        LimitVersion? lastLimit = last?.LimitVersionId is { } id ? judgedBy[id] : null;
        var unit = FinParameters.TryGet(c.Parameter, out var p) ? p.Unit : "";
        var state = limit is null ? ContextStates.Baseline : alerts.Count > 0 ? ContextStates.OutOfControl : ContextStates.InControl;
        var maintenance = await ChamberMaintenance.SinceAsync(db, c, last?.Chamber, unit, cancellationToken);
        return new ContextResponse(c.Code, c.Title, product, c.Step, c.Parameter, unit, c.Chamber, c.ChartType, c.Subgroup,
            c.Rules.Split(',', StringSplitOptions.RemoveEmptyEntries), c.ReactionPlan.Split('\n', StringSplitOptions.RemoveEmptyEntries), c.ElectricalConcernMv,
            limit is null ? "baseline" : "monitoring", state, Severity.Name(alerts.Count == 0 ? 0 : alerts.Max(a => a.SeverityRank)),
            alerts.Count, alerts.Count(a => a.State == AlertStates.Open), alerts.Count(a => a.EscalatedAtMs is not null && a.State == AlertStates.Open),
            count, limit is null ? null : BaselineLimits.Describe(c, limit), last is null ? null : ContextRules.ToMessage(c, last, lastLimit), maintenance,
            alerts.Count == 0 ? null : DateTimeOffset.FromUnixTimeMilliseconds(alerts.Min(a => a.FirstSignalAtMs)),
            [.. recent.AsEnumerable().Reverse().Select(pt => ContextRules.ToMessage(c, pt, pt.LimitVersionId is { } v ? judgedBy[v] : null))
                .Select(m => new RecentPoint(m.Seq, m.Value, m.Centre, m.Ucl, m.Lcl, m.Signals.Count > 0))]);
    }

    /// <summary>How many of its latest points a context's summary carries (the floor's sparkline).</summary>
    public const int RecentPoints = 30;

    internal static ProblemHttpResult NotFound(string what) => Problems.NotFound("Not found.", $"There is no chart context or limit version '{what}'.");
}

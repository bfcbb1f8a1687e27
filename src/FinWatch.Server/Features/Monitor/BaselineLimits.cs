using System.Text.Json;
using FinWatch.Data.Entities;
using FinWatch.Server.Features.Parameters;
using FinWatch.Statistics.Shewhart;

namespace FinWatch.Server.Features.Monitor;

/// <summary>Limits from a context's chosen points: the estimate, the draft version, and how a version is shown.</summary>
public static class BaselineLimits
{
    /// <summary>Fewer baseline points than this gives a warning (common practice, 20–25 subgroups; no single source).</summary>
    public const int RecommendedBaselinePoints = 20;

    /// <summary>Centre and σ of a context's chosen points: Xbar-S from summaries or I-MR (docs/statistics.md §2.1, 2.3).</summary>
    public static (double Centre, double? Sigma) Estimate(ChartContext context, IReadOnlyList<ChartPoint> used) =>
        used.Count == 0 ? (double.NaN, null)
            : context.ChartType == "xbar"
                ? SummaryLimits.MeanStandardDeviation([.. used.Select(p => p.Value)], [.. used.Select(p => p.N)], [.. used.Select(p => p.Sd ?? 0)])
                : SummaryLimits.Individuals([.. used.Select(p => p.Value)]);

    /// <summary>A draft limit version from the chosen points.</summary>
    public static LimitVersion Draft(ChartContext context, int version, double centre, double sigma, IReadOnlyList<ChartPoint> used,
        IReadOnlyList<ExcludedPoint> exclude, string by, long nowMs, string reason) => new()
    {
        ContextId = context.Id, Version = version, Status = "draft", Centre = centre, Sigma = sigma,
        SubgroupSize = context.ChartType == "xbar" ? used.Average(p => p.N) : 1, PointsUsed = used.Count,
        FromMs = used.Min(p => p.MeasuredAtMs), ToMs = used.Max(p => p.MeasuredAtMs),
        ExcludedJson = JsonSerializer.Serialize(exclude, FeedLog.Json), ComputedBy = by, ComputedAtMs = nowMs, Reason = reason,
    };

    public static LimitResponse Describe(ChartContext context, LimitVersion l)
    {
        var unit = FinParameters.TryGet(context.Parameter, out var p) ? p.Unit : "";
        var sigmaPoint = ContextRules.PointSigma(context, l, (int)Math.Round(l.SubgroupSize));
        static DateTimeOffset? T(long? ms) => ms is { } v ? DateTimeOffset.FromUnixTimeMilliseconds(v) : null;
        List<string> warnings = l.PointsUsed < RecommendedBaselinePoints
            ? [$"computed from {l.PointsUsed} points; {RecommendedBaselinePoints} or more are usual (common practice)"]
            : [];
        return new LimitResponse(l.Version, l.Status, l.Centre, l.Sigma, l.SubgroupSize, l.Centre + (3 * sigmaPoint), l.Centre - (3 * sigmaPoint), unit,
            l.PointsUsed, DateTimeOffset.FromUnixTimeMilliseconds(l.FromMs), DateTimeOffset.FromUnixTimeMilliseconds(l.ToMs),
            JsonSerializer.Deserialize<List<ExcludedPoint>>(l.ExcludedJson, FeedLog.Json) ?? [], l.ComputedBy,
            DateTimeOffset.FromUnixTimeMilliseconds(l.ComputedAtMs), l.Reason, l.ApprovedBy, T(l.ApprovedAtMs), l.ApprovalComment, T(l.EffectiveFromMs), warnings);
    }
}

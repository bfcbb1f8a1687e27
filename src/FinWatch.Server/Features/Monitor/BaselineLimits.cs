using System.Text.Json;
using FinWatch.Data.Entities;
using FinWatch.Server.Features.Parameters;
using FinWatch.Statistics.Rules;
using FinWatch.Statistics.Shewhart;
using FinWatch.Statistics.Stability;

namespace FinWatch.Server.Features.Monitor;

/// <summary>Limits from a context's chosen points: the estimate, the draft version, and how a version is shown.</summary>
public static class BaselineLimits
{
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

    /// <summary>Checks the chosen points against the draft limits and records the verdict and the check on the draft.</summary>
    public static BaselineCheckResponse Check(ChartContext context, LimitVersion draft, IReadOnlyList<ChartPoint> used)
    {
        var result = BaselineCheck.Run(ChartJudge.ChartTypeOf(context), draft.Centre, draft.Sigma,
            [.. used.OrderBy(p => p.Seq).Select(p => (p.Value, p.N, p.Sd ?? double.NaN))], ContextRules.Parse(context.Rules));
        static double? F(double v) => double.IsFinite(v) ? v : null;
        var check = new BaselineCheckResponse(result.Stable ? Stable : NotStable, result.Reasons, result.Subgroups, BaselineCheck.RecommendedSubgroups,
            [.. result.Rules.Select(r => new BaselineRuleCount(RunRules.Id(r.Rule), Severity.Describe(r.Rule), r.Signals, r.Points))], result.FlaggedPoints,
            new BaselineTrend("Mann–Kendall", result.Trend.S, F(result.Trend.Z), F(result.Trend.PValue), F(result.Trend.Tau),
                result.Trend.Direction(BaselineCheck.TrendAlpha), BaselineCheck.TrendAlpha),
            new BaselineNormality("Anderson–Darling", result.Normality.ASquared, result.Normality.AStar, result.Normality.PValue,
                result.Normality.Note ?? result.Normality.Reason));
        draft.Verdict = check.Verdict;
        draft.CheckJson = JsonSerializer.Serialize(check, FeedLog.Json);
        return check;
    }

    public const string Stable = "stable";
    public const string NotStable = "not stable";
    public const string NotChecked = "not checked";

    public static LimitResponse Describe(ChartContext context, LimitVersion l)
    {
        var unit = FinParameters.TryGet(context.Parameter, out var p) ? p.Unit : "";
        var sigmaPoint = ContextRules.PointSigma(context, l, (int)Math.Round(l.SubgroupSize));
        static DateTimeOffset? T(long? ms) => ms is { } v ? DateTimeOffset.FromUnixTimeMilliseconds(v) : null;
        var check = l.CheckJson is null ? null : JsonSerializer.Deserialize<BaselineCheckResponse>(l.CheckJson, FeedLog.Json);
        IReadOnlyList<string> warnings = check is not null ? check.Reasons
            : l.PointsUsed < BaselineCheck.RecommendedSubgroups
                ? [$"computed from {l.PointsUsed} points; {BaselineCheck.RecommendedSubgroups} or more are usual (common practice)"]
                : [];
        return new LimitResponse(l.Version, l.Status, l.Centre, l.Sigma, l.SubgroupSize, l.Centre + (3 * sigmaPoint), l.Centre - (3 * sigmaPoint), unit,
            l.PointsUsed, DateTimeOffset.FromUnixTimeMilliseconds(l.FromMs), DateTimeOffset.FromUnixTimeMilliseconds(l.ToMs),
            JsonSerializer.Deserialize<List<ExcludedPoint>>(l.ExcludedJson, FeedLog.Json) ?? [], l.ComputedBy,
            DateTimeOffset.FromUnixTimeMilliseconds(l.ComputedAtMs), l.Reason, l.ApprovedBy, T(l.ApprovedAtMs), l.ApprovalComment, T(l.EffectiveFromMs), warnings,
            l.Verdict ?? NotChecked, check, l.Justification);
    }
}

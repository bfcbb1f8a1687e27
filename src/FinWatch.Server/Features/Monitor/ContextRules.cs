using FinWatch.Data.Entities;
using FinWatch.Statistics.Rules;

namespace FinWatch.Server.Features.Monitor;

/// <summary>The chart arithmetic of a context: its rules, the σ of a plotted point, and a point as a message.</summary>
public static class ContextRules
{
    public static readonly string[] ChartTypes = ["xbar", "individuals"];
    public static readonly string[] Subgroups = ["wafer", "lot"];

    /// <summary>Comma-separated rule ids or set names (westernElectric, nelson); unknown ids are left out.</summary>
    public static IReadOnlyList<RunRule> Parse(string rules) =>
        [.. rules.Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries)
            .SelectMany(id => RunRules.TryParse(id, out var r) ? r : []).Distinct()];

    /// <summary>σ of a plotted point: σ/√n on an xbar chart (docs/statistics.md §2.3), σ itself on an individuals chart.</summary>
    public static double PointSigma(ChartContext context, LimitVersion limit, int n) =>
        context.ChartType == "xbar" ? limit.Sigma / Math.Sqrt(Math.Max(n, 1)) : limit.Sigma;

    public static PointMessage ToMessage(ChartContext context, ChartPoint p, LimitVersion? limit)
    {
        double? sigma = limit is null ? null : PointSigma(context, limit, p.N);
        return new PointMessage(context.Code, p.Seq, DateTimeOffset.FromUnixTimeMilliseconds(p.MeasuredAtMs), p.LotId, p.WaferSlot, p.Chamber,
            p.Value, p.N, p.Sd, p.Z, limit?.Centre, limit is null ? null : limit.Centre + (3 * sigma!.Value),
            limit is null ? null : limit.Centre - (3 * sigma!.Value), limit?.Version,
            p.Signals.Length == 0 ? [] : p.Signals.Split(','), p.PredictedDvtSatMv);
    }
}

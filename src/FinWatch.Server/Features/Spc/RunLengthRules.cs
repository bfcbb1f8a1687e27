using System.Globalization;
using FinWatch.Server.Features.Monitor;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features.Spc;

/// <summary>Checks a run-length request: a chart type, known rules, and at most one source of the point rate.</summary>
public static class RunLengthRules
{
    public const int MaxRules = 20;
    public const double MaxPointsPerDay = 100_000;

    public static void Check(RunLengthRequest r, ValidationErrors e)
    {
        if (r.ChartType is null)
        {
            e["chart_type"] = $"chart_type is required: {string.Join(" or ", ContextRules.ChartTypes)}";
        }
        else if (!ContextRules.ChartTypes.Contains(r.ChartType))
        {
            e["chart_type"] = $"'{r.ChartType}' is not a chart type: use {string.Join(" or ", ContextRules.ChartTypes)}";
        }

        if (r.Rules is not { Length: > 0 and <= MaxRules })
        {
            e["rules"] = $"give 1 to {MaxRules} rules: WE1–WE4, N1–N8, westernElectric or nelson";
        }
        else
        {
            AnalysisRules.CheckRuleIds(r.Rules, e);
        }

        if (r.PointsPerDay is { } rate && !(rate > 0 && rate <= MaxPointsPerDay))
        {
            e["points_per_day"] = $"{rate.ToString(CultureInfo.InvariantCulture)} is not a point rate: give more than 0 and at most {MaxPointsPerDay} points per day";
        }

        if (r.PointsPerDay is not null && r.Context is not null)
        {
            e["points_per_day"] = "give either context (its recent point rate is used) or points_per_day, not both";
        }

        if (r.Context is { Length: 0 or > 100 })
        {
            e["context"] = "context is the code of a chart context, 1 to 100 characters";
        }
    }
}

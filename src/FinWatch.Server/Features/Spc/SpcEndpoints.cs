using FinWatch.Server.Features.Monitor;
using FinWatch.Server.Infrastructure;
using FinWatch.Statistics.Constants;
using FinWatch.Statistics.Rules;
using FinWatch.Statistics.RunLength;
using Microsoft.AspNetCore.Http.HttpResults;

namespace FinWatch.Server.Features.Spc;

public static class SpcEndpoints
{
    public static void Map(IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/spc").WithTags("SPC").ValidateRequests();
        group.MapPost("/analyses", Analyse)
            .WithSummary("Control chart, run rules, EWMA, CUSUM, capability and normality of the numbers sent");
        group.MapPost("/arl", Arl)
            .WithSummary("Average run length of chart designs at shifts given in sigmas of the plotted statistic");
        group.MapGet("/constants", Constants)
            .WithSummary("Control chart constants for subgroup sizes 2 to 25, computed exactly and as printed");
        group.MapGet("/rules", Rules)
            .WithSummary("Every run rule with its set and its description in words");
    }

    /// <summary>The twelve run rules in order (docs/statistics.md §3.1, §3.2), each with its set and the words alerts use.</summary>
    private static Ok<List<RunRuleResponse>> Rules() => TypedResults.Ok(
        RunRules.WesternElectric.Select(r => new RunRuleResponse(RunRules.Id(r), "Western Electric", Severity.Describe(r)))
            .Concat(RunRules.Nelson.Select(r => new RunRuleResponse(RunRules.Id(r), "Nelson", Severity.Describe(r)))).ToList());

    private static Ok<AnalysisResponse> Analyse(AnalysisRequest request) => TypedResults.Ok(RunAnalysis.Run(request));

    private static Ok<ArlResponse> Arl(ArlRequest request)
    {
        var shifts = request.Shifts!;
        // A run length beyond 1e12 points cannot be resolved in double precision; it is reported as null, not infinity.
        double?[] Each(Func<double, double> arl) => shifts.Select(d => RunAnalysis.Nullable(arl(d))).ToArray();
        var shewhart = (request.Shewhart ?? []).Select(l => new ArlSeries(
            new Dictionary<string, object> { ["l"] = l }, Each(d => AverageRunLength.Shewhart(l, d)))).ToList();
        var cusum = (request.Cusum ?? []).Select(c => new ArlSeries(
            new Dictionary<string, object> { ["k"] = c.K!.Value, ["h"] = c.H!.Value, ["head_start"] = c.HeadStart ?? 0 },
            Each(d => AverageRunLength.Cusum(c.K!.Value, c.H!.Value, d, c.HeadStart ?? 0)))).ToList();
        var ewma = (request.Ewma ?? []).Select(e => new ArlSeries(
            new Dictionary<string, object> { ["lambda"] = e.Lambda!.Value, ["l"] = e.L!.Value },
            Each(d => AverageRunLength.Ewma(e.Lambda!.Value, e.L!.Value, d)))).ToList();
        ArlSeries? withRules = null;
        if (request.Rules is { Length: > 0 } ids)
        {
            var rules = ArlRules.ExpandWesternElectric(ids);
            withRules = new ArlSeries(new Dictionary<string, object> { ["l"] = 3.0, ["rules"] = rules },
                Each(d => AverageRunLength.ShewhartWithRules(rules, d)));
        }

        return TypedResults.Ok(new ArlResponse(shifts, shewhart, cusum, ewma, withRules, "points (subgroups) until a signal"));
    }

    private static Ok<ConstantsResponse> Constants()
    {
        // The API's names are lower case, and the symbols d2 and D2 (d3 and D3) differ only in case: the lower-case
        // constants keep their symbols, the capital factors A2 … D4 are written a2_capital … d4_capital.
        static List<IReadOnlyDictionary<string, double>> Rows(ConstantsMode mode) => ControlChartConstants.All(mode)
            .Select(c => (IReadOnlyDictionary<string, double>)new Dictionary<string, double>(StringComparer.Ordinal)
            {
                ["n"] = c.N, ["d2"] = c.RangeMean, ["d3"] = c.RangeSd, ["c4"] = c.C4, ["a2_capital"] = c.A2, ["a3_capital"] = c.A3,
                ["b3_capital"] = c.B3, ["b4_capital"] = c.B4, ["b5_capital"] = c.B5, ["b6_capital"] = c.B6,
                ["d1_capital"] = c.D1, ["d2_capital"] = c.D2, ["d3_capital"] = c.D3, ["d4_capital"] = c.D4,
            })
            .ToList();
        return TypedResults.Ok(new ConstantsResponse(Rows(ConstantsMode.Exact), Rows(ConstantsMode.Table),
            "exact: computed by quadrature; table: the printed factors of Montgomery, Introduction to SQC, Appendix VI"));
    }
}

using FinWatch.Statistics.Constants;
using FinWatch.Statistics.RunLength;
using Microsoft.AspNetCore.Http.HttpResults;

namespace FinWatch.Server.Features.Spc;

public static class SpcEndpoints
{
    public static IEndpointRouteBuilder MapSpc(this IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/spc").WithTags("SPC");
        group.MapPost("/analyses", Analyse)
            .WithSummary("Control chart, run rules, EWMA, CUSUM, capability and normality of the numbers sent");
        group.MapPost("/arl", Arl)
            .WithSummary("Average run length of chart designs at shifts given in sigmas of the plotted statistic");
        group.MapGet("/constants", Constants)
            .WithSummary("Control chart constants for subgroup sizes 2 to 25, computed exactly and as printed");
        return app;
    }

    private static Results<Ok<AnalysisResponse>, ValidationProblem> Analyse(AnalysisRequest request)
    {
        if (AnalysisRules.Check(request) is { Count: > 0 } errors)
        {
            return TypedResults.ValidationProblem(errors);
        }

        return TypedResults.Ok(RunAnalysis.Run(request));
    }

    private static Results<Ok<ArlResponse>, ValidationProblem> Arl(ArlRequest request)
    {
        if (ArlRules.Check(request) is { Count: > 0 } errors)
        {
            return TypedResults.ValidationProblem(errors);
        }

        var shifts = request.Shifts!;
        // A run length beyond 1e12 points cannot be resolved in double precision; it is reported as null, not infinity.
        double?[] Each(Func<double, double> arl) => shifts.Select(d => RunAnalysis.Nullable(arl(d))).ToArray();
        var shewhart = (request.Shewhart ?? []).Select(l => new ArlSeries(
            new Dictionary<string, object> { ["L"] = l }, Each(d => AverageRunLength.Shewhart(l, d)))).ToList();
        var cusum = (request.Cusum ?? []).Select(c => new ArlSeries(
            new Dictionary<string, object> { ["k"] = c.K!.Value, ["h"] = c.H!.Value, ["headStart"] = c.HeadStart ?? 0 },
            Each(d => AverageRunLength.Cusum(c.K!.Value, c.H!.Value, d, c.HeadStart ?? 0)))).ToList();
        var ewma = (request.Ewma ?? []).Select(e => new ArlSeries(
            new Dictionary<string, object> { ["lambda"] = e.Lambda!.Value, ["L"] = e.L!.Value },
            Each(d => AverageRunLength.Ewma(e.Lambda!.Value, e.L!.Value, d)))).ToList();
        ArlSeries? withRules = null;
        if (request.Rules is { Length: > 0 } ids)
        {
            var rules = ArlRules.ExpandWesternElectric(ids);
            withRules = new ArlSeries(new Dictionary<string, object> { ["L"] = 3.0, ["rules"] = rules },
                Each(d => AverageRunLength.ShewhartWithRules(rules, d)));
        }

        return TypedResults.Ok(new ArlResponse(shifts, shewhart, cusum, ewma, withRules, "points (subgroups) until a signal"));
    }

    private static Ok<ConstantsResponse> Constants()
    {
        static List<IReadOnlyDictionary<string, double>> Rows(ConstantsMode mode) => ControlChartConstants.All(mode)
            .Select(c => (IReadOnlyDictionary<string, double>)new Dictionary<string, double>(StringComparer.Ordinal)
            {
                ["n"] = c.N, ["d2"] = c.RangeMean, ["d3"] = c.RangeSd, ["c4"] = c.C4, ["A2"] = c.A2, ["A3"] = c.A3,
                ["B3"] = c.B3, ["B4"] = c.B4, ["B5"] = c.B5, ["B6"] = c.B6, ["D1"] = c.D1, ["D2"] = c.D2, ["D3"] = c.D3, ["D4"] = c.D4,
            })
            .ToList();
        return TypedResults.Ok(new ConstantsResponse(Rows(ConstantsMode.Exact), Rows(ConstantsMode.Table),
            "exact: computed by quadrature (spc.md 1.2); table: the printed factors of Montgomery, Introduction to SQC, Appendix VI"));
    }
}

using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features.Spc;

/// <summary>POST /api/spc/arl: chart designs to compare at shifts given in sigmas of the plotted statistic.</summary>
public sealed record ArlRequest : IValidatedRequest
{
    public void Validate(ValidationErrors errors) => ArlRules.Check(this, errors);

    public double[]? Shifts { get; init; }

    /// <summary>Plain Shewhart charts, by limit multiplier L.</summary>
    public double[]? Shewhart { get; init; }
    public CusumDesign[]? Cusum { get; init; }
    public EwmaDesign[]? Ewma { get; init; }

    /// <summary>Optional: a 3-sigma Shewhart chart with these Western Electric rules as well ("WE1".."WE4" or "westernElectric").</summary>
    public string[]? Rules { get; init; }
}

public sealed record CusumDesign
{
    public double? K { get; init; }
    public double? H { get; init; }
    public double? HeadStart { get; init; }
}

public sealed record EwmaDesign
{
    public double? Lambda { get; init; }
    public double? L { get; init; }
}

public sealed record ArlSeries(
    IReadOnlyDictionary<string, object> Design,
    double?[] Arl);

public sealed record ArlResponse(
    double[] Shifts,
    IReadOnlyList<ArlSeries> Shewhart,
    IReadOnlyList<ArlSeries> Cusum,
    IReadOnlyList<ArlSeries> Ewma,
    ArlSeries? ShewhartWithRules,
    string Unit);

/// <summary>
/// The constants table: each row maps a symbol to its value, the capital factors written <c>a2_capital</c> … <c>d4_capital</c>
/// beside the lower-case <c>d2</c>, <c>d3</c> and <c>c4</c>.
/// </summary>
public sealed record ConstantsResponse(
    IReadOnlyList<IReadOnlyDictionary<string, double>> Exact,
    IReadOnlyList<IReadOnlyDictionary<string, double>> Table,
    string Source);

/// <summary>A run rule: its identifier ("WE1".."WE4", "N1".."N8"), its set ("Western Electric" or "Nelson") and its words.</summary>
public sealed record RunRuleResponse(string Id, string Set, string Text);

using System.Text.Json.Serialization;

namespace FinWatch.Server.Features.Spc;

/// <summary>POST /api/spc/arl: chart designs to compare at shifts given in sigmas of the plotted statistic.</summary>
public sealed record ArlRequest
{
    [JsonPropertyName("shifts")] public double[]? Shifts { get; init; }

    /// <summary>Plain Shewhart charts, by limit multiplier L.</summary>
    [JsonPropertyName("shewhart")] public double[]? Shewhart { get; init; }
    [JsonPropertyName("cusum")] public CusumDesign[]? Cusum { get; init; }
    [JsonPropertyName("ewma")] public EwmaDesign[]? Ewma { get; init; }

    /// <summary>Optional: a 3-sigma Shewhart chart with these Western Electric rules as well ("WE1".."WE4" or "westernElectric").</summary>
    [JsonPropertyName("rules")] public string[]? Rules { get; init; }
}

public sealed record CusumDesign
{
    [JsonPropertyName("k")] public double? K { get; init; }
    [JsonPropertyName("h")] public double? H { get; init; }
    [JsonPropertyName("headStart")] public double? HeadStart { get; init; }
}

public sealed record EwmaDesign
{
    [JsonPropertyName("lambda")] public double? Lambda { get; init; }
    [JsonPropertyName("L")] public double? L { get; init; }
}

public sealed record ArlSeries(
    [property: JsonPropertyName("design")] IReadOnlyDictionary<string, object> Design,
    [property: JsonPropertyName("arl")] double?[] Arl);

public sealed record ArlResponse(
    [property: JsonPropertyName("shifts")] double[] Shifts,
    [property: JsonPropertyName("shewhart")] IReadOnlyList<ArlSeries> Shewhart,
    [property: JsonPropertyName("cusum")] IReadOnlyList<ArlSeries> Cusum,
    [property: JsonPropertyName("ewma")] IReadOnlyList<ArlSeries> Ewma,
    [property: JsonPropertyName("shewhartWithRules")] ArlSeries? ShewhartWithRules,
    [property: JsonPropertyName("unit")] string Unit);

/// <summary>
/// The constants table. Each row is a map, since the conventional symbols d2 and D2 (d3 and D3) differ only in case and the
/// API's JSON reading is case-insensitive.
/// </summary>
public sealed record ConstantsResponse(
    [property: JsonPropertyName("exact")] IReadOnlyList<IReadOnlyDictionary<string, double>> Exact,
    [property: JsonPropertyName("table")] IReadOnlyList<IReadOnlyDictionary<string, double>> Table,
    [property: JsonPropertyName("source")] string Source);

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
    [property: JsonPropertyName("arl")] double[] Arl);

public sealed record ArlResponse(
    [property: JsonPropertyName("shifts")] double[] Shifts,
    [property: JsonPropertyName("shewhart")] IReadOnlyList<ArlSeries> Shewhart,
    [property: JsonPropertyName("cusum")] IReadOnlyList<ArlSeries> Cusum,
    [property: JsonPropertyName("ewma")] IReadOnlyList<ArlSeries> Ewma,
    [property: JsonPropertyName("shewhartWithRules")] ArlSeries? ShewhartWithRules,
    [property: JsonPropertyName("unit")] string Unit);

/// <summary>One row of the control chart constants table.</summary>
public sealed record ConstantsRow(
    [property: JsonPropertyName("n")] int N,
    [property: JsonPropertyName("d2")] double D2Small,
    [property: JsonPropertyName("d3")] double D3Small,
    [property: JsonPropertyName("c4")] double C4,
    [property: JsonPropertyName("A2")] double A2,
    [property: JsonPropertyName("A3")] double A3,
    [property: JsonPropertyName("B3")] double B3,
    [property: JsonPropertyName("B4")] double B4,
    [property: JsonPropertyName("B5")] double B5,
    [property: JsonPropertyName("B6")] double B6,
    [property: JsonPropertyName("D1")] double D1,
    [property: JsonPropertyName("D2")] double D2,
    [property: JsonPropertyName("D3")] double D3,
    [property: JsonPropertyName("D4")] double D4);

public sealed record ConstantsResponse(
    [property: JsonPropertyName("exact")] IReadOnlyList<ConstantsRow> Exact,
    [property: JsonPropertyName("table")] IReadOnlyList<ConstantsRow> Table,
    [property: JsonPropertyName("source")] string Source);

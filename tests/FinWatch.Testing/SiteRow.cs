using System.Globalization;
using System.Text;
using System.Text.Json.Nodes;

namespace FinWatch.Testing;

/// <summary>
/// Builder of valid ingest rows with invented values; tests change only the fields they are about. The column list is
/// written out here rather than taken from the server, so that a change of the published format fails the tests.
/// </summary>
public sealed record SiteRow
{
    public static readonly string[] Columns =
    [
        "lot_id", "wafer_slot", "site_id", "site_x_mm", "site_y_mm", "product", "step",
        "etch_tool", "etch_chamber", "liner_tool", "liner_chamber", "metrology_tool",
        "measured_at", "operator",
        "top_width_nm", "bottom_width_nm", "fin_height_nm", "corner_radius_nm", "liner_thickness_nm",
    ];

    public string LotId { get; init; } = "T0001";
    public string WaferSlot { get; init; } = "1";
    public string SiteId { get; init; } = "S01";
    public string SiteXMm { get; init; } = "0";
    public string SiteYMm { get; init; } = "0";
    public string Product { get; init; } = TestProducts.TriGate;
    public string Step { get; init; } = "FIN-PROFILE";
    public string? EtchTool { get; init; } = "ETA";
    public string? EtchChamber { get; init; } = "ETA-1";
    public string? LinerTool { get; init; } = "LNA";
    public string? LinerChamber { get; init; } = "LNA-1";
    public string? MetrologyTool { get; init; } = "OCD-1";
    public string MeasuredAt { get; init; } = "2026-11-20T10:00:00Z";
    public string? Operator { get; init; } = "OP-0001";
    public string? TopWidthNm { get; init; } = "6";
    public string? BottomWidthNm { get; init; } = "10";
    public string? FinHeightNm { get; init; } = "42";
    public string? CornerRadiusNm { get; init; } = "2";
    public string? LinerThicknessNm { get; init; } = "2.5";

    public string?[] Values() =>
    [
        LotId, WaferSlot, SiteId, SiteXMm, SiteYMm, Product, Step, EtchTool, EtchChamber, LinerTool, LinerChamber,
        MetrologyTool, MeasuredAt, Operator, TopWidthNm, BottomWidthNm, FinHeightNm, CornerRadiusNm, LinerThicknessNm,
    ];

    /// <summary>Rows for every site of several wafers, a second apart.</summary>
    public static IEnumerable<SiteRow> Wafers(string lot, int wafers, int sites, DateTimeOffset start, string product = TestProducts.TriGate)
    {
        for (var w = 1; w <= wafers; w++)
        {
            for (var s = 1; s <= sites; s++)
            {
                var at = start.AddMinutes(w).AddSeconds(s);
                yield return new SiteRow
                {
                    LotId = lot,
                    Product = product,
                    WaferSlot = w.ToString(CultureInfo.InvariantCulture),
                    SiteId = $"S{s:00}",
                    SiteXMm = (s * 10).ToString(CultureInfo.InvariantCulture),
                    MeasuredAt = at.ToString("yyyy-MM-ddTHH:mm:ssZ", CultureInfo.InvariantCulture),
                    TopWidthNm = (6 + (0.01 * s)).ToString(CultureInfo.InvariantCulture),
                };
            }
        }
    }

    /// <summary>A CSV document with the full header and LF line ends.</summary>
    public static string Csv(IEnumerable<SiteRow> rows, string newline = "\n")
    {
        var sb = new StringBuilder();
        sb.Append(string.Join(',', Columns)).Append(newline);
        foreach (var row in rows)
        {
            sb.Append(string.Join(',', row.Values().Select(Quote))).Append(newline);
        }

        return sb.ToString();
    }

    /// <summary>A JSON batch: an array of objects; null fields are left out, numbers are sent as JSON numbers.</summary>
    public static string Json(IEnumerable<SiteRow> rows)
    {
        var array = new JsonArray();
        foreach (var row in rows)
        {
            var o = new JsonObject();
            var values = row.Values();
            for (var i = 0; i < Columns.Length; i++)
            {
                if (values[i] is not { } v)
                {
                    continue;
                }

                o[Columns[i]] = double.TryParse(v, NumberStyles.Float, CultureInfo.InvariantCulture, out var d) && IsNumeric(Columns[i])
                    ? JsonValue.Create(d)
                    : JsonValue.Create(v);
            }

            array.Add(o);
        }

        return array.ToJsonString();
    }

    private static bool IsNumeric(string column) => column.EndsWith("_nm", StringComparison.Ordinal) || column.EndsWith("_mm", StringComparison.Ordinal) || column == "wafer_slot";

    private static string Quote(string? value) =>
        value is null ? "" : value.IndexOfAny([',', '"', '\n', '\r']) >= 0 ? "\"" + value.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"" : value;
}

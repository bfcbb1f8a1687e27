using System.Globalization;
using FinWatch.Server.Features.Measurements;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features.Products;

/// <summary>One site of a site plan: its id and position from the wafer centre in mm.</summary>
public sealed record SitePlanSiteDto(string? SiteId, double? SiteXMm, double? SiteYMm);

/// <summary>
/// Replace a product's site plan at one step: the sites in the order they are measured. An empty list removes the
/// plan. Site ids are unique within the plan; every site lies on the 300 mm wafer (within 150 mm of its centre).
/// </summary>
public sealed record SitePlanRequest(string? Step, List<SitePlanSiteDto?>? Sites) : IValidatedRequest
{
    public const int MaxSites = 400;

    public void Validate(ValidationErrors errors)
    {
        if (TextProblem(Step) is { } stepProblem)
        {
            errors["step"] = stepProblem;
        }

        if (Sites is null)
        {
            errors["sites"] = "sites is required: a list of { site_id, site_x_mm, site_y_mm } (an empty list removes the plan)";
            return;
        }

        if (Sites.Count > MaxSites)
        {
            errors["sites"] = $"{Sites.Count} sites; a plan has at most {MaxSites}";
            return;
        }

        var firstRow = new Dictionary<string, int>(StringComparer.Ordinal);
        for (var i = 0; i < Sites.Count; i++)
        {
            var row = i + 1;
            var key = $"sites[{i}]";
            if (Sites[i] is not { } site)
            {
                errors[key] = $"row {row}: give site_id, site_x_mm and site_y_mm";
                continue;
            }

            if (TextProblem(site.SiteId) is { } idProblem)
            {
                errors[$"{key}.site_id"] = $"row {row}: site id {Quoted(site.SiteId)}: {idProblem}";
            }
            else if (firstRow.TryGetValue(site.SiteId!, out var first))
            {
                errors[$"{key}.site_id"] = $"row {row}: site id '{site.SiteId}' appears twice (first in row {first})";
            }
            else
            {
                firstRow[site.SiteId!] = row;
            }

            var x = Coordinate(errors, $"{key}.site_x_mm", row, "x", site.SiteXMm);
            var y = Coordinate(errors, $"{key}.site_y_mm", row, "y", site.SiteYMm);
            if (x is { } xv && y is { } yv && !RowValidator.OnWafer(xv, yv))
            {
                errors[$"{key}.site_x_mm"] = string.Create(CultureInfo.InvariantCulture,
                    $"row {row}: the site ({xv} mm, {yv} mm) lies {Math.Sqrt((xv * xv) + (yv * yv)):0.#} mm from the centre, outside the 300 mm wafer (radius {RowValidator.WaferRadiusMm} mm)");
            }
        }
    }

    private static double? Coordinate(ValidationErrors errors, string key, int row, string axis, double? value)
    {
        if (value is not { } v)
        {
            errors[key] = $"row {row}: {axis} is required (mm from the wafer centre)";
            return null;
        }

        if (!double.IsFinite(v) || Math.Abs(v) > RowValidator.WaferRadiusMm)
        {
            errors[key] = string.Create(CultureInfo.InvariantCulture,
                $"row {row}: {axis} = {v} mm is outside the wafer: expected −{RowValidator.WaferRadiusMm} mm ≤ {axis} ≤ {RowValidator.WaferRadiusMm} mm");
            return null;
        }

        return v;
    }

    // The ingest's own text rules (a plan's site ids are the ids the rows carry), and no blank or padded id.
    private static string? TextProblem(string? text) =>
        string.IsNullOrWhiteSpace(text) ? "a value is required"
        : RowValidator.TextProblem(text) is { } problem ? problem
        : text.Trim() != text ? "starts or ends with a space"
        : null;

    private static string Quoted(string? text) => text is null ? "(missing)" : $"'{text}'";
}

/// <summary>A product's site plan at one step; who changed it last and when (absent for a step without a plan).</summary>
public sealed record SitePlanResponse(string Product, string Step, IReadOnlyList<SitePlanSiteDto> Sites, DateTime? UpdatedAt, string? UpdatedBy);

/// <summary>Every site plan of a product, by step.</summary>
public sealed record SitePlansResponse(string Product, IReadOnlyList<SitePlanResponse> Plans);

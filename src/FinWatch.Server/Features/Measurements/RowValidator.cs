using System.Globalization;
using FinWatch.Physics;
using FinWatch.Physics.Analytic;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features.Measurements;

/// <summary>The product facts that validation and derivation need, looked up by the code used in files.</summary>
/// <param name="Model">The product's analytic threshold model (docs/model.md §G.2), used for the predicted shifts.</param>
public sealed record ProductRef(int Id, string Code, GateFaces Faces, ThresholdModel? Model = null);

/// <summary>A numeric column's plausibility range: low &lt; value (or low ≤ value) ≤ high, in the unit.</summary>
public sealed record ValueRange(IngestColumn Column, double Low, double High, bool LowInclusive, string Unit);

/// <summary>
/// Turns a <see cref="RawRow"/> into a <see cref="SiteRecord"/>, or reports every problem in it with its column and value.
/// The plausibility ranges (README, the measurement record) reject typing and unit mistakes, not process excursions.
/// </summary>
public sealed class RowValidator(IReadOnlyDictionary<string, ProductRef> products, DateTimeOffset now, TimeSpan futureTolerance)
{
    public const double MaxWidthNm = 100, MaxHeightNm = 300, MaxRadiusNm = 50, MaxLinerNm = 20;
    public const int MaxSlot = WaferIdentity.MaxSlot;

    /// <summary>A 300 mm wafer: sites lie within 150 mm of its centre.</summary>
    public const double WaferRadiusMm = 150;

    public const int MaxTextLength = WaferIdentity.MaxTextLength;

    /// <summary>The plausibility range of each numeric column, the one table the validation and GET /api/measurements/ranges use.</summary>
    public static IReadOnlyList<ValueRange> Ranges { get; } =
    [
        new(IngestColumn.SiteXMm, -WaferRadiusMm, WaferRadiusMm, LowInclusive: true, "mm"),
        new(IngestColumn.SiteYMm, -WaferRadiusMm, WaferRadiusMm, LowInclusive: true, "mm"),
        new(IngestColumn.TopWidthNm, 0, MaxWidthNm, LowInclusive: false, "nm"),
        new(IngestColumn.BottomWidthNm, 0, MaxWidthNm, LowInclusive: false, "nm"),
        new(IngestColumn.FinHeightNm, 0, MaxHeightNm, LowInclusive: false, "nm"),
        new(IngestColumn.CornerRadiusNm, 0, MaxRadiusNm, LowInclusive: true, "nm"),
        new(IngestColumn.LinerThicknessNm, 0, MaxLinerNm, LowInclusive: true, "nm"),
    ];

    private static readonly ValueRange?[] RangeOf = [.. Enumerable.Range(0, IngestColumns.Count).Select(i => Ranges.SingleOrDefault(r => (int)r.Column == i))];

    private static readonly DateTimeOffset Earliest = new(2000, 1, 1, 0, 0, 0, TimeSpan.Zero);

    /// <summary>Validates one row; on failure returns null and appends the problems to <paramref name="errors"/>.</summary>
    public SiteRecord? Validate(RawRow raw, List<RowError> errors)
    {
        var before = errors.Count;
        if (raw.Problems is { } problems)
        {
            errors.AddRange(problems);
        }

        var row = raw.Row;
        var cells = raw.Cells;
        var lot = Text(row, cells, IngestColumn.LotId, required: true, errors);
        var slot = Slot(row, cells, errors);
        var site = Text(row, cells, IngestColumn.SiteId, required: true, errors);
        var x = Number(row, cells, IngestColumn.SiteXMm, errors, required: true);
        var y = Number(row, cells, IngestColumn.SiteYMm, errors, required: true);
        if (x is { } xv && y is { } yv && !OnWafer(xv, yv))
        {
            errors.Add(RowError.For(row, "site_x_mm", Cell(cells, IngestColumn.SiteXMm),
                string.Create(CultureInfo.InvariantCulture, $"the site ({xv}, {yv}) mm lies outside the 300 mm wafer (radius {WaferRadiusMm} mm)")));
        }

        var product = ProductOf(row, cells, errors);
        var step = Text(row, cells, IngestColumn.Step, required: true, errors);
        var etchTool = Text(row, cells, IngestColumn.EtchTool, required: false, errors);
        var etchChamber = Text(row, cells, IngestColumn.EtchChamber, required: false, errors);
        var linerTool = Text(row, cells, IngestColumn.LinerTool, required: false, errors);
        var linerChamber = Text(row, cells, IngestColumn.LinerChamber, required: false, errors);
        var metrologyTool = Text(row, cells, IngestColumn.MetrologyTool, required: false, errors);
        var op = Text(row, cells, IngestColumn.Operator, required: false, errors);
        var at = Time(row, cells, errors);

        var wt = Number(row, cells, IngestColumn.TopWidthNm, errors);
        var wb = Number(row, cells, IngestColumn.BottomWidthNm, errors);
        var h = Number(row, cells, IngestColumn.FinHeightNm, errors);
        var r = Number(row, cells, IngestColumn.CornerRadiusNm, errors);
        var liner = Number(row, cells, IngestColumn.LinerThicknessNm, errors);
        if (errors.Count == before && wt is null && wb is null && h is null && r is null && liner is null)
        {
            errors.Add(RowError.For(row, null, null, "the row has no measured value; fill at least one of "
                + string.Join(", ", IngestColumns.Values.Select(IngestColumns.NameOf))));
        }

        if (errors.Count != before)
        {
            return null;
        }

        return new SiteRecord
        {
            Row = row,
            LotId = lot!,
            WaferSlot = slot!.Value,
            SiteId = site!,
            SiteXMm = x!.Value,
            SiteYMm = y!.Value,
            ProductId = product!.Id,
            Step = step!,
            EtchTool = etchTool,
            EtchChamber = etchChamber,
            LinerTool = linerTool,
            LinerChamber = linerChamber,
            MetrologyTool = metrologyTool,
            Operator = op,
            MeasuredAtMs = at!.Value.ToUnixTimeMilliseconds(),
            TopWidthNm = wt,
            BottomWidthNm = wb,
            FinHeightNm = h,
            CornerRadiusNm = r,
            LinerThicknessNm = liner,
            Derived = DerivedFin.From(wt, wb, h, r, product.Faces),
        };
    }

    private static string? Cell(string?[] cells, IngestColumn column) => cells[(int)column];

    /// <summary>
    /// The predicted shifts of a valid site under its product's model, or null without a model or a whole profile. The
    /// gate dielectric is the product's (the liner is outside the gate, A.6). Kept apart from <see cref="Validate"/>, which
    /// only checks and derives, so the ingest decides where in its pipeline the prediction runs.
    /// </summary>
    public static PredictedShifts? Predict(ProductRef product, SiteRecord site)
    {
        if (product.Model is not { } model || site.TopWidthNm is not { } top || site.BottomWidthNm is not { } bottom
            || site.FinHeightNm is not { } height || site.CornerRadiusNm is not { } radius)
        {
            return null;
        }

        var nominal = model.Parameters.Nominal;
        var p = model.Predict(nominal with { Profile = new FinProfile(top, bottom, height, radius) });
        return PredictedShifts.From(p);
    }

    private static string? Text(int row, string?[] cells, IngestColumn column, bool required, List<RowError> errors)
    {
        var value = Cell(cells, column);
        var name = IngestColumns.NameOf(column);
        if (value is null)
        {
            if (required)
            {
                errors.Add(RowError.For(row, name, null, "a value is required"));
            }

            return null;
        }

        if (TextProblem(value) is { } problem)
        {
            errors.Add(RowError.For(row, name, value, problem));
            return null;
        }

        return value;
    }

    /// <summary>Why a text value (an id, a tool or chamber name) cannot be stored, or null when it can.</summary>
    public static string? TextProblem(string value) =>
        value.Length > MaxTextLength ? $"longer than {MaxTextLength} characters"
        : value.Any(char.IsControl) ? "contains a control character"
        : null;

    /// <summary>Whether a site at (x, y) mm from the centre lies on the 300 mm wafer.</summary>
    public static bool OnWafer(double xMm, double yMm) => (xMm * xMm) + (yMm * yMm) <= WaferRadiusMm * WaferRadiusMm;

    private static int? Slot(int row, string?[] cells, List<RowError> errors)
    {
        var value = Cell(cells, IngestColumn.WaferSlot);
        if (value is null)
        {
            errors.Add(RowError.For(row, "wafer_slot", null, "a value is required"));
            return null;
        }

        if (!int.TryParse(value, NumberStyles.Integer, CultureInfo.InvariantCulture, out var slot))
        {
            errors.Add(RowError.For(row, "wafer_slot", value, "not a whole number"));
            return null;
        }

        if (slot is < 1 or > MaxSlot)
        {
            errors.Add(RowError.For(row, "wafer_slot", value, $"wafer slot must be 1 to {MaxSlot}"));
            return null;
        }

        return slot;
    }

    private ProductRef? ProductOf(int row, string?[] cells, List<RowError> errors)
    {
        var code = Cell(cells, IngestColumn.Product);
        if (code is null)
        {
            errors.Add(RowError.For(row, "product", null, "a value is required"));
            return null;
        }

        if (!products.TryGetValue(code, out var product))
        {
            errors.Add(RowError.For(row, "product", code, "unknown product; create it first (POST /api/products)"));
            return null;
        }

        return product;
    }

    private DateTimeOffset? Time(int row, string?[] cells, List<RowError> errors)
    {
        var value = Cell(cells, IngestColumn.MeasuredAt);
        if (value is null)
        {
            errors.Add(RowError.For(row, "measured_at", null, "a value is required"));
            return null;
        }

        if (!ZonedTime.TryParse(value, out var at))
        {
            errors.Add(RowError.For(row, "measured_at", value,
                "not an ISO 8601 time with a zone, such as 2026-11-03T14:05:00Z or 2026-11-03T15:05:00+01:00"));
            return null;
        }

        if (at > now + futureTolerance)
        {
            errors.Add(RowError.For(row, "measured_at", value,
                $"the time lies in the future (more than {futureTolerance.TotalMinutes:0} min after the server's clock, {now:u})"));
            return null;
        }

        if (at < Earliest)
        {
            errors.Add(RowError.For(row, "measured_at", value, "the time is before the year 2000"));
            return null;
        }

        return at.ToUniversalTime();
    }

    private static double? Number(int row, string?[] cells, IngestColumn column, List<RowError> errors, bool required = false)
    {
        var (_, low, high, lowInclusive, unit) = RangeOf[(int)column]!;
        var value = Cell(cells, column);
        var name = IngestColumns.NameOf(column);
        if (value is null)
        {
            if (required)
            {
                errors.Add(RowError.For(row, name, null, "a value is required"));
            }

            return null;
        }

        if (!double.TryParse(value, NumberStyles.Float, CultureInfo.InvariantCulture, out var number))
        {
            var hint = value.Contains(',', StringComparison.Ordinal) ? " (use '.' as the decimal separator)" : "";
            errors.Add(RowError.For(row, name, value, $"not a number{hint}"));
            return null;
        }

        if (!double.IsFinite(number))
        {
            errors.Add(RowError.For(row, name, value, "not a finite number"));
            return null;
        }

        var tooLow = lowInclusive ? number < low : number <= low;
        if (tooLow || number > high)
        {
            var lowText = lowInclusive ? $"{low.ToString(CultureInfo.InvariantCulture)} ≤ value" : $"{low.ToString(CultureInfo.InvariantCulture)} < value";
            errors.Add(RowError.For(row, name, value,
                $"out of range: expected {lowText} ≤ {high.ToString(CultureInfo.InvariantCulture)} {unit}"));
            return null;
        }

        // "-0" is zero and passes the range check, but the geometry reads the sign bit (FinCrossSection refuses a
        // negative radius, and -0 counts as one), so a negative zero is stored and used as +0.
        return number == 0 ? 0.0 : number;
    }
}

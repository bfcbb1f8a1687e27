using FinWatch.Data;
using FinWatch.Server.Features.Parameters;
using FinWatch.Server.Infrastructure;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Series;

/// <summary>One stored site value of a series, in time order.</summary>
public sealed record SeriesRow(long At, string Lot, int Slot, string Site, string? EtchChamber, string? LinerChamber, double Value);

/// <summary>
/// Which stored series to read: one parameter of one product and step, optionally one chamber (etch or liner) and a time
/// range. Shared by the series, chart and capability endpoints so they read exactly the same points.
/// </summary>
public sealed record SeriesQuery(string Product, int ProductId, string Step, FinParameter Parameter, string? Chamber, DateTimeOffset? From, DateTimeOffset? To)
{
    /// <summary>Checks the common query parameters; returns the query or the problems keyed by parameter name.</summary>
    public static async Task<(SeriesQuery? Query, ValidationErrors Errors)> ResolveAsync(FinWatchDbContext db,
        string? product, string? step, string? parameter, string? chamber, DateTimeOffset? from, DateTimeOffset? to, CancellationToken cancellationToken)
    {
        var errors = new ValidationErrors();
        if (string.IsNullOrEmpty(product))
        {
            errors["product"] = "a product code is required";
        }

        if (string.IsNullOrEmpty(step))
        {
            errors["step"] = "a process step is required";
        }

        FinParameter? p = null;
        if (parameter is null || !FinParameters.TryGet(parameter, out p))
        {
            errors["parameter"] = $"'{parameter}' is not a parameter; expected one of {FinParameters.NameList}";
        }

        if (from > to)
        {
            errors["from"] = "from must not be after to";
        }

        var productId = errors.Count == 0
            ? await db.Products.Where(x => x.Code == product).Select(x => (int?)x.Id).SingleOrDefaultAsync(cancellationToken)
            : null;
        if (errors.Count == 0 && productId is null)
        {
            errors["product"] = $"unknown product '{product}'";
        }

        return errors.Count > 0 ? (null, errors) : (new SeriesQuery(product!, productId!.Value, step!, p!, chamber, from, to), errors);
    }

    /// <summary>Checks the level ("site" by default, or "wafer") and the point limit shared by the series endpoints.</summary>
    public static (string Level, int Limit) CheckLevelAndLimit(string? level, int? limit, int defaultLimit, int maxLimit, ValidationErrors errors)
    {
        var lvl = level ?? "site";
        if (lvl is not ("site" or "wafer"))
        {
            errors["level"] = "level is 'site' or 'wafer'";
        }

        var max = limit ?? defaultLimit;
        if (max < 1 || max > maxLimit)
        {
            errors["limit"] = $"limit is 1 to {maxLimit}";
        }

        return (lvl, max);
    }

    /// <summary>The measured (or derived) values in time order, streamed from the database.</summary>
    public IAsyncEnumerable<SeriesRow> Rows(FinWatchDbContext db) => Queryable(db).AsAsyncEnumerable();

    /// <summary>
    /// The query behind <see cref="Rows"/>. Its ORDER BY is exactly the columns of the series index
    /// (MeasurementConfiguration), so both engines read it in order without a sort (SeriesQueryPlanTests).
    /// </summary>
    public IQueryable<SeriesRow> Queryable(FinWatchDbContext db)
    {
        var q = db.Measurements.AsNoTracking().Where(m => m.ProductId == ProductId && m.Step == Step);
        if (Chamber is { } chamber)
        {
            q = q.Where(m => m.EtchChamber == chamber || m.LinerChamber == chamber);
        }

        if (From is { } f)
        {
            var ms = Time.ToMs(f);
            q = q.Where(m => m.MeasuredAtMs >= ms);
        }

        if (To is { } t)
        {
            var ms = Time.ToMs(t);
            q = q.Where(m => m.MeasuredAtMs <= ms);
        }

        var column = Parameter.Property;
        return q.Where(m => EF.Property<double?>(m, column) != null)
            .OrderBy(m => m.MeasuredAtMs).ThenBy(m => m.LotId).ThenBy(m => m.WaferSlot).ThenBy(m => m.SiteId)
            .Select(m => new SeriesRow(m.MeasuredAtMs, m.LotId, m.WaferSlot, m.SiteId, m.EtchChamber, m.LinerChamber, EF.Property<double?>(m, column)!.Value));
    }
}

using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Physics;
using FinWatch.Physics.Analytic;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Model;

/// <summary>
/// The analytic model of each product: its nominal fin and model inputs as a parameter set — the docs/model.md §G.3
/// physics defaults, with the product's current calibration (its highest <see cref="ModelParameterSet"/> version)
/// applied when one exists — built once per product version and parameter set, and cached.
/// </summary>
public sealed class ProductModels
{
    private readonly ThresholdModelCache cache = new();

    /// <summary>The product's parameter set: physics defaults, or the given calibration applied to them.</summary>
    public static CalibrationParameters ParametersOf(Product p, ModelParameterSet? calibration = null)
    {
        var nominal = new FinMeasurement(
            new FinProfile(p.NominalTopWidthNm, p.NominalBottomWidthNm, p.NominalFinHeightNm, p.NominalCornerRadiusNm),
            p.ModelEotNm, p.ModelEotNm, p.GateFaces);
        var defaults = new CalibrationParameters
        {
            Name = $"{p.Code} physics defaults",
            Version = $"uncalibrated; product as of {DateTimeOffset.FromUnixTimeMilliseconds(p.UpdatedAtMs):u}",
            Nominal = nominal,
            GateLengthNm = p.ModelGateLengthNm,
            DopingPerCm3 = p.ModelChannelDopingCm3,
            Surface = ConfinementSurfaceText.Spelling.Parse(p.ModelSidewallOrientation),
        };
        return calibration is null ? defaults : defaults with
        {
            Name = $"{p.Code} calibration",
            Version = $"v{calibration.Version} of {DateTimeOffset.FromUnixTimeMilliseconds(calibration.CreatedAtMs):u}; product as of {DateTimeOffset.FromUnixTimeMilliseconds(p.UpdatedAtMs):u}",
            GateLengthNm = calibration.GateLengthNm,
            BarrierHeightOverrideV = calibration.BarrierHeightV,
            ThresholdOffsetV = calibration.ThresholdOffsetV,
        };
    }

    /// <summary>The current (highest-version) calibration of each product that has one.</summary>
    public static async Task<Dictionary<int, ModelParameterSet>> CurrentCalibrationsAsync(FinWatchDbContext db, CancellationToken cancellationToken)
    {
        var sets = await db.ModelParameterSets.AsNoTracking()
            .Where(s => s.Version == db.ModelParameterSets.Where(o => o.ProductId == s.ProductId).Max(o => o.Version))
            .ToListAsync(cancellationToken);
        return sets.ToDictionary(s => s.ProductId);
    }

    /// <summary>The product's current calibration, or null while it has none.</summary>
    public static Task<ModelParameterSet?> CurrentCalibrationAsync(FinWatchDbContext db, int productId, CancellationToken cancellationToken) =>
        db.ModelParameterSets.AsNoTracking().Where(s => s.ProductId == productId).OrderByDescending(s => s.Version).FirstOrDefaultAsync(cancellationToken);

    public ThresholdModel For(Product product, ModelParameterSet? calibration = null) => cache.GetOrCreate(ParametersOf(product, calibration));

    /// <summary>The product's model under its current calibration, read from the database.</summary>
    public async Task<ThresholdModel> ForAsync(FinWatchDbContext db, Product product, CancellationToken cancellationToken) =>
        For(product, await CurrentCalibrationAsync(db, product.Id, cancellationToken));

    /// <summary>The product's model, or null when its nominal cannot be modelled (the shifts are then left empty).</summary>
    public ThresholdModel? TryFor(Product product, ModelParameterSet? calibration = null)
    {
        try
        {
            return For(product, calibration);
        }
        catch (ArgumentException)
        {
            return null;
        }
    }
}

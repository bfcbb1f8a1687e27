using FinWatch.Data.Entities;
using FinWatch.Physics;
using FinWatch.Physics.Analytic;

namespace FinWatch.Server.Features.Model;

/// <summary>
/// The analytic model of each product: its nominal fin and model inputs as a parameter set (fin-model.md G.3 physics
/// defaults until a calibration exists), built once per product version and cached.
/// </summary>
public sealed class ProductModels
{
    private readonly ThresholdModelCache cache = new();

    public static CalibrationParameters ParametersOf(Product p)
    {
        var faces = p.GateFaces == GateFaces.DoubleGate ? GatedFaces.DoubleGate : GatedFaces.TriGate;
        var nominal = new FinMeasurement(
            new FinProfile(p.NominalTopWidthNm, p.NominalBottomWidthNm, p.NominalFinHeightNm, p.NominalCornerRadiusNm),
            p.ModelEotNm, p.ModelEotNm, faces);
        return new CalibrationParameters
        {
            Name = $"{p.Code} physics defaults",
            Version = $"uncalibrated; product as of {DateTimeOffset.FromUnixTimeMilliseconds(p.UpdatedAtMs):u}",
            Nominal = nominal,
            GateLengthNm = p.ModelGateLengthNm,
            DopingPerCm3 = p.ModelChannelDopingCm3,
            Surface = p.ModelSidewallOrientation == "100" ? ConfinementSurface.Si100 : ConfinementSurface.Si110,
        };
    }

    public ThresholdModel For(Product product) => cache.GetOrCreate(ParametersOf(product));

    /// <summary>The product's model, or null when its nominal cannot be modelled (the shifts are then left empty).</summary>
    public ThresholdModel? TryFor(Product product)
    {
        try
        {
            return For(product);
        }
        catch (ArgumentException)
        {
            return null;
        }
    }
}

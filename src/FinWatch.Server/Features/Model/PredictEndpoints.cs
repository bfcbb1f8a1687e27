using FinWatch.Server.Infrastructure;
using FinWatch.Data;
using FinWatch.Physics;
using FinWatch.Physics.Analytic;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Model;

public static class PredictEndpoints
{
    private static readonly Dictionary<SensitivityParameter, (string Input, string Unit)> Inputs = new()
    {
        [SensitivityParameter.MidWidth] = ("mid_width", "per nm"),
        [SensitivityParameter.Taper] = ("taper_at_fixed_mid_width", "per degree"),
        [SensitivityParameter.Height] = ("height", "per nm"),
        [SensitivityParameter.CornerRadius] = ("corner_radius", "per nm"),
        [SensitivityParameter.Eot] = ("eot", "per nm"),
        [SensitivityParameter.GateLength] = ("gate_length", "per nm"),
        [SensitivityParameter.Doping] = ("channel_doping", "per 1e17 cm⁻³"),
    };

    public static void Map(IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/model").WithTags("Model");
        group.MapPost("/predict", PredictAsync).WithSummary("Predicted ΔVT, Δswing and ΔDIBL of a profile against its product's nominal, with contributions");
        group.MapGet("/sensitivities", SensitivitiesAsync).WithSummary("dV/dx of the product's model at its nominal");
    }

    private static async Task<Results<Ok<PredictResponse>, ValidationProblem>> PredictAsync(
        PredictRequest r, FinWatchDbContext db, ProductModels models, CancellationToken cancellationToken)
    {
        var errors = new ValidationErrors();
        foreach (var (name, v, max) in new[] { ("top_width_nm", r.TopWidthNm, 100.0), ("bottom_width_nm", r.BottomWidthNm, 100.0), ("height_nm", r.HeightNm, 300.0) })
        {
            if (v is not { } x || !(x > 0 && x <= max))
            {
                errors[name] = $"{name} is required, 0 < value ≤ {max} nm";
            }
        }

        if (r.CornerRadiusNm is { } radius && !(radius >= 0 && radius <= 50))
        {
            errors["corner_radius_nm"] = "corner_radius_nm is 0 to 50 nm";
        }

        if (r.EotNm is { } eot && !(eot > 0 && eot <= 10))
        {
            errors["eot_nm"] = "eot_nm is 0 to 10 nm";
        }

        if (r.MetrologySd is { } m)
        {
            foreach (var (name, v) in new[] { ("top_width_nm", m.TopWidthNm), ("bottom_width_nm", m.BottomWidthNm), ("height_nm", m.HeightNm), ("corner_radius_nm", m.CornerRadiusNm) })
            {
                if (v is { } sd && !(sd >= 0 && sd <= 10))
                {
                    errors[$"metrology_sd.{name}"] = $"metrology_sd.{name} is 0 to 10 nm (one standard deviation)";
                }
            }
        }

        var product = r.Product is null ? null : await db.Products.AsNoTracking().SingleOrDefaultAsync(p => p.Code == r.Product, cancellationToken);
        if (product is null)
        {
            errors["product"] = Problems.NotAProduct(r.Product);
        }

        if (errors.Count > 0)
        {
            return Problems.Invalid(errors);
        }

        var model = await models.ForAsync(db, product!, cancellationToken);
        var nominal = model.Parameters.Nominal;
        var fin = nominal with
        {
            Profile = new FinProfile(r.TopWidthNm!.Value, r.BottomWidthNm!.Value, r.HeightNm!.Value, r.CornerRadiusNm ?? nominal.Profile.CornerRadiusNm),
            EotNm = r.EotNm ?? nominal.EotNm,
            PhysicalThicknessNm = r.EotNm ?? nominal.PhysicalThicknessNm,
        };
        var p = model.Predict(fin);
        static ContributionsResponse C(ShiftContributions c) => new(c.MidWidth, c.Taper, c.Height, c.CornerRadius, c.Dielectric, c.Total);
        static double? F(double v) => double.IsFinite(v) ? v : null;
        return TypedResults.Ok(new PredictResponse(product!.Code, F(p.DeltaThresholdLinMv), F(p.DeltaThresholdSatMv),
            F(p.DeltaSwingLinMvPerDecade), F(p.DeltaDiblMvPerV), C(p.LinearLin), C(p.LinearSat), [.. EvaluateModel.Describe(p.Warnings)],
            r.MetrologySd is { } u ? Uncertainty(model.Sensitivities, u) : null,
            p.ParameterSetName, p.ParameterSetVersion, p.CodeVersion, EvaluateModel.PredictionCaution));
    }

    private static ShiftUncertaintyResponse Uncertainty(SensitivityTable table, MetrologySdRequest u)
    {
        double Sd(ModelOutput output) => table.MetrologySd(output, u.TopWidthNm ?? 0, u.BottomWidthNm ?? 0, u.HeightNm ?? 0, u.CornerRadiusNm ?? 0);
        return new ShiftUncertaintyResponse(Sd(ModelOutput.ThresholdLin), Sd(ModelOutput.ThresholdSat));
    }

    private static async Task<Results<Ok<SensitivitiesResponse>, ValidationProblem>> SensitivitiesAsync(
        string? product, FinWatchDbContext db, ProductModels models, CancellationToken cancellationToken)
    {
        var p = product is null ? null : await db.Products.AsNoTracking().SingleOrDefaultAsync(x => x.Code == product, cancellationToken);
        if (p is null)
        {
            return Problems.Invalid("product", Problems.NotAProduct(product));
        }

        var model = await models.ForAsync(db, p, cancellationToken);
        var rows = model.Sensitivities.Rows.Select(row => new SensitivityRowResponse(
            Inputs[row.Parameter].Input, Inputs[row.Parameter].Unit, row.ThresholdLinMv, row.ThresholdSatMv, row.SwingLinMvPerDecade, row.DiblMvPerV)).ToList();
        return TypedResults.Ok(new SensitivitiesResponse(p.Code, rows, model.Parameters.Name, model.Parameters.Version, ThresholdModel.CodeVersion, EvaluateModel.PredictionCaution));
    }
}

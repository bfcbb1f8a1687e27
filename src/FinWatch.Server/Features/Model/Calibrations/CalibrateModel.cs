using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Physics;
using FinWatch.Physics.Analytic;
using Microsoft.EntityFrameworkCore;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features.Model.Calibrations;

/// <summary>
/// The calibration use case (docs/model.md §G.3): reads an electrical-test file, joins each wafer to the mean of its
/// measured fin profiles, fits L_eff, the short-channel prefactor and the threshold offset with a ridge prior centred on
/// the product's physics defaults, and stores the result as the product's next parameter-set version together with
/// the tests it was fitted on. From then on every prediction (ingest, predict, sensitivities) uses the new set and is
/// stamped with it. All or nothing: a file with any bad row stores nothing.
/// </summary>
public sealed class CalibrateModel(FinWatchDbContext db, TimeProvider clock, ILogger<CalibrateModel> logger)
{
    public const double DefaultMeasurementSdMv = 5;

    public sealed record Request(string? Reason, string CreatedBy, string? SourceName, bool Preview, double MeasurementSdMv);

    public sealed record Outcome(CalibrationResponse? Result, RejectedBatch? Rejected);

    public async Task<Outcome> RunAsync(Stream csv, Request request, CancellationToken cancellationToken)
    {
        var now = clock.GetUtcNow();
        var (rows, errors) = await ElectricalTestCsv.ReadAsync(csv, now, cancellationToken);
        if (request.Reason is { Length: > 2000 })
        {
            errors.Insert(0, RowError.For(0, "reason", null, "the reason is at most 2000 characters"));
        }

        if (string.IsNullOrWhiteSpace(request.Reason) && !request.Preview)
        {
            errors.Insert(0, RowError.For(0, "reason", null, "say why this calibration is made (query parameter reason); it is kept with the parameter set"));
        }

        if (errors.Count > 0)
        {
            return Rejected(rows.Count, errors);
        }

        var productCode = rows[0].Product;
        var product = await db.Products.AsNoTracking().SingleOrDefaultAsync(p => p.Code == productCode, cancellationToken);
        if (product is null)
        {
            return Rejected(rows.Count, [RowError.For(rows[0].Row, "product", productCode, "unknown product")]);
        }

        foreach (var r in rows.Where(r => r.Product != productCode))
        {
            errors.Add(RowError.For(r.Row, "product", r.Product, $"one calibration fits one product; this file starts with {productCode}"));
        }

        var fins = await MeanFinsAsync(product.Id, rows, cancellationToken);
        foreach (var r in rows.Where(r => !fins.ContainsKey((r.LotId, r.WaferSlot))))
        {
            errors.Add(RowError.For(r.Row, "lot_id", r.LotId,
                $"no measured fin profile (top and bottom width, height and corner radius) of product {productCode} for lot {r.LotId} wafer {r.WaferSlot}; calibration needs the wafer's metrology"));
        }

        if (errors.Count > 0)
        {
            return Rejected(rows.Count, errors);
        }

        var prior = ProductModels.ParametersOf(product);
        var observations = rows.Select(r => new ElectricalObservation(
            prior.Nominal with { Profile = fins[(r.LotId, r.WaferSlot)].Profile }, r.VtLinV, r.VtSatV)).ToList();
        var version = request.Preview ? (int?)null : 1 + (await db.ModelParameterSets.Where(s => s.ProductId == product.Id)
            .MaxAsync(s => (int?)s.Version, cancellationToken) ?? 0);
        var set = new ModelParameterSet
        {
            ProductId = product.Id,
            Version = version ?? 0,
            CodeVersion = ThresholdModel.CodeVersion,
            CreatedAtMs = now.ToUnixTimeMilliseconds(),
            CreatedBy = request.CreatedBy,
            Reason = request.Reason?.Trim() ?? "",
            SourceName = request.SourceName,
            MeasurementSdMv = request.MeasurementSdMv,
        };

        CalibrationFit fit;
        try
        {
            fit = await Task.Run(() => Calibration.Fit(prior, observations, $"{product.Code} calibration", $"v{set.Version}", request.MeasurementSdMv / 1000), cancellationToken);
        }
        catch (ArgumentException e)
        {
            return Rejected(rows.Count, [RowError.For(0, null, null, $"the model cannot evaluate one of the measured fins: {e.Message}")]);
        }

        set.GateLengthNm = fit.GateLengthNm;
        set.GateLengthSdNm = fit.GateLengthSdNm;
        set.BarrierHeightV = fit.BarrierHeightV;
        set.BarrierHeightSdV = fit.BarrierHeightSdV;
        set.ThresholdOffsetV = fit.ThresholdOffsetV;
        set.ThresholdOffsetSdV = fit.ThresholdOffsetSdV;
        set.RmsResidualBeforeMv = fit.RmsResidualBeforeMv;
        set.RmsResidualAfterMv = fit.RmsResidualAfterMv;
        set.Observations = fit.Observations;
        set.Iterations = fit.Iterations;

        var theta = new[] { fit.GateLengthNm, fit.BarrierHeightV, fit.ThresholdOffsetV };
        var tests = rows.Select((r, i) =>
        {
            var (lin, sat) = Calibration.Predict(prior, observations[i].Fin, theta);
            var f = fins[(r.LotId, r.WaferSlot)];
            return new ElectricalTest
            {
                ProductId = product.Id,
                LotId = r.LotId,
                WaferSlot = r.WaferSlot,
                VtLinV = r.VtLinV,
                VtSatV = r.VtSatV,
                TestedAtMs = r.TestedAt.ToUnixTimeMilliseconds(),
                MeanTopWidthNm = f.Profile.TopWidthNm,
                MeanBottomWidthNm = f.Profile.BottomWidthNm,
                MeanFinHeightNm = f.Profile.HeightNm,
                MeanCornerRadiusNm = f.Profile.CornerRadiusNm,
                Sites = f.Sites,
                ResidualLinMv = (r.VtLinV - lin) * 1000,
                ResidualSatMv = (r.VtSatV - sat) * 1000,
            };
        }).ToList();

        if (!request.Preview)
        {
            await using var transaction = await db.Database.BeginTransactionAsync(cancellationToken);
            db.ModelParameterSets.Add(set);
            await db.SaveChangesAsync(cancellationToken);
            tests.ForEach(t => t.ParameterSetId = set.Id);
            db.ElectricalTests.AddRange(tests);
            Audit.AuditLog.Add(db, request.CreatedBy, "model-parameters", $"{product.Code} v{set.Version}", "calibrated", null,
                Describe(product, set, prior, ProductModels.ParametersOf(product, set), set.Version, null, now), clock);
            await db.SaveChangesAsync(cancellationToken);
            await transaction.CommitAsync(cancellationToken);
            logger.LogInformation("Calibrated {Product} v{Version} on {Wafers} wafers: rms {Before:0.0} → {After:0.0} mV",
                product.Code, set.Version, tests.Count, fit.RmsResidualBeforeMv, fit.RmsResidualAfterMv);
        }

        var parameters = request.Preview ? fit.Parameters : ProductModels.ParametersOf(product, set);
        return new Outcome(Describe(product, set, prior, parameters, request.Preview ? null : set.Version, tests, now), null);
    }

    /// <summary>The response shape of a stored or previewed set; <paramref name="tests"/> null leaves the wafers out.</summary>
    public static CalibrationResponse Describe(Product product, ModelParameterSet set, CalibrationParameters prior, CalibrationParameters parameters,
        int? version, IReadOnlyList<ElectricalTest>? tests, DateTimeOffset createdAt)
    {
        var sd = Calibration.DefaultPriorSd;
        FittedParameterResponse[] fitted =
        [
            new("gate_length", "nm", set.GateLengthNm, set.GateLengthSdNm, prior.GateLengthNm, sd[0]),
            new("barrier_height", "V", set.BarrierHeightV, set.BarrierHeightSdV, prior.BarrierHeightV, sd[1]),
            new("threshold_offset", "V", set.ThresholdOffsetV, set.ThresholdOffsetSdV, prior.ThresholdOffsetV, sd[2]),
        ];
        var wafers = tests?.Select(t => new CalibrationWaferResponse(
            t.LotId, t.WaferSlot, DateTimeOffset.FromUnixTimeMilliseconds(t.TestedAtMs), t.VtLinV, t.VtSatV,
            t.MeanTopWidthNm, t.MeanBottomWidthNm, t.MeanFinHeightNm, t.MeanCornerRadiusNm, t.Sites,
            t.VtLinV - (t.ResidualLinMv / 1000), t.VtSatV - (t.ResidualSatMv / 1000), t.ResidualLinMv, t.ResidualSatMv)).ToList();
        return new CalibrationResponse(product.Code, version, version is not null, fitted, set.Observations, set.Iterations,
            set.RmsResidualBeforeMv, set.RmsResidualAfterMv, set.MeasurementSdMv, createdAt, set.CreatedBy, set.Reason, set.SourceName,
            parameters.Name, parameters.Version, set.CodeVersion, wafers, EvaluateModel.PredictionCaution);
    }

    private sealed record MeanFin(FinProfile Profile, int Sites);

    // The mean of each wafer's sites that carry a full profile; one query for all lots of the file.
    private async Task<Dictionary<(string, int), MeanFin>> MeanFinsAsync(int productId, List<ElectricalTestRow> rows, CancellationToken cancellationToken)
    {
        var lots = rows.Select(r => r.LotId).Distinct().ToList();
        var means = await db.Measurements.AsNoTracking()
            .Where(m => m.ProductId == productId && lots.Contains(m.LotId)
                && m.TopWidthNm != null && m.BottomWidthNm != null && m.FinHeightNm != null && m.CornerRadiusNm != null)
            .GroupBy(m => new { m.LotId, m.WaferSlot })
            .Select(g => new
            {
                g.Key.LotId,
                g.Key.WaferSlot,
                Top = g.Average(m => m.TopWidthNm!.Value),
                Bottom = g.Average(m => m.BottomWidthNm!.Value),
                Height = g.Average(m => m.FinHeightNm!.Value),
                Radius = g.Average(m => m.CornerRadiusNm!.Value),
                Sites = g.Count(),
            })
            .ToListAsync(cancellationToken);
        return means.ToDictionary(m => (m.LotId, m.WaferSlot), m => new MeanFin(new FinProfile(m.Top, m.Bottom, m.Height, m.Radius), m.Sites));
    }

    private static Outcome Rejected(int rows, List<RowError> errors) => new(null, new RejectedBatch(rows, errors.Count, errors.Take(200).ToList()));
}

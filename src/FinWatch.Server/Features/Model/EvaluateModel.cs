using FinWatch.Server.Infrastructure;
using FinWatch.Physics;
using FinWatch.Physics.Analytic;

namespace FinWatch.Server.Features.Model;

/// <summary>
/// The evaluate use case: the analytic model's working for one device, each value as docs/model.md §A–E define
/// it, with the note's physics defaults for what the request does not give (G.3; calibration comes later).
/// </summary>
public static class EvaluateModel
{
    /// <summary>The caution shown with every prediction made under a product's parameter set (predict, sensitivities, calibrations, stored shifts).</summary>
    public const string PredictionCaution =
        "Engineering estimate from the analytic model of the fin under the product's current parameter set (physics defaults until a calibration exists): shifts relative to the product's nominal fin, not measured thresholds; do not use it in place of electrical test or the fab's own procedures.";

    /// <summary>The caution of the whole-working evaluation, which always uses the uncalibrated physics defaults.</summary>
    public const string Caution =
        "Engineering estimate from the analytic model of the fin (mid-gap gate, uncalibrated physics defaults); compare shifts against the nominal fin, not absolute values, and do not use it in place of electrical test or the fab's own procedures.";

    public static void Check(EvaluateRequest r, ValidationErrors e)
    {
        void Range(string name, double? v, double low, double high, bool required = true)
        {
            if (v is null ? required : !(v > low && v <= high))
            {
                e[name] = $"{name} is {(required ? "required, " : "")}{low} < value ≤ {high}";
            }
        }

        Range("top_width_nm", r.TopWidthNm, 0, 100);
        Range("bottom_width_nm", r.BottomWidthNm, 0, 100);
        Range("height_nm", r.HeightNm, 0, 300);
        if (r.CornerRadiusNm is { } radius && !(radius >= 0 && radius <= 50))
        {
            e["corner_radius_nm"] = "corner_radius_nm is 0 to 50 nm";
        }

        Range("eot_nm", r.EotNm, 0, 10);
        Range("gate_length_nm", r.GateLengthNm, 0, 1000);
        if (r.DopingCm3 is { } n && !(n >= 0 && n <= 1e20))
        {
            e["doping_cm3"] = "doping_cm3 is 0 to 1e20 cm⁻³";
        }

        SpelledField.Check(e, "gate_faces", r.GateFaces, GateFacesText.Spelling, required: false);
        SpelledField.Check(e, "sidewall_orientation", r.SidewallOrientation, ConfinementSurfaceText.Spelling, required: false);

        Range("vds_lin_v", r.VdsLinV, 0, 5, required: false);
        Range("vds_sat_v", r.VdsSatV, 0, 5, required: false);
        if ((r.VdsLinV ?? 0.05) >= (r.VdsSatV ?? 0.75))
        {
            e["vds_sat_v"] = "vds_sat_v must be above vds_lin_v";
        }

    }

    public static EvaluateResponse Run(EvaluateRequest r)
    {
        var faces = SpelledField.ParseOr(r.GateFaces, GateFacesText.Spelling, GateFaces.TriGate);
        var profile = new FinProfile(r.TopWidthNm!.Value, r.BottomWidthNm!.Value, r.HeightNm!.Value, r.CornerRadiusNm ?? 0);
        var eot = r.EotNm!.Value;
        var fin = new FinMeasurement(profile, eot, eot, faces);
        var parameters = new CalibrationParameters
        {
            Name = "physics defaults",
            Version = "uncalibrated",
            Nominal = fin,
            GateLengthNm = r.GateLengthNm!.Value,
            DopingPerCm3 = r.DopingCm3 ?? 0,
            DrainVoltageLinV = r.VdsLinV ?? 0.05,
            DrainVoltageSatV = r.VdsSatV ?? 0.75,
            Surface = SpelledField.ParseOr(r.SidewallOrientation, ConfinementSurfaceText.Spelling, ConfinementSurface.Si110),
        };

        var g = FinCrossSection.Derive(profile, faces);
        var lambda = ScaleLength.RectangularFinNm(g.MidWidthNm, profile.HeightNm, eot, faces);
        var ratio = parameters.GateLengthNm / lambda;
        var barrier = parameters.BarrierHeightV;
        var lin = ShortChannel.Threshold(barrier, parameters.DrainVoltageLinV, ratio);
        var sat = ShortChannel.Threshold(barrier, parameters.DrainVoltageSatV, ratio);
        var details = new List<SliceDetail>();
        var result = SliceModel.Evaluate(parameters.ToSliceInput(fin), details);

        var warnings = Describe(ThresholdModel.RangeWarnings(fin)).ToList();
        if (ratio < 3 || result.MinLengthRatio < 3)
        {
            warnings.Add("L/λ is below 3 somewhere in the fin: the first-mode short-channel model is not meaningful.");
        }

        if (result.PunchThrough)
        {
            warnings.Add("The source barrier is gone (punch-through): no threshold can be given.");
        }

        double? Mv(double v, bool valid) => valid && double.IsFinite(v) ? v * 1000 : null;
        double? V(double v) => double.IsFinite(v) ? v : null;
        return new EvaluateResponse(
            new GeometryResponse(g.TaperDeg, g.MidWidthNm, g.AreaNm2, g.GatedPerimeterNm, g.MaxCornerRadiusNm),
            lambda,
            QuantumConfinement.DensityOfStatesShiftV(g.MidWidthNm, parameters.Surface, parameters.QcMultiplier) * 1000,
            Mv(lin.ShiftV, !lin.PunchThrough),
            Mv(sat.ShiftV, !sat.PunchThrough),
            V(result.ThresholdLowV),
            V(result.ThresholdHighV),
            Mv(result.SwingLowVPerDecade, true),
            Mv(result.DiblVPerV, true),
            details.Select(d => new SliceResponse(d.HeightNm, d.IsCorner ? null : d.WidthNm, d.ThresholdLinV, d.CurrentShareLin, d.IsCorner)).ToList(),
            new Dictionary<string, double>
            {
                ["gate_length_nm"] = parameters.GateLengthNm,
                ["doping_cm3"] = parameters.DopingPerCm3,
                ["vds_lin_v"] = parameters.DrainVoltageLinV,
                ["vds_sat_v"] = parameters.DrainVoltageSatV,
                ["barrier_height_v"] = barrier,
                ["critical_sheet_density_cm2"] = parameters.CriticalSheetDensityPerCm2,
                ["slices"] = parameters.SliceCount,
            },
            warnings,
            Caution);
    }

    /// <summary>Each warning flag as a sentence an engineer can act on.</summary>
    internal static IEnumerable<string> Describe(ModelWarnings w)
    {
        foreach (var flag in Enum.GetValues<ModelWarnings>())
        {
            if (flag != ModelWarnings.None && (w & flag) != 0)
            {
                yield return flag switch
                {
                    ModelWarnings.WidthOutOfRange => "The mid-height width is outside 5–10 nm, the range the model is meant for.",
                    ModelWarnings.HeightOutOfRange => "The fin height is outside 30–55 nm (H.1).",
                    ModelWarnings.TaperOutOfRange => "The taper is outside 0–6° (H.1); a re-entrant fin counts here.",
                    ModelWarnings.RadiusOutOfRange => "The corner radius is outside 0–4 nm (H.1).",
                    ModelWarnings.RadiusExceedsMax => "The corner radius is larger than the top allows; the largest possible radius was used (A.4).",
                    ModelWarnings.EotOutOfRange => "The EOT is outside 0.8–1.2 nm (H.1).",
                    ModelWarnings.DielectricInconsistent => "The physical dielectric thickness is below the EOT (A.6).",
                    ModelWarnings.GateLengthOutOfRange => "The gate length is outside 14–26 nm (H.1).",
                    ModelWarnings.DopingOutOfRange => "The channel doping is above 1e18 cm⁻³ (H.1).",
                    ModelWarnings.LengthToScaleBelowThree => "L/λ is below 3 somewhere in the fin: the short-channel model is not meaningful there (B.5).",
                    ModelWarnings.PunchThrough => "The source barrier is gone (punch-through): no shift can be given.",
                    ModelWarnings.Nonlinear => "The full model and the linear estimate differ by more than 20 % or 5 mV (G.2 step 7): read the contributions with care.",
                    ModelWarnings.InvalidInput => "The profile is not a valid fin; no shift can be given.",
                    _ => flag.ToString(),
                };
            }
        }
    }
}

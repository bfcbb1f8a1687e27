namespace FinWatch.Physics.Analytic;

/// <summary>
/// The per-record analytic pipeline (docs/model.md §G.2): validate, slice model with QC, SCE and corner,
/// report the shifts against the product's nominal fin, the linear sensitivity estimate and the nonlinearity flag,
/// all stamped with the parameter set and <see cref="CodeVersion"/>.
/// </summary>
/// <remarks>
/// <para>
/// One instance per parameter set: the constructor evaluates the nominal and the G.4 sensitivity table once
/// (≈ 15 slice-model evaluations), and <see cref="Predict(in FinMeasurement)"/> then costs one evaluation of the
/// Gauss–Legendre form of the slice model (<see cref="QuadratureSliceModel"/>, a few µs, within 0.01 mV of the
/// 200-slice sum over H.1; the nominal is evaluated the same way). Instances are immutable and safe to share between threads.
/// </para>
/// <para>
/// Absolute thresholds stay internal: they carry work-function and calibration offsets that the profile does not
/// measure (H.4.1). Engineering estimate, to be calibrated (G.3); see H.4 for the model's limits.
/// </para>
/// </remarks>
public sealed class ThresholdModel
{
    /// <summary>
    /// Code version stamped on every prediction: the model of docs/model.md §B.5, C.3, D.2, E.1–E.4 and G.2. Raise it
    /// when a change to the code changes a prediction.
    /// </summary>
    public const string CodeVersion = "FinWatch.Physics.Analytic/1.1.0";

    /// <summary>Relative nonlinearity threshold of G.2 step 7 (20 %).</summary>
    public const double NonlinearRelative = 0.20;

    /// <summary>Absolute nonlinearity threshold of G.2 step 7, in mV.</summary>
    public const double NonlinearAbsoluteMv = 5.0;

    private readonly SliceModelResult _nominal;

    // λ_W(w) and V_T,long(w) for the set's EOT and doping, 1–40 nm (records with another EOT are computed directly).
    private readonly WidthTable _widths;
    private readonly ModelWarnings _setWarnings;

    /// <summary>Builds the model for one parameter set and caches its nominal evaluation and sensitivity table.</summary>
    /// <param name="parameters">The versioned parameter set; its nominal must be a valid fin that does not punch through.</param>
    /// <exception cref="ArgumentException">The nominal is invalid or punches through.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A parameter is out of its stated range.</exception>
    public ThresholdModel(CalibrationParameters parameters)
    {
        ArgumentNullException.ThrowIfNull(parameters);
        Parameters = parameters;
        var nominalInput = parameters.ToSliceInput(parameters.Nominal);
        _widths = QuadratureSliceModel.BuildWidthTable(nominalInput);
        _nominal = QuadratureSliceModel.Evaluate(nominalInput, _widths);
        if (_nominal.PunchThrough)
        {
            throw new ArgumentException("The nominal fin punches through under this parameter set.", nameof(parameters));
        }

        Sensitivities = Sensitivity.Compute(parameters);
        if (parameters.GateLengthNm is < 14 or > 26)
        {
            _setWarnings |= ModelWarnings.GateLengthOutOfRange;
        }

        if (parameters.DopingPerCm3 > 1e18)
        {
            _setWarnings |= ModelWarnings.DopingOutOfRange;
        }
    }

    /// <summary>The parameter set.</summary>
    public CalibrationParameters Parameters { get; }

    /// <summary>The G.4 sensitivity table at the nominal.</summary>
    public SensitivityTable Sensitivities { get; }

    /// <summary>
    /// Predicts the record's ΔV_T,lin, ΔV_T,sat (mV), ΔS_lin (mV/dec) and ΔDIBL (mV/V) against the nominal (G.2),
    /// with validity warnings. Invalid geometry or punch-through gives NaN shifts with the warning set; it never throws for data.
    /// </summary>
    /// <param name="fin">The measured fin.</param>
    /// <returns>The prediction, stamped.</returns>
    public ThresholdPrediction Predict(in FinMeasurement fin)
    {
        FinProfile p = fin.Profile;
        ModelWarnings warnings = _setWarnings;
        if (!IsPositive(p.TopWidthNm) || !IsPositive(p.BottomWidthNm) || !IsPositive(p.HeightNm)
            || !double.IsFinite(p.CornerRadiusNm) || p.CornerRadiusNm < 0 || !IsPositive(fin.EotNm)
            || !Enum.IsDefined(fin.Faces))
        {
            return Result(double.NaN, double.NaN, double.NaN, double.NaN, default, default, double.NaN, warnings | ModelWarnings.InvalidInput);
        }

        warnings |= RangeWarnings(fin);
        SliceModelResult r;
        try
        {
            r = QuadratureSliceModel.Evaluate(Parameters.ToSliceInput(fin), _widths);
        }
        catch (ArgumentOutOfRangeException)
        {
            // Finite but non-physical input the model cannot take (for example an overflowing size): flagged, not thrown.
            return Result(double.NaN, double.NaN, double.NaN, double.NaN, default, default, double.NaN, warnings | ModelWarnings.InvalidInput);
        }

        if (r.MinLengthRatio < 3)
        {
            warnings |= ModelWarnings.LengthToScaleBelowThree;
        }

        if (r.PunchThrough)
        {
            return Result(double.NaN, double.NaN, double.NaN, double.NaN, default, default, r.MinLengthRatio, warnings | ModelWarnings.PunchThrough);
        }

        double dLin = 1000 * (r.ThresholdLowV - _nominal.ThresholdLowV);
        double dSat = 1000 * (r.ThresholdHighV - _nominal.ThresholdHighV);
        double dSwing = 1000 * (r.SwingLowVPerDecade - _nominal.SwingLowVPerDecade);
        double dDibl = 1000 * (r.DiblVPerV - _nominal.DiblVPerV);

        var coordinates = ProfileCoordinates.From(fin);
        ShiftContributions lin = Sensitivities.Contributions(coordinates, ModelOutput.ThresholdLin);
        ShiftContributions sat = Sensitivities.Contributions(coordinates, ModelOutput.ThresholdSat);
        if (IsNonlinear(dLin, lin.Total) || IsNonlinear(dSat, sat.Total) || fin.Faces != Parameters.Nominal.Faces)
        {
            warnings |= ModelWarnings.Nonlinear;
        }

        return Result(dLin, dSat, dSwing, dDibl, lin, sat, r.MinLengthRatio, warnings);
    }

    /// <summary>G.2 step 7: |full − linear| &gt; 20 % of |full| or &gt; 5 mV.</summary>
    /// <param name="fullMv">The full-model shift in mV.</param>
    /// <param name="linearMv">The linear estimate in mV.</param>
    /// <returns>True when the record is to be flagged.</returns>
    public static bool IsNonlinear(double fullMv, double linearMv)
    {
        double gap = Math.Abs(fullMv - linearMv);
        return gap > NonlinearAbsoluteMv || gap > NonlinearRelative * Math.Abs(fullMv);
    }

    /// <summary>The H.1 range and A.4/A.6 consistency warnings of one fin, without evaluating the model.</summary>
    public static ModelWarnings RangeWarnings(in FinMeasurement fin)
    {
        ModelWarnings w = ModelWarnings.None;
        FinGeometry g = FinCrossSection.Derive(fin.Profile, fin.Faces);
        if (g.MidWidthNm is < 5 or > 10)
        {
            w |= ModelWarnings.WidthOutOfRange;
        }

        if (fin.Profile.HeightNm is < 30 or > 55)
        {
            w |= ModelWarnings.HeightOutOfRange;
        }

        if (g.TaperDeg is < 0 or > 6)
        {
            w |= ModelWarnings.TaperOutOfRange;
        }

        if (fin.Profile.CornerRadiusNm > 4)
        {
            w |= ModelWarnings.RadiusOutOfRange;
        }

        if ((g.Flags & GeometryFlags.RadiusExceedsMax) != 0)
        {
            w |= ModelWarnings.RadiusExceedsMax;
        }

        if (fin.EotNm is < 0.8 or > 1.2)
        {
            w |= ModelWarnings.EotOutOfRange;
        }

        if (!double.IsFinite(fin.PhysicalThicknessNm) || fin.PhysicalThicknessNm < fin.EotNm)
        {
            w |= ModelWarnings.DielectricInconsistent;
        }

        return w;
    }

    private static bool IsPositive(double value) => double.IsFinite(value) && value > 0;

    private ThresholdPrediction Result(
        double lin, double sat, double swing, double dibl, ShiftContributions cLin, ShiftContributions cSat, double ratio, ModelWarnings warnings) =>
        new(lin, sat, swing, dibl, cLin, cSat, ratio, warnings, Parameters.Name, Parameters.Version, CodeVersion);
}

namespace FinWatch.Physics.Analytic;

/// <summary>
/// Linear sensitivities of the analytic model (docs/model.md §G.4): central differences at the nominal in
/// the independent basis {w_mid, θ at fixed w_mid, H, r, EOT, L_eff, N_A}, and propagation σ² = Sᵀ Σ S.
/// </summary>
/// <remarks>
/// Steps (G.4): w 0.1 nm, θ 0.2°, H 0.5 nm, r 0.1 nm, EOT 0.02 nm, L 0.2 nm, N_A 1e16 cm⁻³. Where the nominal is
/// closer than one step to the lower bound 0 (r or N_A), a forward difference is used and flagged. Derivatives are
/// per nm, per degree, or per 1e17 cm⁻³ for N_A; outputs in mV, mV/decade, mV/V.
/// </remarks>
public static class Sensitivity
{
    /// <summary>G.4 step of each parameter in its own unit (doping in cm⁻³), in <see cref="SensitivityParameter"/> order.</summary>
    public static IReadOnlyList<double> Steps { get; } = [0.1, 0.2, 0.5, 0.1, 0.02, 0.2, 1e16];

    private const double DopingUnitPerCm3 = 1e17;

    /// <summary>The four outputs of one evaluation, in mV, mV/decade and mV/V (absolute, for differencing only).</summary>
    private readonly record struct Outputs(double VtLin, double VtSat, double SwingLin, double Dibl);

    /// <summary>Computes the sensitivity table at the parameter set's nominal by central differences (G.4).</summary>
    /// <param name="parameters">The parameter set (its <see cref="CalibrationParameters.Nominal"/> is the expansion point).</param>
    /// <returns>The table.</returns>
    /// <exception cref="ArgumentException">The model punches through at the nominal or at a perturbed point.</exception>
    public static SensitivityTable Compute(CalibrationParameters parameters)
    {
        ArgumentNullException.ThrowIfNull(parameters);
        FinMeasurement nominal = parameters.Nominal;
        ProfileCoordinates c0 = ProfileCoordinates.From(nominal);
        Outputs f0 = Evaluate(parameters, nominal.Faces, c0, parameters.GateLengthNm, parameters.DopingPerCm3);

        var rows = new SensitivityRow[Steps.Count];
        foreach (SensitivityParameter p in Enum.GetValues<SensitivityParameter>())
        {
            double h = Steps[(int)p];
            double x0 = p switch
            {
                SensitivityParameter.GateLength => parameters.GateLengthNm,
                SensitivityParameter.Doping => parameters.DopingPerCm3,
                _ => c0.Get(p),
            };

            bool oneSided = (p is SensitivityParameter.CornerRadius or SensitivityParameter.Doping) && x0 - h < 0;
            Outputs plus = At(parameters, nominal.Faces, c0, p, x0 + h);
            Outputs minus = oneSided ? f0 : At(parameters, nominal.Faces, c0, p, x0 - h);
            double span = oneSided ? h : 2 * h;

            // Per-unit scale: doping derivatives are quoted per 1e17 cm⁻³.
            double unit = p == SensitivityParameter.Doping ? DopingUnitPerCm3 : 1;
            double d(double up, double down) => (up - down) / span * unit;
            double c2(double up, double mid, double down) => oneSided ? 0 : (up - (2 * mid) + down) / (h * h) * unit * unit;
            rows[(int)p] = new SensitivityRow(
                p,
                d(plus.VtLin, minus.VtLin),
                d(plus.VtSat, minus.VtSat),
                d(plus.SwingLin, minus.SwingLin),
                d(plus.Dibl, minus.Dibl),
                c2(plus.VtLin, f0.VtLin, minus.VtLin),
                c2(plus.VtSat, f0.VtSat, minus.VtSat),
                oneSided);
        }

        return new SensitivityTable(c0, rows);
    }

    /// <summary>
    /// Variance of an output propagated from correlated input errors, σ² = Sᵀ Σ S (G.4), in the output unit squared.
    /// </summary>
    /// <param name="gradient">S: derivatives in the basis of <paramref name="covariance"/> (output unit per input unit).</param>
    /// <param name="covariance">Σ: symmetric positive semi-definite covariance, row-major n × n, in input units squared.</param>
    /// <returns>σ² (≥ 0 for a valid covariance).</returns>
    /// <exception cref="ArgumentException">The covariance is not n × n for a gradient of length n.</exception>
    public static double PropagateVariance(ReadOnlySpan<double> gradient, ReadOnlySpan<double> covariance)
    {
        int n = gradient.Length;
        if (covariance.Length != n * n)
        {
            throw new ArgumentException("Covariance must be n × n for a gradient of length n.", nameof(covariance));
        }

        double sum = 0;
        for (int i = 0; i < n; i++)
        {
            double row = 0;
            for (int j = 0; j < n; j++)
            {
                row += covariance[(i * n) + j] * gradient[j];
            }

            sum += gradient[i] * row;
        }

        return sum;
    }

    private static Outputs At(CalibrationParameters parameters, GateFaces faces, ProfileCoordinates c0, SensitivityParameter p, double x) => p switch
    {
        SensitivityParameter.GateLength => Evaluate(parameters, faces, c0, x, parameters.DopingPerCm3),
        SensitivityParameter.Doping => Evaluate(parameters, faces, c0, parameters.GateLengthNm, x),
        _ => Evaluate(parameters, faces, c0.With(p, x), parameters.GateLengthNm, parameters.DopingPerCm3),
    };

    private static Outputs Evaluate(CalibrationParameters parameters, GateFaces faces, ProfileCoordinates c, double lengthNm, double dopingPerCm3)
    {
        var fin = new FinMeasurement(c.ToProfile(), c.EotNm, parameters.Nominal.PhysicalThicknessNm, faces);
        SliceModelResult r = SliceModel.Evaluate(parameters.ToSliceInput(fin, lengthNm, dopingPerCm3));
        if (r.PunchThrough)
        {
            throw new ArgumentException("The model punches through at or near the nominal; no sensitivity table.", nameof(parameters));
        }

        return new Outputs(1000 * r.ThresholdLowV, 1000 * r.ThresholdHighV, 1000 * r.SwingLowVPerDecade, 1000 * r.DiblVPerV);
    }
}

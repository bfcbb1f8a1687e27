namespace FinWatch.Physics.Analytic;

/// <summary>
/// Fits the few calibration parameters of docs/model.md §G.3 — effective gate length L_eff, the short-channel prefactor
/// V_bi − φ_th (the barrier height) and the threshold offset — to electrical-test thresholds of measured devices, with a
/// ridge (Gaussian) prior centred on the starting parameter set, as G.3 asks ("keep the prior strong: the sensitivities
/// are physical, not fitted"). Minimises Σ (r/σ_meas)² + Σ ((θ − θ₀)/σ_prior)² by Gauss–Newton with a finite-difference
/// Jacobian; the posterior standard deviations come from the inverse of the final normal matrix.
/// </summary>
public static class Calibration
{
    /// <summary>Prior standard deviations: 2 nm for L_eff, 50 mV for the barrier height, 100 mV for the offset.</summary>
    public static readonly double[] DefaultPriorSd = [2.0, 0.05, 0.1];

    /// <param name="start">The physics-default (or previous) parameter set: the prior's centre.</param>
    /// <param name="observations">Devices with their measured fin and thresholds; none returns the prior.</param>
    /// <param name="name">Name of the fitted set.</param>
    /// <param name="version">Version of the fitted set.</param>
    /// <param name="measurementSdV">Standard deviation of an electrical-test threshold, V (default 5 mV).</param>
    /// <param name="priorSd">Prior standard deviations of (L_eff nm, barrier V, offset V); default <see cref="DefaultPriorSd"/>.</param>
    public static CalibrationFit Fit(CalibrationParameters start, IReadOnlyList<ElectricalObservation> observations, string name, string version,
        double measurementSdV = 0.005, IReadOnlyList<double>? priorSd = null)
    {
        ArgumentNullException.ThrowIfNull(start);
        ArgumentNullException.ThrowIfNull(observations);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(measurementSdV);
        var sd = priorSd ?? DefaultPriorSd;
        double[] theta0 = [start.GateLengthNm, start.BarrierHeightV, start.ThresholdOffsetV];
        var theta = (double[])theta0.Clone();
        var m = observations.Count;
        var before = Rms(start, observations, theta);
        var iterations = 0;
        var normal = new double[3, 3];
        for (; iterations < 20; iterations++)
        {
            // Normal equations (JᵀWJ + P) δ = JᵀW r − P (θ − θ₀), with W = 1/σ_meas², P = diag(1/σ_prior²).
            Array.Clear(normal);
            var rhs = new double[3];
            for (var k = 0; k < 3; k++)
            {
                normal[k, k] = 1 / (sd[k] * sd[k]);
                rhs[k] = -(theta[k] - theta0[k]) / (sd[k] * sd[k]);
            }

            foreach (var o in observations)
            {
                var (lin, sat) = Predict(start, o.Fin, theta);
                double[] r = [o.VtLinV - lin, o.VtSatV - sat];
                var j = new double[2, 3];
                for (var k = 0; k < 3; k++)
                {
                    var step = k == 0 ? 0.05 : 1e-4;
                    var plus = (double[])theta.Clone();
                    plus[k] += step;
                    var (l2, s2) = Predict(start, o.Fin, plus);
                    j[0, k] = (l2 - lin) / step;
                    j[1, k] = (s2 - sat) / step;
                }

                for (var a = 0; a < 3; a++)
                {
                    for (var b = 0; b < 3; b++)
                    {
                        normal[a, b] += ((j[0, a] * j[0, b]) + (j[1, a] * j[1, b])) / (measurementSdV * measurementSdV);
                    }

                    rhs[a] += ((j[0, a] * r[0]) + (j[1, a] * r[1])) / (measurementSdV * measurementSdV);
                }
            }

            var delta = Solve3(normal, rhs);
            for (var k = 0; k < 3; k++)
            {
                theta[k] += delta[k];
            }

            if (Math.Abs(delta[0]) < 1e-6 && Math.Abs(delta[1]) < 1e-9 && Math.Abs(delta[2]) < 1e-9)
            {
                iterations++;
                break;
            }
        }

        var covariance = Invert3(normal);
        var fitted = start with
        {
            Name = name,
            Version = version,
            GateLengthNm = theta[0],
            BarrierHeightOverrideV = theta[1],
            ThresholdOffsetV = theta[2],
        };
        return new CalibrationFit(fitted, theta[0], Math.Sqrt(covariance[0, 0]), theta[1], Math.Sqrt(covariance[1, 1]), theta[2], Math.Sqrt(covariance[2, 2]),
            before * 1000, Rms(start, observations, theta) * 1000, m, iterations);
    }

    /// <summary>Absolute thresholds (V) of a fin under the parameters θ = (L_eff, barrier height, offset).</summary>
    public static (double Lin, double Sat) Predict(CalibrationParameters start, in FinMeasurement fin, IReadOnlyList<double> theta)
    {
        var p = start with { GateLengthNm = theta[0], BarrierHeightOverrideV = theta[1] };
        var r = QuadratureSliceModel.Evaluate(p.ToSliceInput(fin));
        return (r.ThresholdLowV + theta[2], r.ThresholdHighV + theta[2]);
    }

    private static double Rms(CalibrationParameters start, IReadOnlyList<ElectricalObservation> observations, double[] theta)
    {
        if (observations.Count == 0)
        {
            return double.NaN;
        }

        var sum = 0.0;
        foreach (var o in observations)
        {
            var (lin, sat) = Predict(start, o.Fin, theta);
            sum += ((o.VtLinV - lin) * (o.VtLinV - lin)) + ((o.VtSatV - sat) * (o.VtSatV - sat));
        }

        return Math.Sqrt(sum / (2 * observations.Count));
    }

    private static double[] Solve3(double[,] a, double[] b)
    {
        var inv = Invert3(a);
        var x = new double[3];
        for (var i = 0; i < 3; i++)
        {
            x[i] = (inv[i, 0] * b[0]) + (inv[i, 1] * b[1]) + (inv[i, 2] * b[2]);
        }

        return x;
    }

    // Inverse of a symmetric positive definite 3 × 3 matrix by cofactors.
    private static double[,] Invert3(double[,] a)
    {
        var c00 = (a[1, 1] * a[2, 2]) - (a[1, 2] * a[2, 1]);
        var c01 = (a[1, 2] * a[2, 0]) - (a[1, 0] * a[2, 2]);
        var c02 = (a[1, 0] * a[2, 1]) - (a[1, 1] * a[2, 0]);
        var det = (a[0, 0] * c00) + (a[0, 1] * c01) + (a[0, 2] * c02);
        var inv = new double[3, 3];
        inv[0, 0] = c00 / det;
        inv[1, 0] = c01 / det;
        inv[2, 0] = c02 / det;
        inv[0, 1] = ((a[0, 2] * a[2, 1]) - (a[0, 1] * a[2, 2])) / det;
        inv[1, 1] = ((a[0, 0] * a[2, 2]) - (a[0, 2] * a[2, 0])) / det;
        inv[2, 1] = ((a[0, 1] * a[2, 0]) - (a[0, 0] * a[2, 1])) / det;
        inv[0, 2] = ((a[0, 1] * a[1, 2]) - (a[0, 2] * a[1, 1])) / det;
        inv[1, 2] = ((a[0, 2] * a[1, 0]) - (a[0, 0] * a[1, 2])) / det;
        inv[2, 2] = ((a[0, 0] * a[1, 1]) - (a[0, 1] * a[1, 0])) / det;
        return inv;
    }
}

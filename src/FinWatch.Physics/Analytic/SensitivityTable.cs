namespace FinWatch.Physics.Analytic;

/// <summary>The G.4 sensitivity table at a parameter set's nominal: one <see cref="SensitivityRow"/> per basis parameter.</summary>
public sealed class SensitivityTable
{
    private readonly SensitivityRow[] _rows;

    /// <summary>Creates the table from one row per <see cref="SensitivityParameter"/>, in enum order.</summary>
    /// <param name="nominal">Coordinates of the nominal fin.</param>
    /// <param name="rows">Seven rows in <see cref="SensitivityParameter"/> order.</param>
    /// <exception cref="ArgumentException">The rows are not one per parameter in enum order.</exception>
    public SensitivityTable(ProfileCoordinates nominal, IReadOnlyList<SensitivityRow> rows)
    {
        ArgumentNullException.ThrowIfNull(rows);
        int count = Enum.GetValues<SensitivityParameter>().Length;
        if (rows.Count != count)
        {
            throw new ArgumentException("One row per parameter is required.", nameof(rows));
        }

        _rows = new SensitivityRow[count];
        for (int i = 0; i < count; i++)
        {
            if ((int)rows[i].Parameter != i)
            {
                throw new ArgumentException("Rows must be in SensitivityParameter order.", nameof(rows));
            }

            _rows[i] = rows[i];
        }

        Nominal = nominal;
    }

    /// <summary>Coordinates of the nominal fin the derivatives were taken at.</summary>
    public ProfileCoordinates Nominal { get; }

    /// <summary>All rows in <see cref="SensitivityParameter"/> order.</summary>
    public IReadOnlyList<SensitivityRow> Rows => _rows;

    /// <summary>The row of one parameter.</summary>
    /// <param name="parameter">The parameter.</param>
    /// <returns>The row.</returns>
    public SensitivityRow this[SensitivityParameter parameter] => _rows[(int)parameter];

    /// <summary>
    /// Per-input linear contributions of a fin's profile change against the nominal to one output:
    /// (x − x_nom)·dOutput/dx for w_mid, θ, H, r, EOT (G.2 step 7). Consistent with the chart of
    /// <see cref="ProfileCoordinates"/>: the taper change is taken at the nominal height, θ(W_b − W_t of the fin, H_nom) − θ_nom,
    /// and the height change at fixed W_t, W_b.
    /// </summary>
    /// <param name="fin">Coordinates of the fin.</param>
    /// <param name="output">The output.</param>
    /// <returns>The contributions, in the output's unit.</returns>
    public ShiftContributions Contributions(in ProfileCoordinates fin, ModelOutput output)
    {
        double C(SensitivityParameter p, double delta) => delta * this[p].Derivative(output);
        return new ShiftContributions(
            C(SensitivityParameter.MidWidth, fin.MidWidthNm - Nominal.MidWidthNm),
            C(SensitivityParameter.Taper, fin.TaperAtHeightDeg(Nominal.HeightNm) - Nominal.TaperDeg),
            C(SensitivityParameter.Height, fin.HeightNm - Nominal.HeightNm),
            C(SensitivityParameter.CornerRadius, fin.CornerRadiusNm - Nominal.CornerRadiusNm),
            C(SensitivityParameter.Eot, fin.EotNm - Nominal.EotNm));
    }

    /// <summary>
    /// Standard deviation of an output from independent random metrology errors of the measured profile (G.4:
    /// σ² = Sᵀ Σ S), linearised at the nominal. The errors on W_t and W_b map to the basis as
    /// w_mid = (W_t + W_b)/2 and θ = atan((W_b − W_t)/(2 H_nom)), so Σ = J diag(σ²) Jᵀ and both widths' errors enter
    /// w_mid and θ with their correlation; H, r and EOT map one to one.
    /// </summary>
    /// <param name="output">The output.</param>
    /// <param name="topWidthSdNm">σ of W_t, nm (≥ 0).</param>
    /// <param name="bottomWidthSdNm">σ of W_b, nm (≥ 0).</param>
    /// <param name="heightSdNm">σ of H, nm (≥ 0).</param>
    /// <param name="cornerRadiusSdNm">σ of r, nm (≥ 0).</param>
    /// <param name="eotSdNm">σ of EOT, nm (≥ 0; default 0, the product's EOT is not measured per site).</param>
    /// <returns>σ of the output in its unit.</returns>
    /// <exception cref="ArgumentOutOfRangeException">A standard deviation is negative or not finite.</exception>
    public double MetrologySd(ModelOutput output, double topWidthSdNm, double bottomWidthSdNm, double heightSdNm, double cornerRadiusSdNm, double eotSdNm = 0)
    {
        foreach (double sd in (ReadOnlySpan<double>)[topWidthSdNm, bottomWidthSdNm, heightSdNm, cornerRadiusSdNm, eotSdNm])
        {
            if (!double.IsFinite(sd) || sd < 0)
            {
                throw new ArgumentOutOfRangeException(nameof(topWidthSdNm), sd, "Standard deviations must be finite and ≥ 0.");
            }
        }

        // dθ/dW_b = −dθ/dW_t = (180/π)·cos²θ_nom/(2 H_nom), in degrees per nm.
        double cos = Math.Cos(Nominal.TaperDeg * Math.PI / 180);
        double k = 180 / Math.PI * cos * cos / (2 * Nominal.HeightNm);
        double vt = topWidthSdNm * topWidthSdNm, vb = bottomWidthSdNm * bottomWidthSdNm;
        int n = _rows.Length;
        var covariance = new double[n * n];
        int w = (int)SensitivityParameter.MidWidth, t = (int)SensitivityParameter.Taper;
        covariance[(w * n) + w] = 0.25 * (vt + vb);
        covariance[(t * n) + t] = k * k * (vt + vb);
        covariance[(w * n) + t] = covariance[(t * n) + w] = 0.5 * k * (vb - vt);
        covariance[((int)SensitivityParameter.Height * n) + (int)SensitivityParameter.Height] = heightSdNm * heightSdNm;
        covariance[((int)SensitivityParameter.CornerRadius * n) + (int)SensitivityParameter.CornerRadius] = cornerRadiusSdNm * cornerRadiusSdNm;
        covariance[((int)SensitivityParameter.Eot * n) + (int)SensitivityParameter.Eot] = eotSdNm * eotSdNm;
        return Math.Sqrt(Math.Max(0, Sensitivity.PropagateVariance(Gradient(output), covariance)));
    }

    /// <summary>The gradient of one output over the seven basis parameters, in <see cref="SensitivityParameter"/> order.</summary>
    /// <param name="output">The output.</param>
    /// <returns>A new array of seven derivatives.</returns>
    public double[] Gradient(ModelOutput output)
    {
        var g = new double[_rows.Length];
        for (int i = 0; i < g.Length; i++)
        {
            g[i] = _rows[i].Derivative(output);
        }

        return g;
    }
}

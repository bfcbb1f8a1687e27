namespace FinWatch.Physics.Analytic;

/// <summary>
/// Derivatives of the four outputs with respect to one basis parameter at the nominal (G.4), per unit of the
/// parameter (nm, degree, or 1e17 cm⁻³ for doping; see <see cref="SensitivityParameter"/>).
/// </summary>
/// <param name="Parameter">The basis parameter.</param>
/// <param name="ThresholdLinMv">dV_T,lin/dx in mV per unit.</param>
/// <param name="ThresholdSatMv">dV_T,sat/dx in mV per unit.</param>
/// <param name="SwingLinMvPerDecade">dS_lin/dx in mV/decade per unit.</param>
/// <param name="DiblMvPerV">dDIBL/dx in mV/V per unit.</param>
/// <param name="ThresholdLinCurvatureMv">d²V_T,lin/dx² in mV per unit² (0 when a one-sided difference was used).</param>
/// <param name="ThresholdSatCurvatureMv">d²V_T,sat/dx² in mV per unit² (0 when a one-sided difference was used).</param>
/// <param name="OneSided">True when the nominal sits at the lower bound (r or N_A = 0) and a forward difference was used.</param>
public readonly record struct SensitivityRow(
    SensitivityParameter Parameter,
    double ThresholdLinMv,
    double ThresholdSatMv,
    double SwingLinMvPerDecade,
    double DiblMvPerV,
    double ThresholdLinCurvatureMv,
    double ThresholdSatCurvatureMv,
    bool OneSided)
{
    /// <summary>The derivative of one output, in that output's unit per unit of the parameter.</summary>
    /// <param name="output">The output.</param>
    /// <returns>The derivative.</returns>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="output"/> is undefined.</exception>
    public double Derivative(ModelOutput output) => output switch
    {
        ModelOutput.ThresholdLin => ThresholdLinMv,
        ModelOutput.ThresholdSat => ThresholdSatMv,
        ModelOutput.SwingLin => SwingLinMvPerDecade,
        ModelOutput.Dibl => DiblMvPerV,
        _ => throw new ArgumentOutOfRangeException(nameof(output)),
    };
}

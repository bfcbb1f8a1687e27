namespace FinWatch.Physics.Solver;

/// <summary>
/// Result of a full 2-D what-if run (docs/model.md §F.6): the gate sweep, the constant-charge threshold,
/// swing, C–V curve, second-derivative threshold, the maps re-solved at V_T and the corner population.
/// </summary>
/// <remarks>
/// Data conditions are reported as NaN, never as an exception: <see cref="ThresholdVoltageV"/> is NaN when the sweep
/// does not cross N′ = n_s,crit·P_ref from below (it starts above it or never reaches it); then
/// <see cref="AtThreshold"/> is <see langword="null"/> and the corner quantities are empty/NaN. A swing is NaN
/// when the sweep does not bracket both of its levels (N_crit/1000 and N_crit/100, or N_crit/10 and N_crit);
/// the second-derivative threshold is NaN when the peak lies at an end of the sweep.
/// </remarks>
public sealed class FinSolverResult
{
    internal FinSolverResult(
        string shapeKey,
        SolverGrid grid,
        IReadOnlyList<SweepPoint> sweep,
        IReadOnlyList<double> capacitanceFPerCm,
        double criticalElectronsPerNm,
        double thresholdVoltageV,
        double swingMvPerDecade,
        double swingBelowThresholdMvPerDecade,
        double secondDerivativeThresholdV,
        BiasSolution? atThreshold,
        IReadOnlyList<CornerSample> corner,
        double topElectronShare,
        double topAreaShare,
        int totalNewtonIterations)
    {
        ShapeKey = shapeKey;
        Grid = grid;
        Sweep = sweep;
        CapacitanceFPerCm = capacitanceFPerCm;
        CriticalElectronsPerNm = criticalElectronsPerNm;
        ThresholdVoltageV = thresholdVoltageV;
        SwingMvPerDecade = swingMvPerDecade;
        SwingBelowThresholdMvPerDecade = swingBelowThresholdMvPerDecade;
        SecondDerivativeThresholdV = secondDerivativeThresholdV;
        AtThreshold = atThreshold;
        Corner = corner;
        TopElectronShare = topElectronShare;
        TopAreaShare = topAreaShare;
        TotalNewtonIterations = totalNewtonIterations;
    }

    /// <summary><see cref="FinSolverRequest.ShapeKey"/> of the request that produced this result.</summary>
    public string ShapeKey { get; }

    /// <summary>The grid of the maps.</summary>
    public SolverGrid Grid { get; }

    /// <summary>The solved biases in increasing V_G.</summary>
    public IReadOnlyList<SweepPoint> Sweep { get; }

    /// <summary>
    /// C–V curve C = −dQ_si/dV_G at each sweep point by central differences, in F per cm of channel length; NaN at
    /// the two end points.
    /// </summary>
    public IReadOnlyList<double> CapacitanceFPerCm { get; }

    /// <summary>Threshold criterion N_crit = n_s,crit·P_ref in nm⁻¹ (n_s,crit = 1e11 cm⁻², F.6).</summary>
    public double CriticalElectronsPerNm { get; }

    /// <summary>Constant-charge threshold V_T in V: ln N′ interpolated linearly between sweep points (F.6).</summary>
    public double ThresholdVoltageV { get; }

    /// <summary>Deep-subthreshold swing V_G(N_crit/100) − V_G(N_crit/1000), in mV/decade (F.6).</summary>
    public double SwingMvPerDecade { get; }

    /// <summary>Swing over the decade below threshold, V_G(N_crit) − V_G(N_crit/10), in mV/decade (F.6).</summary>
    public double SwingBelowThresholdMvPerDecade { get; }

    /// <summary>Alternative threshold at the peak of d²N′/dV_G² (parabolic refinement of the discrete peak), in V.</summary>
    public double SecondDerivativeThresholdV { get; }

    /// <summary>Potential and electron maps re-solved at V_T; <see langword="null"/> when V_T is NaN.</summary>
    public BiasSolution? AtThreshold { get; }

    /// <summary>Corner population at 0.5 nm and 1 nm depth, at V_T (F.6); empty when V_T is NaN.</summary>
    public IReadOnlyList<CornerSample> Corner { get; }

    /// <summary>Share of the electrons (at V_T) in the top 15 % of the fin height (dimensionless); NaN when V_T is NaN.</summary>
    public double TopElectronShare { get; }

    /// <summary>Share of the silicon area in the top 15 % of the fin height (dimensionless).</summary>
    public double TopAreaShare { get; }

    /// <summary>Newton iterations over the whole run, the re-solve included.</summary>
    public int TotalNewtonIterations { get; }
}

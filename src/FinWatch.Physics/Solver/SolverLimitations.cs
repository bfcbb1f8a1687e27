namespace FinWatch.Physics.Solver;

/// <summary>
/// What the 2-D solver does not model (docs/model.md §F.10), as text for the UI.
/// </summary>
public static class SolverLimitations
{
    /// <summary>The F.10 list, one limitation per entry, in display order.</summary>
    public static IReadOnlyList<string> Items { get; } =
    [
        "Classical solver: no quantum confinement. Add the analytic QC shift (C.3); a density-gradient or Schrödinger–Poisson option may follow.",
        "Cross-section only, long channel, V_DS → 0: no short-channel effects or DIBL. Use the quasi-2-D model (B.5) or a 3-D solver.",
        "No interface traps and no fixed oxide charge (a Q_f/q surface-charge input is a small extension).",
        "No work-function granularity: the gate is one equipotential with a single contact potential Δφ.",
        "Boltzmann statistics: no Fermi–Dirac degeneracy, adequate up to threshold (≲ 1e19 cm⁻³ electrons).",
        "Complete ionisation of the dopants; no strain; no mobility — the threshold is charge-based (constant charge = constant current in the linear regime).",
        "Results are trend values for differences against the nominal fin computed on the same grid, not absolute thresholds.",
    ];
}

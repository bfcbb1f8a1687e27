namespace FinWatch.Physics.Solver;

/// <summary>Stage of a 2-D solve, as reported in <see cref="SolverProgress"/>.</summary>
public enum SolverStage
{
    /// <summary>Building the mesh: materials, silicon fractions and edge coefficients (F.2, F.3).</summary>
    Meshing,

    /// <summary>Newton iteration at one bias of the gate sweep (F.4).</summary>
    GateSweep,

    /// <summary>Newton iteration of the re-solve at the extracted threshold (F.6).</summary>
    ThresholdResolve,

    /// <summary>Inverse iteration of the scale-length eigenmode (B.4, F.8).</summary>
    Eigenmode,
}

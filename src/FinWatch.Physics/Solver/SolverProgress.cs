namespace FinWatch.Physics.Solver;

/// <summary>
/// Progress of a running solve, reported after every Newton iteration (docs/model.md §F.4).
/// </summary>
/// <param name="Stage">What is being computed.</param>
/// <param name="BiasIndex">Zero-based index of the gate bias being solved; −1 for the final re-solve at V_T and for the eigenmode.</param>
/// <param name="BiasCount">Number of gate biases planned for the sweep (an upper bound: the sweep may stop early); 0 for the eigenmode.</param>
/// <param name="GateVoltageV">Gate voltage of the current solve, in V; NaN for the eigenmode.</param>
/// <param name="Iteration">One-based Newton (or inverse-iteration) step within the current solve.</param>
/// <param name="MaxUpdateV">max|δψ| of this Newton step before limiting, in V; for the eigenmode the relative change of the eigenvalue.</param>
public readonly record struct SolverProgress(
    SolverStage Stage,
    int BiasIndex,
    int BiasCount,
    double GateVoltageV,
    int Iteration,
    double MaxUpdateV);

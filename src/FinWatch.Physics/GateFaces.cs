namespace FinWatch.Physics;

/// <summary>
/// Which faces of the fin cross-section the gate covers (docs/model.md §A.4 and A.7). Written as text only through
/// <see cref="GateFacesText"/> ("tri-gate", "double-gate").
/// </summary>
public enum GateFaces
{
    /// <summary>
    /// Tri-gate: the flat top, both rounded top corners and both straight sidewalls are gated (A.4).
    /// </summary>
    TriGate,

    /// <summary>
    /// Double gate: a hard mask stays on the fin top (A.7), so the top and the top corners are not gated;
    /// only the two straight sidewall segments below the corner arcs are gated.
    /// </summary>
    DoubleGate,
}

namespace FinWatch.Data.Entities;

/// <summary>The faces of the fin that the gate controls (stored as text).</summary>
public enum GateFaces
{
    /// <summary>Gate on the top and both sidewalls.</summary>
    TriGate = 0,

    /// <summary>A hard mask stays on top: only the two sidewalls are gated.</summary>
    DoubleGate = 1,
}

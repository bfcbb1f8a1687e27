namespace FinWatch.Physics.Analytic;

/// <summary>
/// Linear (sensitivity-table) contributions of a record's profile change to one output (G.2 step 7; G.4), in the
/// output's unit (mV for thresholds). <see cref="Total"/> is the linear estimate.
/// </summary>
/// <param name="MidWidth">From Δw_mid.</param>
/// <param name="Taper">From Δθ at fixed mid width.</param>
/// <param name="Height">From ΔH.</param>
/// <param name="CornerRadius">From Δr.</param>
/// <param name="Dielectric">From ΔEOT.</param>
public readonly record struct ShiftContributions(double MidWidth, double Taper, double Height, double CornerRadius, double Dielectric)
{
    /// <summary>The linear estimate: the sum of the five contributions.</summary>
    public double Total => MidWidth + Taper + Height + CornerRadius + Dielectric;
}

namespace FinWatch.Statistics.RunLength;

/// <summary>How a run length was obtained.</summary>
public enum RunLengthMethod
{
    /// <summary>Solved exactly (up to rounding) from the Markov chain over the zone history (docs/statistics.md §4.3).</summary>
    MarkovChain,

    /// <summary>Estimated by a seeded Monte Carlo simulation of the rules (docs/statistics.md §4.5).</summary>
    Simulation,
}

/// <summary>
/// An average run length in points (the expected number of points up to and including the first signal) and how it was
/// obtained.
/// </summary>
/// <param name="Points">The ARL in points, ≥ 1; +∞ when it is too long to resolve (an exact ARL above 1e12, or a
/// simulation whose point budget finished too few runs; see <see cref="RunLengthSimulation"/>).</param>
/// <param name="StandardError">Standard error of <paramref name="Points"/> in points: 0 for the exact chain, the sample
/// standard deviation of the run lengths over √runs for a simulation, NaN when the ARL is not resolved.</param>
/// <param name="Method">The exact chain or the simulation.</param>
/// <param name="Runs">Number of simulated runs that signalled (0 for the exact chain).</param>
public readonly record struct RunLengthEstimate(double Points, double StandardError, RunLengthMethod Method, int Runs)
{
    /// <summary>Whether <see cref="Points"/> is a finite value.</summary>
    public bool IsResolved => double.IsFinite(Points);
}

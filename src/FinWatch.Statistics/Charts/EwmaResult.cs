namespace FinWatch.Statistics.Charts;

/// <summary>
/// An EWMA chart over a whole series (docs/statistics.md §4.1), from <see cref="Ewma.Compute"/>. All per-index arrays have the
/// length of the input and are indexed by input row; missing rows hold <see cref="double.NaN"/>.
/// </summary>
/// <param name="Z">EWMA statistic z_i per input row, data units.</param>
/// <param name="Ucl">Exact (time-varying) upper limit per input row, data units.</param>
/// <param name="Lcl">Exact (time-varying) lower limit per input row, data units.</param>
/// <param name="Signals">Input-row indices (ascending) where z is strictly outside its exact limits.</param>
/// <param name="AsymptoticUcl">Asymptotic upper limit target + L·σ·√(λ/(2 − λ)).</param>
/// <param name="AsymptoticLcl">Asymptotic lower limit target − L·σ·√(λ/(2 − λ)).</param>
public sealed record EwmaResult(double[] Z, double[] Ucl, double[] Lcl, int[] Signals, double AsymptoticUcl, double AsymptoticLcl);

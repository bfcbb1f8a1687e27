namespace FinWatch.Statistics.Rules;

/// <summary>One signal of a run rule.</summary>
/// <param name="Rule">The rule that signalled.</param>
/// <param name="Index">The caller's input index of the point that completes the pattern; that point is the flagged one (docs/statistics.md §3.3 item 4).</param>
/// <param name="Pattern">
/// The input indices, ascending, of the points that form the pattern and end with <paramref name="Index"/>: for WE1/N1
/// the point itself; for WE2/N5 and WE3/N6 the points of the (possibly truncated) 3- or 5-point window that are beyond
/// the zone on the flagged point's side; for the run rules (WE4, N2, N3, N4, N7, N8) the last required-length points
/// of the run (8, 9, 6, 14, 15 and 8 points), even when the run is longer.
/// </param>
public readonly record struct RuleSignal(RunRule Rule, int Index, int[] Pattern);

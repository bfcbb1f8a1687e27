namespace FinWatch.Statistics.Capability;

/// <summary>
/// Normal-theory process capability (within sigma) and performance (overall sigma) indices, docs/statistics.md §5.
/// All indices are dimensionless. A null member is undefined for these data or this specification, and
/// <see cref="Reasons"/> then says why under the member's name; no member is ever NaN or infinite.
/// </summary>
/// <param name="N">Number of non-missing values used.</param>
/// <param name="Mean">Mean x̄ of the values; null when there are none.</param>
/// <param name="SigmaWithin">The within (short-term) sigma supplied by the caller; null when it was NaN.</param>
/// <param name="SigmaOverall">Sample standard deviation of all values, divisor N − 1, no c4 correction;
/// null for N &lt; 2.</param>
/// <param name="Cp">(USL − LSL)/(6·sigma_w); null for a one-sided specification.</param>
/// <param name="Cpu">(USL − x̄)/(3·sigma_w).</param>
/// <param name="Cpl">(x̄ − LSL)/(3·sigma_w).</param>
/// <param name="Cpk">min(Cpu, Cpl), or the one that exists.</param>
/// <param name="Pp">(USL − LSL)/(6·sigma_o).</param>
/// <param name="Ppu">(USL − x̄)/(3·sigma_o).</param>
/// <param name="Ppl">(x̄ − LSL)/(3·sigma_o).</param>
/// <param name="Ppk">min(Ppu, Ppl), or the one that exists.</param>
/// <param name="Cpm">(USL − LSL)/(6·√(sigma_o² + (x̄ − T)²)) (Chan, Cheng and Spiring 1988).</param>
/// <param name="CpmTarget">The target T used for Cpm.</param>
/// <param name="PpmWithin">Expected ppm outside the specification with sigma_w.</param>
/// <param name="PpmOverall">Expected ppm outside the specification with sigma_o.</param>
/// <param name="ConfidenceLevel">Level of the intervals and lower bounds, e.g. 0.95.</param>
/// <param name="Intervals">Two-sided intervals keyed by <see cref="CapabilityIndexNames"/>: Cp and Pp by
/// the chi-square method, Cpk and Ppk by Bissell (1990) (docs/statistics.md §5.2), all with ν = N − 1.</param>
/// <param name="LowerBounds">One-sided lower confidence bounds at the same level, same keys.</param>
/// <param name="Reasons">Why a member is null, keyed by member name ("Cp", "Ppk", "PpmWithin", …); for
/// intervals and bounds the key is "Intervals.Cp" and so on.</param>
/// <param name="IntervalNote">The caveat of docs/statistics.md §5.2 on the within intervals.</param>
public sealed record CapabilityResult(
    int N,
    double? Mean,
    double? SigmaWithin,
    double? SigmaOverall,
    double? Cp,
    double? Cpu,
    double? Cpl,
    double? Cpk,
    double? Pp,
    double? Ppu,
    double? Ppl,
    double? Ppk,
    double? Cpm,
    double? CpmTarget,
    OutsideSpecPpm? PpmWithin,
    OutsideSpecPpm? PpmOverall,
    double ConfidenceLevel,
    IReadOnlyDictionary<string, ConfidenceInterval> Intervals,
    IReadOnlyDictionary<string, double> LowerBounds,
    IReadOnlyDictionary<string, string> Reasons,
    string IntervalNote);

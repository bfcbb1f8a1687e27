namespace FinWatch.Statistics.Capability;

/// <summary>
/// Percentile-method capability from a fitted two-parameter lognormal distribution (docs/statistics.md §7). Fitted to
/// all data, these are strictly performance indices (overall variation); see <see cref="Method"/>.
/// Null members are undefined and <see cref="Reasons"/> says why under the member's name.
/// </summary>
/// <param name="Method">"percentile method, fitted lognormal (overall variation)".</param>
/// <param name="N">Number of non-missing values used.</param>
/// <param name="Mu">Fitted mu = mean of ln x (log units).</param>
/// <param name="Sigma">Fitted sigma = √(mean((ln x − mu)²)), divisor n (maximum likelihood), log units.</param>
/// <param name="Median">Fitted median exp(mu), data units.</param>
/// <param name="LowerPercentile">x_0.00135 = exp(mu + sigma·Φ⁻¹(0.00135)), data units.</param>
/// <param name="UpperPercentile">x_0.99865 = exp(mu + sigma·Φ⁻¹(0.99865)), data units.</param>
/// <param name="CpPercentile">(USL − LSL)/(x_0.99865 − x_0.00135); null for a one-sided specification.</param>
/// <param name="CpuPercentile">(USL − x_0.5)/(x_0.99865 − x_0.5).</param>
/// <param name="CplPercentile">(x_0.5 − LSL)/(x_0.5 − x_0.00135).</param>
/// <param name="CpkPercentile">min(Cpu, Cpl), or the one that exists.</param>
/// <param name="Reasons">Why a member is null, keyed by member name.</param>
public sealed record PercentileCapabilityResult(
    string Method,
    int N,
    double? Mu,
    double? Sigma,
    double? Median,
    double? LowerPercentile,
    double? UpperPercentile,
    double? CpPercentile,
    double? CpuPercentile,
    double? CplPercentile,
    double? CpkPercentile,
    IReadOnlyDictionary<string, string> Reasons);

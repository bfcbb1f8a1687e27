namespace FinWatch.Statistics.Constants;

/// <summary>
/// The factors for variables control charts for subgroups of <paramref name="N"/> independent values from a
/// normal distribution (docs/statistics.md §1.1). All factors are dimensionless; multiply them by sigma, by the mean
/// range Rbar or by the mean standard deviation sbar in data units.
/// </summary>
/// <param name="N">Subgroup size, 2..25.</param>
/// <param name="RangeMean">d2 = E[R]/sigma, the mean of the relative range.</param>
/// <param name="RangeSd">d3 = sd(R)/sigma, the standard deviation of the relative range.</param>
/// <param name="C4">c4 = E[s]/sigma, s the sample standard deviation with divisor n − 1.</param>
/// <param name="A2">3/(d2·√n): Xbar chart limits xbarbar ± A2·Rbar.</param>
/// <param name="A3">3/(c4·√n): Xbar chart limits xbarbar ± A3·sbar.</param>
/// <param name="B3">max(0, 1 − 3·√(1 − c4²)/c4): S chart lower limit B3·sbar.</param>
/// <param name="B4">1 + 3·√(1 − c4²)/c4: S chart upper limit B4·sbar.</param>
/// <param name="B5">max(0, c4 − 3·√(1 − c4²)): S chart lower limit B5·sigma for a known sigma.</param>
/// <param name="B6">c4 + 3·√(1 − c4²): S chart upper limit B6·sigma for a known sigma.</param>
/// <param name="D1">max(0, d2 − 3·d3): R chart lower limit D1·sigma for a known sigma.</param>
/// <param name="D2">d2 + 3·d3: R chart upper limit D2·sigma for a known sigma.</param>
/// <param name="D3">max(0, 1 − 3·d3/d2): R chart lower limit D3·Rbar.</param>
/// <param name="D4">1 + 3·d3/d2: R chart upper limit D4·Rbar.</param>
public sealed record ChartConstants(
    int N,
    double RangeMean,
    double RangeSd,
    double C4,
    double A2,
    double A3,
    double B3,
    double B4,
    double B5,
    double B6,
    double D1,
    double D2,
    double D3,
    double D4);

using FinWatch.Statistics.Constants;

namespace FinWatch.Statistics.Shewhart;

/// <summary>
/// Shewhart charts of docs/statistics.md §2: individuals and moving range, subgroup mean with range or standard deviation,
/// unequal subgroup sizes (2.3) and data, baseline or known limits (2.4). Every limit is written through the sigma of
/// individual values, <c>sigma_hat</c>, so one rule covers equal and unequal subgroups and reduces exactly to the
/// textbook formulas (x̄̄ ± A2·R̄, D3·R̄, D4·R̄, …) when the sizes are equal.
/// </summary>
/// <remarks>
/// Missing values are <see cref="double.NaN"/>. They are skipped (docs/statistics.md §3.3 item 8): the moving range after a gap is
/// taken between the values either side of it and is plotted at the later one. In <see cref="ConstantsMode.Table"/> with
/// the usual multiplier 3 the printed factors are used directly (A2, A3, D3, D4, B3, B4, D1, D2, B5, B6); with another
/// multiplier the factors are built from that mode's d2, d3 and c4. "Beyond the limits" is strict.
/// </remarks>
public static class ShewhartCharts
{
    /// <summary>The usual distance of the control limits from the centre line, in sigmas.</summary>
    public const double DefaultMultiplier = 3;

    /// <summary>Individuals and moving-range chart (docs/statistics.md §2.1).</summary>
    /// <param name="values">One value per input position; NaN for a missing value.</param>
    /// <param name="limits">Where the limits come from.</param>
    /// <param name="mode">Exact or printed constants (docs/statistics.md §1.4).</param>
    /// <param name="multiplier">Limits at centre ± multiplier·sigma; &gt; 0.</param>
    /// <exception cref="ArgumentOutOfRangeException">The multiplier is not positive, or known limits lack a finite mean
    /// or a non-negative sigma, or a baseline count is not positive.</exception>
    public static ShewhartChart Individuals(ReadOnlySpan<double> values, LimitRequest limits, ConstantsMode mode = ConstantsMode.Exact,
        double multiplier = DefaultMultiplier)
    {
        Validate(limits, multiplier);
        var n = values.Length;
        var c2 = ControlChartConstants.Get(2, mode);
        var mr = Fill(n, double.NaN);
        var previous = -1;
        var moments = new RunningMoments();
        var mrMoments = new RunningMoments();
        for (var i = 0; i < n; i++)
        {
            if (double.IsNaN(values[i]))
            {
                continue;
            }

            if (limits.InEstimate(i))
            {
                moments.Add(values[i]);
            }

            if (previous >= 0)
            {
                mr[i] = Math.Abs(values[i] - values[previous]);
                // A moving range belongs to the estimate when both of its points do (docs/statistics.md §2.4).
                if (limits.InEstimate(i) && limits.InEstimate(previous))
                {
                    mrMoments.Add(mr[i]);
                }
            }

            previous = i;
        }

        var warnings = new List<string>();
        var (center, sigma) = CenterAndSigma(limits, moments, mrMoments.Count > 0 ? mrMoments.Mean / c2.RangeMean : null, moments.Count, "points", warnings);

        var s = sigma ?? double.NaN;
        var half = multiplier * s;
        var primary = new ChartSeries(Copy(values), Fill(n, center), Fill(n, center + half), Fill(n, center - half));
        var (rCenter, rUpper, rLower) = RangeLimits(c2, mode, multiplier, s);
        var secondary = new ChartSeries(mr, Fill(n, rCenter), Fill(n, rUpper), Fill(n, rLower));
        var sizes = new int[n];
        for (var i = 0; i < n; i++)
        {
            sizes[i] = double.IsNaN(values[i]) ? 0 : 1;
        }

        return Finish(ShewhartChartType.IndividualsMovingRange, limits, center, sigma, primary, secondary, sizes, multiplier, warnings);
    }

    /// <summary>Subgroup mean chart with range or standard-deviation chart, equal or unequal sizes (docs/statistics.md §2.2, 2.3).</summary>
    /// <param name="subgroups">The values of each subgroup (input position); NaN for a missing value inside a subgroup.</param>
    /// <param name="type"><see cref="ShewhartChartType.MeanRange"/> or <see cref="ShewhartChartType.MeanStandardDeviation"/>.</param>
    /// <param name="limits">Where the limits come from; positions are subgroups.</param>
    /// <param name="mode">Exact or printed constants.</param>
    /// <param name="multiplier">Limits at centre ± multiplier·sigma; &gt; 0.</param>
    /// <exception cref="ArgumentOutOfRangeException">As for <see cref="Individuals"/>; also a subgroup with more than
    /// 25 values (the constants are defined for 2 to 25) or a type that is not a subgroup chart.</exception>
    public static ShewhartChart Subgroups(IReadOnlyList<double[]> subgroups, ShewhartChartType type, LimitRequest limits,
        ConstantsMode mode = ConstantsMode.Exact, double multiplier = DefaultMultiplier)
    {
        Validate(limits, multiplier);
        if (type == ShewhartChartType.IndividualsMovingRange)
        {
            throw new ArgumentOutOfRangeException(nameof(type), type, "Use Individuals for the individuals chart.");
        }

        var useRange = type == ShewhartChartType.MeanRange;
        var m = subgroups.Count;
        var sizes = new int[m];
        var means = Fill(m, double.NaN);
        var spreads = Fill(m, double.NaN);
        var all = new RunningMoments();
        var sigmaTerms = new RunningMoments();
        for (var i = 0; i < m; i++)
        {
            var g = new RunningMoments();
            double min = double.PositiveInfinity, max = double.NegativeInfinity;
            foreach (var v in subgroups[i])
            {
                if (double.IsNaN(v))
                {
                    continue;
                }

                g.Add(v);
                min = Math.Min(min, v);
                max = Math.Max(max, v);
            }

            sizes[i] = (int)g.Count;
            if (sizes[i] > ControlChartConstants.MaxSubgroupSize)
            {
                throw new ArgumentOutOfRangeException(nameof(subgroups), sizes[i],
                    $"Subgroup {i} has {sizes[i]} values; the chart constants are defined for 2 to {ControlChartConstants.MaxSubgroupSize}.");
            }

            if (sizes[i] == 0)
            {
                continue;
            }

            means[i] = g.Mean;
            if (limits.InEstimate(i))
            {
                // x̄̄ = Σ n_i·x̄_i / Σ n_i, the mean of all individual values (docs/statistics.md §2.3).
                foreach (var v in subgroups[i])
                {
                    if (!double.IsNaN(v))
                    {
                        all.Add(v);
                    }
                }
            }

            if (sizes[i] >= 2)
            {
                var c = ControlChartConstants.Get(sizes[i], mode);
                spreads[i] = useRange ? max - min : g.SampleStandardDeviation;
                if (limits.InEstimate(i))
                {
                    // Each term R_i/d2(n_i) or s_i/c4(n_i) is unbiased for sigma (docs/statistics.md §2.3).
                    sigmaTerms.Add(spreads[i] / (useRange ? c.RangeMean : c.C4));
                }
            }
        }

        var warnings = new List<string>();
        var (center, sigma) = CenterAndSigma(limits, all, sigmaTerms.Count > 0 ? sigmaTerms.Mean : null, sigmaTerms.Count, "subgroups", warnings);

        if (sizes.Where(k => k > 0).Distinct().Skip(1).Any())
        {
            // docs/statistics.md §2.3
            warnings.Add("Subgroup sizes differ, so the limits vary from point to point.");
        }

        var s = sigma ?? double.NaN;
        var pCenter = Fill(m, center);
        var pUpper = Fill(m, double.NaN);
        var pLower = Fill(m, double.NaN);
        var sCenter = Fill(m, double.NaN);
        var sUpper = Fill(m, double.NaN);
        var sLower = Fill(m, double.NaN);
        for (var i = 0; i < m; i++)
        {
            if (sizes[i] == 0)
            {
                continue;
            }

            if (sizes[i] == 1)
            {
                // A single value is plotted against the individuals limits and has no spread point (docs/statistics.md §2.3).
                pUpper[i] = center + (multiplier * s);
                pLower[i] = center - (multiplier * s);
                continue;
            }

            var c = ControlChartConstants.Get(sizes[i], mode);
            var half = MeanHalfWidth(c, useRange, mode, multiplier, s);
            pUpper[i] = center + half;
            pLower[i] = center - half;
            (sCenter[i], sUpper[i], sLower[i]) = useRange ? RangeLimits(c, mode, multiplier, s) : DeviationLimits(c, mode, multiplier, s);
        }

        var primary = new ChartSeries(means, pCenter, pUpper, pLower);
        var secondary = new ChartSeries(spreads, sCenter, sUpper, sLower);
        return Finish(type, limits, center, sigma, primary, secondary, sizes, multiplier, warnings);
    }

    /// <summary>Half-width of the mean chart's limits for a subgroup of c.N values.</summary>
    internal static double MeanHalfWidth(ChartConstants c, bool useRange, ConstantsMode mode, double multiplier, double sigma) =>
        MeanFactor(c, useRange, mode, multiplier) * sigma;

    /// <summary>Half-width of the mean chart's limits per unit of sigma_hat: A2·d2 (= 3/√n exactly) or A3·c4.</summary>
    private static double MeanFactor(ChartConstants c, bool useRange, ConstantsMode mode, double multiplier)
    {
        if (mode == ConstantsMode.Table && multiplier == DefaultMultiplier)
        {
            return useRange ? c.A2 * c.RangeMean : c.A3 * c.C4;
        }

        return multiplier / Math.Sqrt(c.N);
    }

    /// <summary>Range chart: centre d2·σ, limits D3·d2·σ and D4·d2·σ (for the known-sigma case the same lines are D1·σ, D2·σ).</summary>
    internal static (double Center, double Upper, double Lower) RangeLimits(ChartConstants c, ConstantsMode mode, double multiplier, double sigma)
    {
        var center = c.RangeMean * sigma;
        if (mode == ConstantsMode.Table && multiplier == DefaultMultiplier)
        {
            return (center, c.D4 * center, c.D3 * center);
        }

        var k = multiplier * c.RangeSd / c.RangeMean;
        return (center, (1 + k) * center, Math.Max(0, 1 - k) * center);
    }

    /// <summary>Standard-deviation chart: centre c4·σ, limits B3·c4·σ and B4·c4·σ.</summary>
    internal static (double Center, double Upper, double Lower) DeviationLimits(ChartConstants c, ConstantsMode mode, double multiplier, double sigma)
    {
        var center = c.C4 * sigma;
        if (mode == ConstantsMode.Table && multiplier == DefaultMultiplier)
        {
            return (center, c.B4 * center, c.B3 * center);
        }

        var k = multiplier * Math.Sqrt(1 - (c.C4 * c.C4)) / c.C4;
        return (center, (1 + k) * center, Math.Max(0, 1 - k) * center);
    }

    private static ShewhartChart Finish(ShewhartChartType type, LimitRequest limits, double center, double? sigma,
        ChartSeries primary, ChartSeries secondary, int[] sizes, double multiplier, List<string> warnings)
    {
        var z = Fill(primary.Values.Length, double.NaN);
        var zeroSigma = false;
        for (var i = 0; i < z.Length; i++)
        {
            // sigma_point is the third (1/multiplier) of the distance from the centre line to the limit (docs/statistics.md §3.3).
            var sigmaPoint = (primary.Upper[i] - primary.Center[i]) / multiplier;
            if (double.IsNaN(primary.Values[i]) || !(sigmaPoint > 0))
            {
                zeroSigma |= sigmaPoint == 0 && !double.IsNaN(primary.Values[i]);
                continue;
            }

            z[i] = (primary.Values[i] - primary.Center[i]) / sigmaPoint;
        }

        if (zeroSigma)
        {
            warnings.Add("Sigma is zero (the values do not vary): the zone rules cannot be evaluated and capability is undefined.");
        }

        if (sigma is null)
        {
            warnings.Add("Sigma cannot be estimated: at least two usable values (or one subgroup of two) are needed.");
        }

        return new ShewhartChart(type, limits.Source, center, sigma, primary, secondary, z, sizes, warnings);
    }

    /// <summary>The given mean and sigma for known limits; otherwise the estimates, with a warning on a small baseline.</summary>
    private static (double Center, double? Sigma) CenterAndSigma(LimitRequest limits, RunningMoments values, double? estimatedSigma,
        long estimateCount, string what, List<string> warnings)
    {
        if (limits.Source == LimitSource.Known)
        {
            return (limits.KnownMean!.Value, limits.KnownSigma!.Value);
        }

        Describe(warnings, estimateCount, what, 20);
        return (values.Count > 0 ? values.Mean : double.NaN, estimatedSigma);
    }

    private static void Describe(List<string> warnings, long count, string what, int recommended)
    {
        if (count > 0 && count < recommended)
        {
            warnings.Add($"The limits rest on {count} {what}; at least {recommended} are usual for trial limits (common practice).");
        }
    }

    private static void Validate(LimitRequest limits, double multiplier)
    {
        if (!(multiplier > 0) || !double.IsFinite(multiplier))
        {
            throw new ArgumentOutOfRangeException(nameof(multiplier), multiplier, "The sigma multiplier must be a positive number.");
        }

        if (limits.Source == LimitSource.Known
            && (limits.KnownMean is not { } mean || !double.IsFinite(mean) || limits.KnownSigma is not { } s || !(s >= 0) || !double.IsFinite(s)))
        {
            throw new ArgumentOutOfRangeException(nameof(limits), "Known limits need a finite mean and a finite sigma ≥ 0.");
        }

        if (limits.Source == LimitSource.Baseline && limits.BaselineCount is not > 0)
        {
            throw new ArgumentOutOfRangeException(nameof(limits), "A baseline needs a count of at least 1.");
        }
    }

    private static double[] Fill(int n, double value)
    {
        var a = new double[n];
        Array.Fill(a, value);
        return a;
    }

    private static double[] Copy(ReadOnlySpan<double> values) => values.ToArray();
}

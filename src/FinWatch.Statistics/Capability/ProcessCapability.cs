using FinWatch.Statistics.Constants;

namespace FinWatch.Statistics.Capability;

/// <summary>
/// Normal-theory process capability and performance indices with confidence limits (docs/statistics.md §5).
/// </summary>
public static class ProcessCapability
{
    /// <summary>The caveat of docs/statistics.md §5.2, carried in every result.</summary>
    public const string WithinIntervalNote =
        "Intervals assume sigma estimated by the sample standard deviation of one sample of N (nu = N - 1); "
        + "applied to the within indices, whose sigma comes from ranges or moving ranges with fewer effective "
        + "degrees of freedom, they are slightly optimistic.";

    /// <summary>
    /// Computes Cp, Cpu, Cpl, Cpk (within sigma), Pp, Ppu, Ppl, Ppk (overall sigma), Cpm, the normal-theory
    /// ppm outside the specification, and confidence limits (docs/statistics.md §5.1, 5.2).
    /// </summary>
    /// <param name="values">Individual measurements in data units; NaN marks a missing value and is
    /// skipped. The mean x̄ is that of all non-missing values.</param>
    /// <param name="sigmaWithin">Within (short-term) sigma from the control chart (Rbar/d2, sbar/c4 or
    /// MRbar/d2(2)), in data units, ≥ 0. NaN means "not available": the within indices are then null.</param>
    /// <param name="spec">Specification limits; at least one limit is needed for any index.</param>
    /// <param name="confidence">Level of the intervals and one-sided lower bounds, strictly between 0 and 1.</param>
    /// <returns>
    /// The indices; undefined ones are null with a reason: no values (everything), no specification limit,
    /// a one-sided specification (Cp, Pp, Cpm), sigma zero or unavailable, N &lt; 2 (overall sigma, Pp*,
    /// Cpm and all intervals). With N = 1 the within indices are still given, since sigma_w is supplied.
    /// Overall sigma is the sample standard deviation (divisor N − 1, no c4), computed in one stable pass.
    /// </returns>
    /// <exception cref="ArgumentOutOfRangeException">A value is infinite; <paramref name="sigmaWithin"/>
    /// is negative or infinite; a limit or the target is not finite, or LSL ≥ USL;
    /// <paramref name="confidence"/> is not strictly between 0 and 1.</exception>
    public static CapabilityResult Compute(ReadOnlySpan<double> values, double sigmaWithin, SpecLimits spec, double confidence = 0.95)
    {
        spec.Validate(nameof(spec));
        CapabilityConfidence.CheckConfidence(confidence, nameof(confidence));
        if (sigmaWithin < 0 || double.IsInfinity(sigmaWithin))
        {
            throw new ArgumentOutOfRangeException(nameof(sigmaWithin), sigmaWithin, "The within sigma must be finite and non-negative (or NaN when not available).");
        }

        var moments = new RunningMoments();
        foreach (var v in values)
        {
            if (double.IsNaN(v))
            {
                continue;
            }

            if (double.IsInfinity(v))
            {
                throw new ArgumentOutOfRangeException(nameof(values), v, "Values must be finite (NaN marks a missing value).");
            }

            moments.Add(v);
        }

        var n = checked((int)moments.Count);
        var reasons = new Dictionary<string, string>(StringComparer.Ordinal);
        var intervals = new Dictionary<string, ConfidenceInterval>(StringComparer.Ordinal);
        var lowerBounds = new Dictionary<string, double>(StringComparer.Ordinal);

        double? mean = n > 0 ? moments.Mean : null;
        double? sigmaOverall = n >= 2 ? moments.SampleStandardDeviation : null;
        double? sigmaW = double.IsNaN(sigmaWithin) ? null : sigmaWithin;
        if (mean is null)
        {
            reasons["Mean"] = "no values";
        }

        if (sigmaW is null)
        {
            reasons["SigmaWithin"] = "within sigma not available (NaN was given)";
        }

        if (sigmaOverall is null)
        {
            reasons["SigmaOverall"] = n == 0 ? "no values" : "the overall standard deviation needs at least 2 values";
        }

        var overallMissing = "the overall standard deviation needs at least 2 values";
        var within = Indices(mean, sigmaW, "within sigma", "within sigma not available (NaN was given)", spec, "C", reasons);
        var overall = Indices(mean, sigmaOverall, "overall sigma", overallMissing, spec, "P", reasons);
        var (cpm, cpmTarget) = Cpm(mean, sigmaOverall, spec, reasons);
        var ppmWithin = Ppm(mean, sigmaW, "within sigma", "within sigma not available (NaN was given)", spec, "PpmWithin", reasons);
        var ppmOverall = Ppm(mean, sigmaOverall, "overall sigma", overallMissing, spec, "PpmOverall", reasons);

        AddIntervals(CapabilityIndexNames.Cp, within.Potential, isCp: true, n, confidence, intervals, lowerBounds, reasons);
        AddIntervals(CapabilityIndexNames.Cpk, within.K, isCp: false, n, confidence, intervals, lowerBounds, reasons);
        AddIntervals(CapabilityIndexNames.Pp, overall.Potential, isCp: true, n, confidence, intervals, lowerBounds, reasons);
        AddIntervals(CapabilityIndexNames.Ppk, overall.K, isCp: false, n, confidence, intervals, lowerBounds, reasons);

        return new CapabilityResult(
            N: n,
            Mean: mean,
            SigmaWithin: sigmaW,
            SigmaOverall: sigmaOverall,
            Cp: within.Potential,
            Cpu: within.Upper,
            Cpl: within.Lower,
            Cpk: within.K,
            Pp: overall.Potential,
            Ppu: overall.Upper,
            Ppl: overall.Lower,
            Ppk: overall.K,
            Cpm: cpm,
            CpmTarget: cpmTarget,
            PpmWithin: ppmWithin,
            PpmOverall: ppmOverall,
            ConfidenceLevel: confidence,
            Intervals: intervals,
            LowerBounds: lowerBounds,
            Reasons: reasons,
            IntervalNote: WithinIntervalNote);
    }

    private readonly record struct IndexSet(double? Potential, double? Upper, double? Lower, double? K);

    private static IndexSet Indices(double? mean, double? sigma, string sigmaName, string sigmaMissing, SpecLimits spec, string letter, Dictionary<string, string> reasons)
    {
        var names = (Potential: letter + "p", Upper: letter + "pu", Lower: letter + "pl", K: letter + "pk");
        string? common = mean is null ? "no values"
            : spec.IsEmpty ? "no specification limit given"
            : sigma is null ? sigmaMissing
            : sigma.Value == 0 ? $"{sigmaName} is zero (constant data): the index would be infinite"
            : null;
        if (common is not null)
        {
            reasons[names.Potential] = reasons[names.Upper] = reasons[names.Lower] = reasons[names.K] = common;
            return default;
        }

        var s = sigma!.Value;
        var m = mean!.Value;
        double? upper = spec.Upper is { } usl ? (usl - m) / (3.0 * s) : null;
        double? lower = spec.Lower is { } lsl ? (m - lsl) / (3.0 * s) : null;
        double? potential = spec.IsTwoSided ? (spec.Upper!.Value - spec.Lower!.Value) / (6.0 * s) : null;
        if (upper is null)
        {
            reasons[names.Upper] = "no upper specification limit";
        }

        if (lower is null)
        {
            reasons[names.Lower] = "no lower specification limit";
        }

        if (potential is null)
        {
            reasons[names.Potential] = $"one-sided specification: {names.Potential} needs both limits";
        }

        double? k = upper is { } u && lower is { } l ? Math.Min(u, l) : upper ?? lower;
        if (!IsFiniteOrNull(potential) || !IsFiniteOrNull(upper) || !IsFiniteOrNull(lower))
        {
            // Only for a sigma so small (subnormal) that the quotient overflows.
            reasons[names.Potential] = reasons[names.Upper] = reasons[names.Lower] = reasons[names.K] =
                $"{sigmaName} is too small for the index to be represented";
            return default;
        }

        return new IndexSet(potential, upper, lower, k);
    }

    private static (double? Cpm, double? Target) Cpm(double? mean, double? sigmaOverall, SpecLimits spec, Dictionary<string, string> reasons)
    {
        var target = spec.EffectiveTarget;
        string? reason = !spec.IsTwoSided ? "Cpm needs both specification limits"
            : mean is null ? "no values"
            : sigmaOverall is null ? "the overall standard deviation needs at least 2 values"
            : null;
        if (reason is null)
        {
            var offset = mean!.Value - target!.Value;
            var s = sigmaOverall!.Value;
            var denominator = 6.0 * Math.Sqrt((s * s) + (offset * offset));
            if (denominator > 0)
            {
                return ((spec.Upper!.Value - spec.Lower!.Value) / denominator, target);
            }

            reason = "zero spread with the mean on target: Cpm would be infinite";
        }

        reasons["Cpm"] = reason;
        return (null, target);
    }

    private static OutsideSpecPpm? Ppm(double? mean, double? sigma, string sigmaName, string sigmaMissing, SpecLimits spec, string key, Dictionary<string, string> reasons)
    {
        string? reason = mean is null ? "no values"
            : spec.IsEmpty ? "no specification limit given"
            : sigma is null ? sigmaMissing
            : sigma.Value == 0 ? $"{sigmaName} is zero: the normal model is degenerate"
            : null;
        if (reason is not null)
        {
            reasons[key] = reason;
            return null;
        }

        var m = mean!.Value;
        var s = sigma!.Value;
        double? below = spec.Lower is { } lsl ? 1e6 * ElementaryFunctions.NormalCdf((lsl - m) / s) : null;
        double? above = spec.Upper is { } usl ? 1e6 * ElementaryFunctions.NormalCdf(-(usl - m) / s) : null;
        return new OutsideSpecPpm(below, above, (below ?? 0.0) + (above ?? 0.0));
    }

    private static void AddIntervals(
        string name,
        double? estimate,
        bool isCp,
        int n,
        double confidence,
        Dictionary<string, ConfidenceInterval> intervals,
        Dictionary<string, double> lowerBounds,
        Dictionary<string, string> reasons)
    {
        var key = "Intervals." + name;
        if (estimate is not { } value)
        {
            reasons[key] = $"{name} is undefined";
            return;
        }

        if (n < 2)
        {
            reasons[key] = "confidence limits need at least 2 values (nu = N - 1)";
            return;
        }

        var interval = isCp ? CapabilityConfidence.CpInterval(value, n, confidence) : CapabilityConfidence.CpkInterval(value, n, confidence);
        var bound = isCp ? CapabilityConfidence.CpLowerBound(value, n, confidence) : CapabilityConfidence.CpkLowerBound(value, n, confidence);
        if (!double.IsFinite(interval.Low) || !double.IsFinite(interval.High) || !double.IsFinite(bound))
        {
            reasons[key] = $"{name} is too large for its confidence limits to be represented";
            return;
        }

        intervals[name] = interval;
        lowerBounds[name] = bound;
    }

    private static bool IsFiniteOrNull(double? x) => x is not { } v || double.IsFinite(v);
}

using System.Globalization;
using MathNet.Numerics.Distributions;

namespace FinWatch.Statistics.Forecast;

/// <summary>
/// Drift forecast: a straight-line trend in a series, and when the trend line reaches a control or
/// specification limit.
/// </summary>
/// <remarks>
/// <para>Ordinary least squares on (x, y), with x̄, ȳ, Sxx = Σ(x − x̄)², Sxy = Σ(x − x̄)(y − ȳ) formed in
/// two passes (no sum-of-squares-minus-square-of-sum); b = Sxy/Sxx, a = ȳ − b·x̄, s² = SSE/(n − 2), and the
/// slope test t = b/(s/√Sxx) on n − 2 degrees of freedom, two-sided.</para>
/// <para>Crossing interval by inverse regression (Fieller 1954, JRSS B 16, 175–185; Draper and Smith,
/// <i>Applied Regression Analysis</i>, section on inverse prediction / "the calibration problem" — both
/// from memory): the set of x at which the limit L lies inside the confidence band of the mean line,
/// ŷ(x) ± t·s·√(1/n + (x − x̄)²/Sxx). With d = x − x̄ and c = L − ȳ its boundary solves
/// (b² − t²s²/Sxx)·d² − 2bc·d + c² − t²s²/n = 0. When b² &gt; t²s²/Sxx (the slope is significant at the
/// band's level) the two roots bracket x* and give a finite interval; otherwise the band never closes on
/// the far side and the upper end is unbounded (null).</para>
/// </remarks>
public static class DriftForecast
{
    /// <summary>Fewer points than this are too few to judge a trend: the result is "no trend is seen".</summary>
    public const int MinimumPoints = 6;

    /// <summary>
    /// Fits the trend and forecasts when it reaches the nearest limit in its direction.
    /// </summary>
    /// <param name="positions">x: lot index or time in hours (see <paramref name="unit"/>); finite, any order.</param>
    /// <param name="values">y, in data units; NaN marks a missing value and the pair is skipped.</param>
    /// <param name="limits">Control and/or specification limits. An upward trend is compared with the
    /// upper limits, a downward one with the lower limits; of those, the one the fitted line reaches first
    /// after the last (largest) position is reported.</param>
    /// <param name="unit">What x measures; sets the unit of the distances and the wording.</param>
    /// <param name="alpha">Significance level of the two-sided slope test, strictly between 0 and 1.</param>
    /// <param name="confidence">Level of the confidence band used for the crossing interval, strictly
    /// between 0 and 1.</param>
    /// <returns>
    /// <see cref="DriftForecastStatus.NoTrend"/> when there are fewer than 6 points (p is still given from 3
    /// points on), the positions do not vary, or p ≥ <paramref name="alpha"/>. Otherwise the crossing, its
    /// interval and the distances from the last point. A noiseless line (s = 0) has p = 0 and a zero-width
    /// interval.
    /// </returns>
    /// <exception cref="ArgumentException">The spans differ in length.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A position is not finite, a value or limit is
    /// infinite, or <paramref name="alpha"/> or <paramref name="confidence"/> is outside (0, 1).</exception>
    public static DriftForecastResult Estimate(
        ReadOnlySpan<double> positions,
        ReadOnlySpan<double> values,
        DriftLimits limits,
        PositionUnit unit = PositionUnit.LotIndex,
        double alpha = 0.05,
        double confidence = 0.95)
    {
        if (positions.Length != values.Length)
        {
            throw new ArgumentException("Positions and values must have the same length.", nameof(values));
        }

        CheckLevel(alpha, nameof(alpha));
        CheckLevel(confidence, nameof(confidence));
        foreach (var (_, value) in limits.Given())
        {
            if (!double.IsFinite(value))
            {
                throw new ArgumentOutOfRangeException(nameof(limits), limits, "Limits must be finite.");
            }
        }

        var xs = new List<double>(positions.Length);
        var ys = new List<double>(positions.Length);
        for (var i = 0; i < positions.Length; i++)
        {
            if (!double.IsFinite(positions[i]))
            {
                throw new ArgumentOutOfRangeException(nameof(positions), positions[i], "Positions must be finite.");
            }

            if (double.IsNaN(values[i]))
            {
                continue;
            }

            if (double.IsInfinity(values[i]))
            {
                throw new ArgumentOutOfRangeException(nameof(values), values[i], "Values must be finite (NaN marks a missing value).");
            }

            xs.Add(positions[i]);
            ys.Add(values[i]);
        }

        var n = xs.Count;
        var words = UnitWords(unit);
        var notes = new List<string>();
        double? last = n > 0 ? xs.Max() : null;

        DriftForecastResult NoTrend(string message, Fit? fit) => new(
            DriftForecastStatus.NoTrend, message, n, unit, last, fit?.A, fit?.B, fit?.SeB, fit?.P, alpha, confidence,
            null, null, null, null, null, null, null, null, notes);

        if (n < 3)
        {
            return NoTrend($"No trend is seen: {n} point(s) are too few to judge a trend (at least {MinimumPoints} are needed).", null);
        }

        var fitted = FitLine(xs, ys);
        if (fitted is not { } fit)
        {
            return NoTrend("No trend is seen: all positions are equal, so no slope can be estimated.", null);
        }

        var pText = Format(fit.P);
        if (n < MinimumPoints)
        {
            return NoTrend($"No trend is seen: {n} points are too few to judge a trend (at least {MinimumPoints} are needed; slope p = {pText}).", fit);
        }

        if (!(fit.P < alpha))
        {
            return NoTrend($"No trend is seen (slope p = {pText}, not below alpha = {Format(alpha)}).", fit);
        }

        var up = fit.B > 0;
        var direction = up ? "up" : "down";
        var drift = $"Drifting {direction} by {Format(Math.Abs(fit.B))} per {words.One} (p = {pText})";
        var candidates = limits.Given()
            .Where(l => DriftLimits.IsUpper(l.Kind) == up)
            .Select(l => (l.Kind, l.Value, Crossing: (l.Value - fit.A) / fit.B))
            .ToList();
        if (candidates.Count == 0)
        {
            return new DriftForecastResult(
                DriftForecastStatus.NotApproachingAnyLimit,
                $"{drift}: the trend does not approach any given limit (none lies in the direction of the drift).",
                n, unit, last, fit.A, fit.B, fit.SeB, fit.P, alpha, confidence, null, null, null, null, null, null, null, null, notes);
        }

        var lastX = last!.Value;
        var ahead = candidates.Where(c => c.Crossing > lastX).OrderBy(c => c.Crossing).ToList();
        var behind = candidates.Where(c => c.Crossing <= lastX).OrderBy(c => c.Crossing).ToList();
        foreach (var passed in behind)
        {
            notes.Add($"The fitted line is already beyond the {Name(passed.Kind)} ({Format(passed.Value)}) at the last point.");
        }

        var willCross = ahead.Count > 0;
        var target = willCross ? ahead[0] : behind[^1];
        var t = StudentT.InvCDF(0.0, 1.0, n - 2, 1.0 - ((1.0 - confidence) / 2.0));
        var (low, high) = FiellerInterval(fit, n, target.Value, t);
        if (high is null)
        {
            notes.Add($"The lower side of the {Format(100 * confidence)}% confidence band never reaches the limit: the interval has no upper end.");
        }

        double? distanceLow = low is { } lo ? lo - lastX : null;
        if (willCross && (distanceLow is null || distanceLow < 0))
        {
            notes.Add("The confidence band already reaches the limit at the last point: the low end is set to 0.");
            distanceLow = 0.0;
        }

        double? distanceHigh = high - lastX;
        var distance = target.Crossing - lastX;
        var limitText = $"{Name(target.Kind)} {Format(target.Value)}";
        var interval = $"{Format(100 * confidence)}% interval {(distanceLow is { } dl ? Format(dl) : "unbounded")} to "
            + $"{(distanceHigh is { } dh ? Format(dh) + " " + words.Many : "unbounded")}";
        var message = willCross
            ? $"{drift}: the fitted line reaches the {limitText} in about {Format(distance)} {words.Many} ({interval})."
            : $"{drift}: the fitted line is already beyond the {limitText}, crossed about {Format(-distance)} {words.Many} before the last point.";
        return new DriftForecastResult(
            willCross ? DriftForecastStatus.WillCross : DriftForecastStatus.AlreadyBeyond,
            message, n, unit, last, fit.A, fit.B, fit.SeB, fit.P, alpha, confidence,
            target.Kind, target.Value, target.Crossing, low, high, distance, distanceLow, distanceHigh, notes);
    }

    private readonly record struct Fit(double A, double B, double SeB, double P, double S, double MeanX, double MeanY, double Sxx);

    private static Fit? FitLine(List<double> xs, List<double> ys)
    {
        var n = xs.Count;
        var meanX = xs.Average();
        var meanY = ys.Average();
        double sxx = 0, sxy = 0;
        for (var i = 0; i < n; i++)
        {
            var dx = xs[i] - meanX;
            sxx += dx * dx;
            sxy += dx * (ys[i] - meanY);
        }

        if (!(sxx > 0))
        {
            return null;
        }

        var b = sxy / sxx;
        var sse = 0.0;
        for (var i = 0; i < n; i++)
        {
            var r = ys[i] - meanY - (b * (xs[i] - meanX));
            sse += r * r;
        }

        var s = Math.Sqrt(sse / (n - 2));
        var seB = s / Math.Sqrt(sxx);
        double p;
        if (b == 0)
        {
            p = 1.0;
        }
        else if (seB == 0)
        {
            p = 0.0;
        }
        else
        {
            p = Math.Min(1.0, 2.0 * StudentT.CDF(0.0, 1.0, n - 2, -Math.Abs(b / seB)));
        }

        return new Fit(meanY - (b * meanX), b, seB, p, s, meanX, meanY, sxx);
    }

    /// <summary>The x-interval where the limit lies inside the band; low = largest boundary root ≤ x*,
    /// high = smallest root ≥ x* (only when the quadratic opens upward). Null low: the band contains the
    /// limit everywhere before x*.</summary>
    private static (double? Low, double? High) FiellerInterval(Fit fit, int n, double limit, double t)
    {
        var c = limit - fit.MeanY;
        var dStar = c / fit.B;
        var ts2 = t * t * fit.S * fit.S;
        var quad = (fit.B * fit.B) - (ts2 / fit.Sxx);

        // Quarter discriminant (b·c)² − quad·(c² − ts²/n), rearranged without cancellation.
        var disc = ts2 * (((fit.B * fit.B) / n) + (((c * c) - (ts2 / n)) / fit.Sxx));
        var roots = new List<double>(2);
        if (disc >= 0)
        {
            var bc = fit.B * c;
            var q = bc + (Math.CopySign(1.0, bc) * Math.Sqrt(disc));
            var constant = (c * c) - (ts2 / n);
            if (quad != 0 && q != 0)
            {
                roots.Add(q / quad);
                roots.Add(constant / q);
            }
            else if (quad != 0)
            {
                roots.Add(Math.Sqrt(disc) / quad);
                roots.Add(-Math.Sqrt(disc) / quad);
            }
            else if (bc != 0)
            {
                roots.Add(constant / (2 * bc));
            }
        }

        // A root may sit a rounding error off x* for a noiseless line; compare with a tolerance.
        var tolerance = 1e-12 * Math.Max(1.0, Math.Abs(dStar));
        double? low = roots.Where(r => r <= dStar + tolerance).Select(r => (double?)Math.Min(r, dStar)).Max();
        double? high = quad > 0 ? roots.Where(r => r >= dStar - tolerance).Select(r => (double?)Math.Max(r, dStar)).Min() : null;
        return (low + fit.MeanX, high + fit.MeanX);
    }

    private static (string One, string Many) UnitWords(PositionUnit unit) => unit switch
    {
        PositionUnit.LotIndex => ("lot", "lots"),
        PositionUnit.Hours => ("hour", "hours"),
        _ => throw new ArgumentOutOfRangeException(nameof(unit), unit, "Unknown position unit."),
    };

    private static string Name(LimitKind kind) => kind switch
    {
        LimitKind.LowerControl => "lower control limit",
        LimitKind.UpperControl => "upper control limit",
        LimitKind.LowerSpec => "lower specification limit",
        _ => "upper specification limit",
    };

    private static string Format(double x) => x.ToString("G4", CultureInfo.InvariantCulture);

    private static void CheckLevel(double level, string name)
    {
        if (!(level > 0.0 && level < 1.0))
        {
            throw new ArgumentOutOfRangeException(name, level, "The level must be strictly between 0 and 1.");
        }
    }
}

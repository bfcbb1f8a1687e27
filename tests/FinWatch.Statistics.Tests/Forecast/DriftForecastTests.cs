using FinWatch.Statistics.Forecast;
using MathNet.Numerics.Distributions;

namespace FinWatch.Statistics.Tests.Forecast;

public class DriftForecastTests
{
    private static double[] Lots(int n) => Enumerable.Range(0, n).Select(i => (double)i).ToArray();

    // Residual pattern orthogonal to 1 and x for x = 0..7 (Σe = 0, Σx·e = 0), so the fitted slope is the
    // generating one exactly and s² = 8/6.
    private static readonly double[] Orthogonal = [1, -1, -1, 1, 1, -1, -1, 1];

    private static double[] Pattern(double slope) =>
        Enumerable.Range(0, 8).Select(i => 10.0 + (slope * i) + Orthogonal[i]).ToArray();

    // Algebra: y = 2 + 0.5x reaches 10 at x* = (10 − 2)/0.5 = 16, which is 7 lots after the last lot (9);
    // without noise the band has zero width, so the interval collapses onto x*.
    [Fact]
    public void Estimate_NoiselessLine_CrossesWhereAlgebraSays()
    {
        var x = Lots(10);
        var y = x.Select(v => 2 + (0.5 * v)).ToArray();
        var r = DriftForecast.Estimate(x, y, new DriftLimits(null, null, null, 10.0));

        Assert.Equal(DriftForecastStatus.WillCross, r.Status);
        Assert.Equal(LimitKind.UpperSpec, r.Limit);
        Assert.Equal(0.5, r.Slope!.Value, 1e-12);
        Assert.Equal(2.0, r.Intercept!.Value, 1e-12);
        Assert.Equal(0.0, r.PValue!.Value, 1e-12);
        Assert.Equal(16.0, r.CrossingPosition!.Value, 1e-9);
        Assert.Equal(7.0, r.DistanceEstimate!.Value, 1e-9);
        Assert.Equal(7.0, r.DistanceLow!.Value, 1e-6);
        Assert.Equal(7.0, r.DistanceHigh!.Value, 1e-6);
        Assert.Contains("reaches the upper specification limit 10 in about 7 lots", r.Message, StringComparison.Ordinal);
    }

    // The first limit ahead wins: y = 2 + 0.5x reaches UCL 8 at x = 12 before USL 10 at x = 16.
    [Fact]
    public void Estimate_ControlAndSpecLimits_ReportsTheOneReachedFirst()
    {
        var x = Lots(10);
        var y = x.Select(v => 2 + (0.5 * v)).ToArray();
        var r = DriftForecast.Estimate(x, y, new DriftLimits(0.0, 8.0, -1.0, 10.0));

        Assert.Equal(LimitKind.UpperControl, r.Limit);
        Assert.Equal(12.0, r.CrossingPosition!.Value, 1e-9);
        Assert.Equal(3.0, r.DistanceEstimate!.Value, 1e-9);
    }

    // Downward drift in hours: y = 50 − 0.25·t over t = 0, 2, …, 22 reaches LSL 40 at t = 40 (18 h after 22).
    [Fact]
    public void Estimate_DownwardNoiselessInHours_ReachesLowerLimit()
    {
        var t = Enumerable.Range(0, 12).Select(i => 2.0 * i).ToArray();
        var y = t.Select(v => 50 - (0.25 * v)).ToArray();
        var r = DriftForecast.Estimate(t, y, new DriftLimits(null, 60.0, 40.0, 70.0), PositionUnit.Hours);

        Assert.Equal(LimitKind.LowerSpec, r.Limit);
        Assert.Equal(18.0, r.DistanceEstimate!.Value, 1e-9);
        Assert.Equal(PositionUnit.Hours, r.Unit);
        Assert.Contains("hours", r.Message, StringComparison.Ordinal);
    }

    // A flat series with seeded normal noise: the slope is not significant, "no trend is seen", p reported.
    [Fact]
    public void Estimate_FlatNoisySeries_SaysNoTrendWithPValue()
    {
        var x = Lots(40);
        var noise = new double[40];
        Normal.Samples(new Random(1234), noise, 0.0, 1.0);
        var y = noise.Select(e => 100 + e).ToArray();
        var r = DriftForecast.Estimate(x, y, new DriftLimits(95, 105));

        Assert.Equal(DriftForecastStatus.NoTrend, r.Status);
        Assert.NotNull(r.PValue);
        Assert.True(r.PValue >= 0.05);
        Assert.StartsWith("No trend is seen (slope p = ", r.Message, StringComparison.Ordinal);
        Assert.Null(r.CrossingPosition);
    }

    // Fewer than 6 points: "no trend is seen" even for a perfect line (p is still given).
    [Fact]
    public void Estimate_FivePoints_NoTrendTooFew()
    {
        var x = Lots(5);
        var r = DriftForecast.Estimate(x, x.Select(v => 3 * v).ToArray(), new DriftLimits(null, 100.0));

        Assert.Equal(DriftForecastStatus.NoTrend, r.Status);
        Assert.Contains("too few", r.Message, StringComparison.Ordinal);
        Assert.Equal(0.0, r.PValue);
    }

    // Inverse prediction (Fieller 1954; Draper and Smith, Applied Regression Analysis, inverse prediction,
    // from memory). Hand values for y = 10 + 0.55x + e, x = 0..7, USL 16: b = 0.55, s = 1.1547,
    // t = 3.087 (p ≈ 0.021); x* = 6/0.55 = 10.909; the 95 % band (t_{0.975,6} = 2.4469) crosses 16 at
    // x = 7.35457 (upper band) and 39.5166 (lower band), found by bisection in Python.
    [Fact]
    public void Estimate_OrthogonalResiduals_FiellerIntervalMatchesHandValues()
    {
        var r = DriftForecast.Estimate(Lots(8), Pattern(0.55), new DriftLimits(null, null, null, 16.0));

        Assert.Equal(DriftForecastStatus.WillCross, r.Status);
        Assert.Equal(0.55, r.Slope!.Value, 1e-12);
        Assert.Equal(10.909090909090907, r.CrossingPosition!.Value, 1e-9);
        Assert.Equal(7.354567127950716, r.CrossingLow!.Value, 1e-8);
        Assert.Equal(39.51662808721808, r.CrossingHigh!.Value, 1e-8);
        Assert.Equal(7.354567127950716 - 7, r.DistanceLow!.Value, 1e-8);
    }

    // Definitional check on seeded noisy data: at the low end the upper band equals the limit, at the high
    // end the lower band does (band recomputed here from the data with MathNet's t quantile).
    [Fact]
    public void Estimate_NoisyTrend_IntervalEndsAreWhereBandMeetsLimit()
    {
        var x = Lots(30);
        var noise = new double[30];
        Normal.Samples(new Random(99), noise, 0.0, 0.5);
        var y = x.Select((v, i) => 20 + (0.1 * v) + noise[i]).ToArray();
        const double limit = 26.0;
        var r = DriftForecast.Estimate(x, y, new DriftLimits(null, limit));

        var mx = x.Average();
        var sxx = x.Sum(v => (v - mx) * (v - mx));
        var s = Math.Sqrt(x.Select((v, i) => y[i] - r.Intercept!.Value - (r.Slope!.Value * v)).Sum(e => e * e) / 28);
        var t = StudentT.InvCDF(0, 1, 28, 0.975);
        double Band(double at) => t * s * Math.Sqrt((1.0 / 30) + ((at - mx) * (at - mx) / sxx));
        double Line(double at) => r.Intercept!.Value + (r.Slope!.Value * at);

        Assert.Equal(DriftForecastStatus.WillCross, r.Status);
        Assert.Equal(limit, Line(r.CrossingLow!.Value) + Band(r.CrossingLow.Value), 1e-9);
        Assert.Equal(limit, Line(r.CrossingHigh!.Value) - Band(r.CrossingHigh.Value), 1e-9);
        Assert.InRange(r.CrossingPosition!.Value, r.CrossingLow.Value, r.CrossingHigh.Value);
    }

    // The interval contains the estimate and shrinks as points are added (same line, same seeded noise law).
    [Fact]
    public void Estimate_MorePoints_IntervalContainsEstimateAndShrinks()
    {
        var widths = new List<double>();
        foreach (var n in new[] { 10, 20, 40, 80 })
        {
            var x = Lots(n).Select(v => v * 40.0 / n).ToArray();
            var noise = new double[n];
            Normal.Samples(new Random(5), noise, 0.0, 0.3);
            var y = x.Select((v, i) => 5 + (0.05 * v) + noise[i]).ToArray();
            var r = DriftForecast.Estimate(x, y, new DriftLimits(null, 9.0));

            Assert.Equal(DriftForecastStatus.WillCross, r.Status);
            Assert.InRange(r.DistanceEstimate!.Value, r.DistanceLow!.Value, r.DistanceHigh!.Value);
            widths.Add(r.DistanceHigh.Value - r.DistanceLow.Value);
        }

        for (var i = 1; i < widths.Count; i++)
        {
            Assert.True(widths[i] < widths[i - 1], string.Join(", ", widths));
        }
    }

    // An upward trend with only lower limits given moves away from every limit.
    [Fact]
    public void Estimate_TrendAwayFromEveryLimit_SaysItDoesNotApproachAnyLimit()
    {
        var x = Lots(12);
        var y = x.Select(v => 10 + (0.4 * v) + (0.05 * Math.Sin(v))).ToArray();
        var r = DriftForecast.Estimate(x, y, new DriftLimits(5.0, null, 3.0, null));

        Assert.Equal(DriftForecastStatus.NotApproachingAnyLimit, r.Status);
        Assert.Contains("does not approach any given limit", r.Message, StringComparison.Ordinal);
        Assert.Null(r.Limit);
        Assert.True(r.PValue < 0.05);
    }

    [Fact]
    public void Estimate_LineAlreadyBeyondLimit_ReportsAlreadyBeyond()
    {
        var x = Lots(10);
        var y = x.Select(v => 2 + (0.5 * v)).ToArray();
        var r = DriftForecast.Estimate(x, y, new DriftLimits(null, 4.0));

        Assert.Equal(DriftForecastStatus.AlreadyBeyond, r.Status);
        Assert.Equal(4.0, r.CrossingPosition!.Value, 1e-9);
        Assert.Equal(-5.0, r.DistanceEstimate!.Value, 1e-9);
        Assert.Contains("already beyond", r.Message, StringComparison.Ordinal);
    }

    // Slope significant at alpha = 0.05 (p ≈ 0.021) but the 99.9 % band (t_{0.9995,6} ≈ 5.96 > 3.09)
    // never closes: the interval's upper end is unbounded (null) with a note.
    [Fact]
    public void Estimate_BandNeverCrossesOnFarSide_UpperEndUnbounded()
    {
        var r = DriftForecast.Estimate(Lots(8), Pattern(0.55), new DriftLimits(null, 16.0), confidence: 0.999);

        Assert.Equal(DriftForecastStatus.WillCross, r.Status);
        Assert.Null(r.CrossingHigh);
        Assert.Null(r.DistanceHigh);
        Assert.NotNull(r.DistanceLow);
        Assert.Contains(r.Notes, note => note.Contains("no upper end", StringComparison.Ordinal));
        Assert.Contains("unbounded", r.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Estimate_MissingValues_PairsSkipped()
    {
        var x = Lots(12);
        var y = x.Select(v => 1 + (0.2 * v)).ToArray();
        y[3] = double.NaN;
        var r = DriftForecast.Estimate(x, y, new DriftLimits(null, 5.0));

        Assert.Equal(11, r.N);
        Assert.Equal(20.0, r.CrossingPosition!.Value, 1e-9);
    }

    [Fact]
    public void Estimate_ConstantPositions_NoTrend()
    {
        double[] x = [3, 3, 3, 3, 3, 3, 3];
        var r = DriftForecast.Estimate(x, [1, 2, 3, 4, 5, 6, 7], new DriftLimits(0, 10));
        Assert.Equal(DriftForecastStatus.NoTrend, r.Status);
        Assert.Null(r.PValue);
    }

    [Fact]
    public void Estimate_Empty_NoTrend()
    {
        var r = DriftForecast.Estimate([], [], new DriftLimits(0, 10));
        Assert.Equal(DriftForecastStatus.NoTrend, r.Status);
        Assert.Equal(0, r.N);
        Assert.Null(r.LastPosition);
    }

    // Huge magnitudes: a 1e9 offset on the values and limits changes neither slope nor crossing.
    [Fact]
    public void Estimate_BillionOffset_SameCrossing()
    {
        var x = Lots(10);
        var noise = new double[10];
        Normal.Samples(new Random(3), noise, 0.0, 0.05);
        var y = x.Select((v, i) => (0.5 * v) + noise[i]).ToArray();
        var a = DriftForecast.Estimate(x, y, new DriftLimits(null, 8.0));
        var b = DriftForecast.Estimate(x, y.Select(v => v + 1e9).ToArray(), new DriftLimits(null, 1e9 + 8.0));

        Assert.Equal(a.CrossingPosition!.Value, b.CrossingPosition!.Value, 1e-5);
        Assert.Equal(a.CrossingHigh!.Value, b.CrossingHigh!.Value, 1e-4);
    }

    [Fact]
    public void Estimate_CallerMistakes_Throw()
    {
        double[] x = [0, 1, 2];
        Assert.Throws<ArgumentException>(() => DriftForecast.Estimate(x, [1, 2], new DriftLimits(0, 5)));
        Assert.Throws<ArgumentOutOfRangeException>(() => DriftForecast.Estimate([0, double.NaN, 2], [1, 2, 3], new DriftLimits(0, 5)));
        Assert.Throws<ArgumentOutOfRangeException>(() => DriftForecast.Estimate(x, [1, 2, 3], new DriftLimits(0, 5), alpha: 0));
        Assert.Throws<ArgumentOutOfRangeException>(() => DriftForecast.Estimate(x, [1, 2, 3], new DriftLimits(0, 5), confidence: 1));
        Assert.Throws<ArgumentOutOfRangeException>(() => DriftForecast.Estimate(x, [1, 2, 3], new DriftLimits(0, double.PositiveInfinity)));
        Assert.Throws<ArgumentOutOfRangeException>(() => DriftForecast.Estimate(x, [1, 2, 3], new DriftLimits(0, 5), (PositionUnit)9));
    }
}

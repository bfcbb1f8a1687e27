using FinWatch.Statistics.Rules;
using FinWatch.Statistics.Shewhart;
using FinWatch.Statistics.Stability;

namespace FinWatch.Statistics.Tests.Stability;

public class MannKendallTests
{
    // Analytic limit (Kendall, Rank Correlation Methods, 1975): a strictly increasing series has every pair concordant,
    // S = n(n−1)/2, τ = 1, and without ties Var S = n(n−1)(2n+5)/18.
    [Theory]
    [InlineData(10)]
    [InlineData(25)]
    [InlineData(60)]
    public void StrictlyIncreasing_HasEveryPairConcordant(int n)
    {
        var r = MannKendall.Test([.. Enumerable.Range(0, n).Select(i => Math.Sqrt(i))]);
        Assert.Equal(n * (n - 1) / 2, r.S);
        Assert.Equal(1.0, r.Tau, 12);
        Assert.Equal(n * (n - 1.0) * ((2 * n) + 5) / 18, r.VarianceS, 9);
        Assert.Equal("rising", r.Direction(0.05));
    }

    // Mann (1945): under "no trend" every ordering of the values is equally likely, so Var S is the variance of S over
    // all orderings. Enumerating every permutation is an outside check of the closed form, with ties (the tie
    // correction of Kendall 1975) and without.
    [Theory]
    [InlineData(new double[] { 1, 2, 3, 4, 5, 6, 7 })]
    [InlineData(new double[] { 1, 1, 2, 3, 3, 3, 4 })]
    [InlineData(new double[] { 5, 5, 5, 2, 2, 9, 9 })]
    public void ClosedFormVariance_EqualsTheVarianceOverAllOrderings(double[] values)
    {
        var sum = 0.0;
        var sumSquares = 0.0;
        var count = 0;
        foreach (var order in Permutations(values.Length))
        {
            long s = 0;
            for (var i = 0; i < order.Length; i++)
            {
                for (var j = i + 1; j < order.Length; j++)
                {
                    s += Math.Sign(values[order[j]] - values[order[i]]);
                }
            }

            sum += s;
            sumSquares += (double)s * s;
            count++;
        }

        Assert.Equal(0, sum / count, 12);
        Assert.Equal(sumSquares / count, MannKendall.Variance(values), 9);
    }

    // For independent normal noise the two-sided p-value is uniform: about 5 % of series fall below 0.05. 2000 seeded
    // series; the binomial standard error of the rate is 0.5 %, the bound is 4 standard errors either side.
    [Fact]
    public void PureNoise_IsCalledATrendAboutFivePercentOfTheTime()
    {
        var random = new Random(11);
        var hits = 0;
        for (var k = 0; k < 2000; k++)
        {
            var x = Enumerable.Range(0, 40).Select(_ => Gaussian(random)).ToArray();
            hits += MannKendall.Test(x).PValue < 0.05 ? 1 : 0;
        }

        Assert.InRange(hits / 2000.0, 0.03, 0.07);
    }

    [Fact]
    public void FewerThanTenValues_GiveNoPValue()
    {
        var r = MannKendall.Test([1, 2, 3, 4, 5, 6, 7, 8, 9]);
        Assert.True(double.IsNaN(r.PValue));
        Assert.Equal(36, r.S);
        Assert.Equal("none", r.Direction(0.05));
    }

    // The baseline check: a drifting baseline is not stable for two reasons (its own rules fire against the limits
    // computed from it, and the trend test sees the drift); an in-control baseline of 30 subgroups is stable.
    [Fact]
    public void BaselineCheck_NamesTheReasonsADriftingBaselineIsNotStable()
    {
        var random = new Random(5);
        var drifting = Enumerable.Range(0, 40).Select(i => ((i * 0.08) + Gaussian(random), 1, double.NaN)).ToList();
        var check = BaselineCheck.Run(ShewhartChartType.IndividualsMovingRange, drifting.Average(p => p.Item1), 1.0, drifting, RunRules.WesternElectric);
        Assert.False(check.Stable);
        Assert.Contains(check.Reasons, r => r.Contains("rising", StringComparison.Ordinal));
        Assert.Contains(check.Reasons, r => r.Contains("break the chart's own rules", StringComparison.Ordinal));

        var steady = Enumerable.Range(0, 30).Select(_ => (Gaussian(random) * 0.3, 5, 0.67)).ToList();
        var ok = BaselineCheck.Run(ShewhartChartType.MeanStandardDeviation, 0, 0.67, steady, [RunRule.WE1]);
        Assert.True(ok.Stable, string.Join("; ", ok.Reasons));
        Assert.Equal(30, ok.Subgroups);
    }

    [Fact]
    public void BaselineCheck_FewSubgroups_IsAReason()
    {
        var few = Enumerable.Range(0, 12).Select(i => (i % 2 == 0 ? 0.1 : -0.1, 1, double.NaN)).ToList();
        var check = BaselineCheck.Run(ShewhartChartType.IndividualsMovingRange, 0, 1, few, [RunRule.WE1]);
        Assert.Equal(["only 12 subgroups; 25 or more are usual before limits are trusted (common practice)"], check.Reasons);
    }

    private static double Gaussian(Random random) =>
        Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble());

    private static IEnumerable<int[]> Permutations(int n)
    {
        var a = Enumerable.Range(0, n).ToArray();
        yield return [.. a];
        while (true)
        {
            var i = n - 2;
            while (i >= 0 && a[i] >= a[i + 1])
            {
                i--;
            }

            if (i < 0)
            {
                yield break;
            }

            var j = n - 1;
            while (a[j] <= a[i])
            {
                j--;
            }

            (a[i], a[j]) = (a[j], a[i]);
            Array.Reverse(a, i + 1, n - i - 1);
            yield return [.. a];
        }
    }
}

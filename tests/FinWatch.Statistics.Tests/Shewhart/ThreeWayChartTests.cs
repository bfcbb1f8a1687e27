using FinWatch.Statistics.Shewhart;

namespace FinWatch.Statistics.Tests.Shewhart;

public class ThreeWayChartTests
{
    // Simulated nested data with known components (a design check, not a published example): site σ 0.2, wafer σ 0.3,
    // lot σ 0.5. The variance-component estimates recover them within sampling error; the tolerance is wide enough for
    // 400 lots (standard errors of a few per cent).
    [Fact]
    public void Compute_NestedNormalData_RecoversTheVarianceComponents()
    {
        var random = new Random(11);
        double Normal() => Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble());
        var lots = new List<IReadOnlyList<double[]>>();
        for (var l = 0; l < 400; l++)
        {
            var lot = 10 + (0.5 * Normal());
            var wafers = new List<double[]>();
            for (var w = 0; w < 5; w++)
            {
                var wafer = lot + (0.3 * Normal());
                wafers.Add(Enumerable.Range(0, 9).Select(_ => wafer + (0.2 * Normal())).ToArray());
            }

            lots.Add(wafers);
        }

        var chart = ThreeWayChart.Compute(lots);
        Assert.Equal(0.2, chart.SigmaSite!.Value, 0.02);
        Assert.Equal(0.3, chart.SigmaWafer!.Value, 0.04);
        Assert.Equal(0.5, chart.SigmaLot!.Value, 0.06);
        Assert.Equal(400, chart.BetweenLots.Primary.Values.Length);
        Assert.Equal(2000, chart.WithinWafer.Values.Length);
        Assert.Equal(4, chart.WaferLot[20]);
    }

    [Fact]
    public void Compute_OneBadWafer_ShowsOnTheWithinLotChartOnly()
    {
        // A wafer shifted by 3 nm inside an otherwise quiet lot: the within-lot spread chart flags that lot, while the
        // within-wafer chart does not (its sites are as uniform as any).
        var lots = new List<IReadOnlyList<double[]>>();
        var random = new Random(5);
        for (var l = 0; l < 30; l++)
        {
            var wafers = new List<double[]>();
            for (var w = 0; w < 5; w++)
            {
                var offset = l == 17 && w == 2 ? 3.0 : 0.0;
                wafers.Add(Enumerable.Range(0, 9).Select(_ => 6 + offset + (0.1 * (random.NextDouble() - 0.5))).ToArray());
            }

            lots.Add(wafers);
        }

        var chart = ThreeWayChart.Compute(lots);
        Assert.Contains(17, chart.WithinLot.BeyondLimits());
        Assert.Empty(chart.WithinWafer.BeyondLimits());
    }
}

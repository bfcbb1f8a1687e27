using FinWatch.Physics.Analytic;

namespace FinWatch.Physics.Tests.Analytic;

/// <summary>
/// The width table is a numerical device, not physics: evaluating with it must give what the direct node computation
/// gives. Tolerance 1e-7 V, a hundred times below the quadrature's own 1e-5 V agreement with the 200-slice sum.
/// </summary>
public class WidthTableTests
{
    private static SliceModelInput Input(FinProfile p, GateFaces faces = GateFaces.TriGate, double eot = 0.9, double doping = 1e17) =>
        new(p, eot, faces, 20, 0.05, 0.75, doping, 0.155, 1e11, 1, ConfinementSurface.Si110, CornerCoefficients.Default, 200);

    [Fact]
    public void Evaluate_WithTable_MatchesDirectNodesOverTheH1Ranges()
    {
        var random = new Random(5);
        var table = QuadratureSliceModel.BuildWidthTable(Input(new FinProfile(6, 10, 42, 2)));
        for (int i = 0; i < 500; i++)
        {
            double top = 3 + (6 * random.NextDouble()), bottom = top + (5 * random.NextDouble()), h = 30 + (25 * random.NextDouble());
            var faces = i % 2 == 0 ? GateFaces.TriGate : GateFaces.DoubleGate;
            var input = Input(new FinProfile(top, bottom, h, 3 * random.NextDouble()), faces);
            SliceModelResult direct = QuadratureSliceModel.Evaluate(input);
            SliceModelResult tabled = QuadratureSliceModel.Evaluate(input, table);
            Assert.Equal(direct.PunchThrough, tabled.PunchThrough);
            if (!direct.PunchThrough)
            {
                Assert.Equal(direct.ThresholdLowV, tabled.ThresholdLowV, 1e-7);
                Assert.Equal(direct.ThresholdHighV, tabled.ThresholdHighV, 1e-7);
                Assert.Equal(direct.SwingLowVPerDecade, tabled.SwingLowVPerDecade, 1e-7);
                Assert.Equal(direct.DiblVPerV, tabled.DiblVPerV, 1e-6);
            }
        }
    }

    [Fact]
    public void Evaluate_TableForAnotherEot_IsNotUsed()
    {
        var table = QuadratureSliceModel.BuildWidthTable(Input(new FinProfile(6, 10, 42, 2)));
        var other = Input(new FinProfile(6, 10, 42, 2), eot: 1.1);
        Assert.False(table.Matches(other));
        Assert.Equal(QuadratureSliceModel.Evaluate(other).ThresholdLowV, QuadratureSliceModel.Evaluate(other, table).ThresholdLowV);
    }

    [Fact]
    public void TryInterpolate_OutsideTheGrid_IsFalse()
    {
        var table = QuadratureSliceModel.BuildWidthTable(Input(new FinProfile(6, 10, 42, 2)), 2, 20, 0.01);
        Assert.False(table.TryInterpolate(1.5, out _, out _));
        Assert.False(table.TryInterpolate(20.5, out _, out _));
        Assert.True(table.TryInterpolate(7.123, out double lambda, out _));
        Assert.True(lambda > 0);
    }
}

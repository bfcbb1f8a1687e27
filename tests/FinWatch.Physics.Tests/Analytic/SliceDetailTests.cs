using FinWatch.Physics.Analytic;

namespace FinWatch.Physics.Tests.Analytic;

/// <summary>The per-slice working of the slice model (docs/model.md §E.1, E.2, E.4).</summary>
public sealed class SliceDetailTests
{
    private static SliceModelInput Input(FinProfile p, GateFaces faces) =>
        new(p, 0.9, faces, 20, 0.05, 0.75, 1e17, 0.155, 1e11, 1, ConfinementSurface.Si110, CornerCoefficients.Default, 200);

    [Fact]
    public void Evaluate_TaperedFin_SharesSumToOneAndTheFootCarriesMost()
    {
        var details = new List<SliceDetail>();
        var result = SliceModel.Evaluate(Input(new FinProfile(6, 10, 42, 2), GateFaces.TriGate), details);

        // E.2 defines V_T,eff by Σ g_i·exp((V_T,eff − V_T,i)/(n_i v_t)) = 1, so the current shares sum to 1.
        Assert.Equal(1.0, details.Sum(d => d.CurrentShareLin), 1e-9);
        Assert.Equal(201, details.Count);
        Assert.True(details[^1].IsCorner);
        // E.2: the soft minimum is dominated by the wide foot; the bottom quarter carries more than the top quarter.
        var slices = details.Where(d => !d.IsCorner).ToList();
        Assert.True(slices.Take(50).Sum(d => d.CurrentShareLin) > slices.Skip(150).Sum(d => d.CurrentShareLin));
        Assert.True(slices[0].WidthNm > slices[^1].WidthNm);
        // The detailed call gives the same answer as the plain one.
        Assert.Equal(SliceModel.Evaluate(Input(new FinProfile(6, 10, 42, 2), GateFaces.TriGate)).ThresholdLowV, result.ThresholdLowV);
    }

    [Fact]
    public void Evaluate_HardMaskFin_HasNoCornerDevice()
    {
        // A.7: under a hard mask the top corners are not gated, so no corner device is added (E.4).
        var details = new List<SliceDetail>();
        SliceModel.Evaluate(Input(new FinProfile(8, 8, 40, 1), GateFaces.DoubleGate), details);
        Assert.DoesNotContain(details, d => d.IsCorner);
        Assert.All(details, d => Assert.Equal(0.005, d.CurrentShareLin, 1e-9)); // uniform fin: 1/200 each
    }
}

using FinWatch.Physics;

namespace FinWatch.SeedDemo.Tests;

public sealed class ProductsTests
{
    private static readonly string[] Parameters =
        ["top_width_nm", "bottom_width_nm", "fin_height_nm", "corner_radius_nm", "liner_thickness_nm", "taper_deg", "mid_width_nm"];

    [Fact]
    public void Products_Demo_OneTriGateAndOneDoubleGateWithDistinctCodes()
    {
        Assert.Equal(2, DemoFab.Products.Count);
        Assert.Equal([GateFaces.TriGate, GateFaces.DoubleGate], DemoFab.Products.Select(p => p.GateFaces).Order());
        Assert.Equal(DemoFab.Products.Count, DemoFab.Products.Select(p => p.Code).Distinct().Count());
        Assert.All(DemoFab.Products, p => Assert.Contains("Invented", p.Description, StringComparison.Ordinal));
    }

    [Fact]
    public void Products_Specs_EverySpecParameterOnceWithOrderedLimits()
    {
        Assert.All(DemoFab.Products, product =>
        {
            Assert.Equal(Parameters.Order(), product.Specs.Select(s => s.Parameter).Order());
            Assert.All(product.Specs, spec =>
            {
                Assert.True(spec.Lower.HasValue || spec.Upper.HasValue);
                Assert.True(spec.Target.HasValue);
                Assert.True(spec.Lower is not { } lower || lower < spec.Target);
                Assert.True(spec.Upper is not { } upper || spec.Target < upper);
            });
        });
    }

    [Fact]
    public void Products_Targets_MatchTheNominalProfileAndItsDerivedGeometry()
    {
        Assert.All(DemoFab.Products, product =>
        {
            DemoProfile n = product.Nominal;
            double Target(string parameter) => product.Specs.Single(s => s.Parameter == parameter).Target!.Value;

            Assert.Equal(n.TopWidthNm, Target("top_width_nm"));
            Assert.Equal(n.BottomWidthNm, Target("bottom_width_nm"));
            Assert.Equal(n.FinHeightNm, Target("fin_height_nm"));
            Assert.Equal(n.CornerRadiusNm, Target("corner_radius_nm"));
            Assert.Equal(n.LinerThicknessNm, Target("liner_thickness_nm"));
            Assert.Equal((n.TopWidthNm + n.BottomWidthNm) / 2.0, Target("mid_width_nm"));
            Assert.Equal(TestData.TaperDeg(n.TopWidthNm, n.BottomWidthNm, n.FinHeightNm), Target("taper_deg"), 0.005);
        });
    }

    [Fact]
    public void Products_Nominal_SevenNanometreClassMagnitudes()
    {
        Assert.All(DemoFab.Products, product =>
        {
            DemoProfile n = product.Nominal;
            Assert.InRange(n.TopWidthNm, 5.0, 10.0);
            Assert.InRange(n.BottomWidthNm, 5.0, 10.0);
            Assert.InRange(n.FinHeightNm, 30.0, 55.0);
            Assert.InRange(n.CornerRadiusNm, 1.0, 4.0);
            Assert.InRange(n.LinerThicknessNm, 1.5, 3.0);
            Assert.True(n.CornerRadiusNm < n.TopWidthNm / 2.0 * Math.Tan(Math.PI / 4.0 + n.TaperDeg * Math.PI / 360.0));
        });
    }
}

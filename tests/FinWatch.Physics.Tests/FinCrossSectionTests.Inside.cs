namespace FinWatch.Physics.Tests;

/// <summary>The inside test of A.4 and its consistency with the area formula.</summary>
public sealed partial class FinCrossSectionTests
{
    // Rectangle W = 10, H = 40, r = 4: the right arc centre is (W/2 − r, H − r) = (1, 36).
    private static readonly FinProfile RoundedRectangle = new(10, 10, 40, 4);

    [Fact]
    public void IsInside_Centre_IsInside()
    {
        // (0, H/2) is the middle of the fin.
        Assert.True(FinCrossSection.IsInside(RoundedRectangle, 0, 20));
    }

    [Theory]
    [InlineData(1)]
    [InlineData(-1)]
    public void IsInside_JustOutsideCornerArc_IsOutside(double side)
    {
        // 45° ray from the arc centre (1, 36) at distance r + 0.01 = 4.01: inside the sharp rectangle
        // (|x| = 3.84 < 5, z = 38.84 < 40) but beyond the arc, hence in the cut. Mirrored for the left corner.
        double d = 4.01 / Math.Sqrt(2);
        Assert.False(FinCrossSection.IsInside(RoundedRectangle, side * (1 + d), 36 + d));
    }

    [Fact]
    public void IsInside_JustInsideCornerArc_IsInside()
    {
        // Same 45° ray at distance r − 0.01 = 3.99: inside the disc, hence material.
        double d = 3.99 / Math.Sqrt(2);
        Assert.True(FinCrossSection.IsInside(RoundedRectangle, 1 + d, 36 + d));
    }

    [Theory]
    [InlineData(4.95, 39.95)]
    [InlineData(-4.95, 39.95)]
    [InlineData(5.0, 36.5)]
    [InlineData(1.5, 40.0)]
    public void IsInside_InSharpCornerButInCut_IsOutside(double x, double z)
    {
        // Inside (or on) the sharp rectangle but in the corner cut: near the vertex (±4.95, 39.95); on the sharp
        // sidewall above the tangent point (5, 36); on the sharp top beyond the tangent point (1, 40).
        Assert.False(FinCrossSection.IsInside(RoundedRectangle, x, z));
    }

    [Theory]
    [InlineData(5.0, 20.0)]   // on the straight sidewall
    [InlineData(5.0, 36.0)]   // sidewall tangent point (x_c + r, y_c)
    [InlineData(1.0, 40.0)]   // top tangent point (x_c, y_c + r)
    [InlineData(0.0, 40.0)]   // flat top
    [InlineData(4.5, 0.0)]    // foot
    public void IsInside_OnBoundary_IsInside(double x, double z)
    {
        // The region is documented as closed: boundary points count as inside.
        Assert.True(FinCrossSection.IsInside(RoundedRectangle, x, z));
    }

    [Theory]
    [InlineData(5.001, 20.0)]
    [InlineData(-5.001, 20.0)]
    [InlineData(0.0, 40.001)]
    [InlineData(0.0, -0.001)]
    [InlineData(double.PositiveInfinity, 20.0)]
    [InlineData(0.0, double.NegativeInfinity)]
    public void IsInside_BeyondTrapezoid_IsOutside(double x, double z)
    {
        // Just beyond a sidewall (|x| > W/2), above the top, below the foot, or at infinity.
        Assert.False(FinCrossSection.IsInside(RoundedRectangle, x, z));
    }

    [Fact]
    public void IsInside_TaperedSidewall_FollowsLocalWidth()
    {
        // 45° fin (Wt = 10, Wb = 90, H = 40): w(20) = 50 by A.2, so the sidewall is at |x| = 25 at mid-height.
        var p = new FinProfile(10, 90, 40, 2);
        Assert.True(FinCrossSection.IsInside(p, 24.999, 20));
        Assert.False(FinCrossSection.IsInside(p, 25.001, 20));
        Assert.False(FinCrossSection.IsInside(p, -25.001, 20));
    }

    [Fact]
    public void IsInside_RadiusAtMax_TopIsSingleArc()
    {
        // Rectangle with r = r_max = 5: the top is a half disc centred at (0, 35). (0, 40) is its apex (inside);
        // (3, 39.5) lies in the sharp rectangle but at distance √(9 + 20.25) ≈ 5.41 > 5 from the centre (outside).
        var p = new FinProfile(10, 10, 40, 5);
        Assert.True(FinCrossSection.IsInside(p, 0, 40));
        Assert.False(FinCrossSection.IsInside(p, 3, 39.5));
        Assert.True(FinCrossSection.IsInside(p, 3, 38.9)); // distance √(9 + 15.21) ≈ 4.92 < 5
    }

    [Fact]
    public void IsInside_ReEntrant_FollowsWidening()
    {
        // Wt = 12, Wb = 8, H = 40: w(20) = 10 (A.2), sidewall at |x| = 5 at mid-height, wider above.
        var p = new FinProfile(12, 8, 40, 1);
        Assert.True(FinCrossSection.IsInside(p, 4.99, 20));
        Assert.False(FinCrossSection.IsInside(p, 5.01, 20));
        Assert.True(FinCrossSection.IsInside(p, 5.5, 35)); // w(35) = 11.5, half 5.75, below the arc (z_c = 39)
    }

    public static TheoryData<double, double, double, double> GridCases => new()
    {
        { 8, 14, 40, 3 },    // tapered (θ ≈ 4.3°), rounded
        { 12, 8, 40, 2.5 },  // re-entrant (θ ≈ −2.9°), rounded
        { 6, 10, 20, 3.2 },  // tapered, r = r_max (θ ≈ 5.7°, r_max ≈ 3.30): nearly no flat top
    };

    [Theory]
    [MemberData(nameof(GridCases))]
    public void IsInside_FineGridCount_AgreesWithAreaFormula(double wt, double wb, double h, double r)
    {
        // Independent consistency check: midpoint-rule count of IsInside points on a 0.01 nm × 0.01 nm grid versus
        // the closed-form A.4 area. Only cells crossed by the boundary can be misclassified; their errors largely
        // cancel along each edge, and the observed |error| is at most 1.1e-3 nm² for these cases. The tolerance
        // 0.02 nm² is about 20× that, and about 1/150 of the two corner cuts (3.0 to 3.5 nm² here, asserted below),
        // so a wrong rounding term (tangent length, arc angle or sign) cannot pass.
        const double cell = 0.01;
        var p = new FinProfile(wt, wb, h, r);
        double halfSpan = 0.5 * Math.Max(wt, wb);
        int nx = (int)Math.Ceiling(2 * halfSpan / cell);
        int nz = (int)Math.Ceiling(h / cell);

        long count = 0;
        for (int j = 0; j < nz; j++)
        {
            double z = (j + 0.5) * cell;
            for (int i = 0; i < nx; i++)
            {
                if (FinCrossSection.IsInside(p, -halfSpan + ((i + 0.5) * cell), z))
                {
                    count++;
                }
            }
        }

        // The grid covers [−halfSpan, −halfSpan + nx·cell] × [0, nz·cell], which contains the fin.
        double gridArea = count * cell * cell;
        double formula = FinCrossSection.AreaNm2(p);
        double cuts = FinCrossSection.AreaNm2(p with { CornerRadiusNm = 0 }) - formula;
        const double tolerance = 0.02;
        Assert.True(cuts > 100 * tolerance, $"corner cuts {cuts} nm² too small for the check to discriminate");
        Assert.Equal(formula, gridArea, tolerance);
    }
}

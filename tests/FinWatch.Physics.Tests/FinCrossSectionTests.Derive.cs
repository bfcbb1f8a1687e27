namespace FinWatch.Physics.Tests;

/// <summary>Derive: flags, radius clipping and agreement with the individual methods.</summary>
public sealed partial class FinCrossSectionTests
{
    [Fact]
    public void Derive_NormalTaperedFin_NoFlagsAndMatchesIndividualMethods()
    {
        // Consistency: Derive documents that its fields equal the single-purpose methods for the same profile.
        FinGeometry g = FinCrossSection.Derive(Tapered, GateFaces.TriGate);
        double theta = FinCrossSection.TaperAngleRad(8, 14, 40);

        Assert.Equal(GeometryFlags.None, g.Flags);
        Assert.Equal(FinCrossSection.TaperAngleDeg(8, 14, 40), g.TaperDeg);
        Assert.Equal(FinCrossSection.MidHeightWidthNm(8, 14), g.MidWidthNm);
        Assert.Equal(FinCrossSection.AreaNm2(Tapered), g.AreaNm2);
        Assert.Equal(FinCrossSection.GatedPerimeterNm(Tapered, GateFaces.TriGate), g.GatedPerimeterNm);
        Assert.Equal(FinCrossSection.MaxCornerRadiusNm(8, theta), g.MaxCornerRadiusNm);
        Assert.Equal(3.0, g.CornerRadiusUsedNm);
    }

    [Fact]
    public void Derive_Rectangle_ReportsHandValues()
    {
        // Rectangle W = 10, H = 40, r = 2 (hand values derived in the area/perimeter tests): θ = 0°, w_mid = 10,
        // A = 392 + 2π, tri-gate P = 82 + 2π, r_max = W/2 = 5.
        FinGeometry g = FinCrossSection.Derive(new FinProfile(10, 10, 40, 2), GateFaces.TriGate);
        Assert.Equal(0.0, g.TaperDeg);
        Assert.Equal(10.0, g.MidWidthNm);
        Assert.Equal(392 + (2 * Math.PI), g.AreaNm2, 1e-12);
        Assert.Equal(82 + (2 * Math.PI), g.GatedPerimeterNm, 1e-12);
        Assert.Equal(5.0, g.MaxCornerRadiusNm);
        Assert.Equal(2.0, g.CornerRadiusUsedNm);
        Assert.Equal(GeometryFlags.None, g.Flags);
    }

    [Fact]
    public void Derive_DoubleGate_ChangesOnlyPerimeter()
    {
        // A.7 removes gated faces, not material: area and the rest are unchanged; P = 2(H − r) = 76 for the rectangle.
        var p = new FinProfile(10, 10, 40, 2);
        FinGeometry tri = FinCrossSection.Derive(p, GateFaces.TriGate);
        FinGeometry dbl = FinCrossSection.Derive(p, GateFaces.DoubleGate);
        Assert.Equal(76.0, dbl.GatedPerimeterNm, 1e-12);
        Assert.Equal(tri with { GatedPerimeterNm = 76.0 }, dbl with { GatedPerimeterNm = 76.0 });
    }

    [Fact]
    public void Derive_TopWiderThanFoot_FlagsReEntrant()
    {
        // Wt = 12 > Wb = 8: negative taper −atan(0.05) in degrees (A.1); the geometry is still computed.
        FinGeometry g = FinCrossSection.Derive(new FinProfile(12, 8, 40, 1), GateFaces.TriGate);
        Assert.Equal(GeometryFlags.ReEntrant, g.Flags);
        Assert.Equal(-Math.Atan(0.05) * 180 / Math.PI, g.TaperDeg, 1e-13);
        Assert.True(g.AreaNm2 > 0);
    }

    [Fact]
    public void Derive_VerticalFin_IsNotReEntrant()
    {
        // Wt = Wb is the boundary case: θ = 0, not negative, so no flag.
        Assert.Equal(GeometryFlags.None, FinCrossSection.Derive(new FinProfile(10, 10, 40, 1), GateFaces.TriGate).Flags);
    }

    [Fact]
    public void Derive_RadiusAboveMax_FlagsAndClipsToMax()
    {
        // Rectangle W = 10, r = 7 > r_max = 5: flagged; A and P use r = 5 (half-disc top: A = 350 + 12.5π,
        // P = 70 + 5π, by elementary geometry), identical to the profile with r = 5.
        FinGeometry g = FinCrossSection.Derive(new FinProfile(10, 10, 40, 7), GateFaces.TriGate);
        FinGeometry atMax = FinCrossSection.Derive(new FinProfile(10, 10, 40, 5), GateFaces.TriGate);

        Assert.Equal(GeometryFlags.RadiusExceedsMax, g.Flags);
        Assert.Equal(5.0, g.MaxCornerRadiusNm);
        Assert.Equal(5.0, g.CornerRadiusUsedNm);
        Assert.Equal(350 + (12.5 * Math.PI), g.AreaNm2, 1e-12);
        Assert.Equal(70 + (5 * Math.PI), g.GatedPerimeterNm, 1e-12);
        Assert.Equal(atMax with { Flags = g.Flags }, g);
    }

    [Fact]
    public void Derive_RadiusExactlyMax_IsNotFlagged()
    {
        // r taken from MaxCornerRadiusNm must round-trip: the comparison is strict and uses the same arithmetic.
        foreach (double wb in new[] { 6.0, 8.0, 14.0, 90.0 })
        {
            double theta = FinCrossSection.TaperAngleRad(8, wb, 40);
            double rMax = FinCrossSection.MaxCornerRadiusNm(8, theta);
            FinGeometry g = FinCrossSection.Derive(new FinProfile(8, wb, 40, rMax), GateFaces.TriGate);
            Assert.False(g.Flags.HasFlag(GeometryFlags.RadiusExceedsMax), $"flagged at Wb = {wb}");
            Assert.Equal(rMax, g.CornerRadiusUsedNm);
        }
    }

    [Fact]
    public void Derive_ReEntrantAndRadiusAboveMax_SetsBothFlags()
    {
        // Wt = 12 > Wb = 8 and r = 10 > r_max ≈ 6·tan(π/4 − atan(0.05)/2) ≈ 5.7: both conditions hold.
        FinGeometry g = FinCrossSection.Derive(new FinProfile(12, 8, 40, 10), GateFaces.TriGate);
        Assert.Equal(GeometryFlags.ReEntrant | GeometryFlags.RadiusExceedsMax, g.Flags);
        Assert.Equal(g.MaxCornerRadiusNm, g.CornerRadiusUsedNm);
    }

    [Fact]
    public void Derive_WideShortFin_ClipsToSidewallLength()
    {
        // Wt = Wb = 100, H = 10: A.4 also requires t ≤ H/cos θ = 10. With θ = 0, t = r, so the limit is 10 even
        // though the top alone would allow r_max = 50 (MaxCornerRadiusNm is the top-width limit only).
        // r = 30 is clipped to 10: A = W·H − 2r²(1 − π/4) = 1000 − 200(1 − π/4) = 800 + 50π; tri-gate
        // P = (W − 2r) + 0 + πr = 80 + 10π; double gate 2(H − r) = 0 (elementary geometry with t = r).
        var p = new FinProfile(100, 100, 10, 30);
        FinGeometry g = FinCrossSection.Derive(p, GateFaces.TriGate);

        Assert.Equal(50.0, FinCrossSection.MaxCornerRadiusNm(100, 0));
        Assert.Equal(GeometryFlags.RadiusExceedsMax, g.Flags);
        Assert.Equal(10.0, g.MaxCornerRadiusNm);
        Assert.Equal(10.0, g.CornerRadiusUsedNm);
        Assert.Equal(800 + (50 * Math.PI), g.AreaNm2, 1e-10);
        Assert.Equal(80 + (10 * Math.PI), g.GatedPerimeterNm, 1e-12);
        Assert.Equal(0.0, FinCrossSection.GatedPerimeterNm(p, GateFaces.DoubleGate), 1e-12);
    }

    [Fact]
    public void Derive_ZeroRadius_IsSharpTrapezoid()
    {
        // r = 0: A = (Wt + Wb)H/2 = 440 and P = Wt + 2H/cos θ = 8 + 2√(40² + 3²) = 8 + 2√1609 (Pythagoras).
        FinGeometry g = FinCrossSection.Derive(Tapered with { CornerRadiusNm = 0 }, GateFaces.TriGate);
        Assert.Equal(440.0, g.AreaNm2, 1e-12);
        Assert.Equal(8 + (2 * Math.Sqrt(1609)), g.GatedPerimeterNm, 1e-12);
        Assert.Equal(0.0, g.CornerRadiusUsedNm);
        Assert.Equal(GeometryFlags.None, g.Flags);
    }
}

namespace FinWatch.Physics.Tests;

/// <summary>Area and gated perimeter of the rounded-top trapezoid (A.4) and the double-gate option (A.7).</summary>
public sealed partial class FinCrossSectionTests
{
    private static readonly double Sqrt2 = Math.Sqrt(2);

    [Fact]
    public void Area_RectangleSharpCorners_IsWidthTimesHeight()
    {
        // θ = 0, r = 0: area = W·H = 10·40 = 400 by elementary geometry.
        Assert.Equal(400.0, FinCrossSection.AreaNm2(new FinProfile(10, 10, 40, 0)), 1e-12);
    }

    [Fact]
    public void Area_RectangleRoundedCorners_LosesTwoCornerCuts()
    {
        // θ = 0, t = r: each corner cut is the r×r square minus the quarter disc, r² − πr²/4 = r²(1 − π/4),
        // so A = W·H − 2r²(1 − π/4) = 400 − 8(1 − π/4) = 392 + 2π for W = 10, H = 40, r = 2.
        Assert.Equal(392 + (2 * Math.PI), FinCrossSection.AreaNm2(new FinProfile(10, 10, 40, 2)), 1e-12);
    }

    [Fact]
    public void GatedPerimeter_RectangleRoundedTriGate_IsFlatTopPlusSidewallsPlusArcs()
    {
        // θ = 0, t = r: flat top W − 2r, two sidewalls 2(H − r), two quarter arcs 2·(π/2)·r,
        // total W + 2H − 4r + πr = 10 + 80 − 8 + 2π = 82 + 2π for W = 10, H = 40, r = 2.
        Assert.Equal(82 + (2 * Math.PI), FinCrossSection.GatedPerimeterNm(new FinProfile(10, 10, 40, 2), GateFaces.TriGate), 1e-12);
    }

    [Fact]
    public void GatedPerimeter_RectangleSharpTriGate_IsWidthPlusTwoHeights()
    {
        // θ = 0, r = 0: top W plus two sidewalls H, 10 + 80 = 90 (the foot is not gated).
        Assert.Equal(90.0, FinCrossSection.GatedPerimeterNm(new FinProfile(10, 10, 40, 0), GateFaces.TriGate), 1e-12);
    }

    [Fact]
    public void Area_SharpTrapezoid_IsMeanWidthTimesHeight()
    {
        // r = 0: plain trapezoid (Wt + Wb)·H/2 = (10 + 90)·40/2 = 2000 (45° fin).
        Assert.Equal(2000.0, FinCrossSection.AreaNm2(new FinProfile(10, 90, 40, 0)), 1e-10);
    }

    [Fact]
    public void GatedPerimeter_SharpTrapezoidTriGate_IsTopPlusSlantSidewalls()
    {
        // r = 0: Wt + 2H/cos θ; at 45° the sidewall is H·√2 (hypotenuse of a 40-40 right triangle): 10 + 80√2.
        Assert.Equal(10 + (80 * Sqrt2), FinCrossSection.GatedPerimeterNm(new FinProfile(10, 90, 40, 0), GateFaces.TriGate), 1e-12);
    }

    [Fact]
    public void GatedPerimeter_SharpTrapezoid30DegreesTriGate_IsTopPlusSlantSidewalls()
    {
        // r = 0 at θ = 30° (Wb − Wt = 2H·tan 30°, H = 30): sidewall H/cos 30° = 30·2/√3 = 20√3, so P = 10 + 40√3;
        // area (Wt + Wb)H/2 = (20 + 20√3)·15 = 300 + 300√3.
        double wb = 10 + (20 * Math.Sqrt(3));
        var p = new FinProfile(10, wb, 30, 0);
        Assert.Equal(10 + (40 * Math.Sqrt(3)), FinCrossSection.GatedPerimeterNm(p, GateFaces.TriGate), 1e-12);
        Assert.Equal(300 + (300 * Math.Sqrt(3)), FinCrossSection.AreaNm2(p), 1e-10);
    }

    [Fact]
    public void AreaAndPerimeter_45DegreesRounded_MatchHandDerivation()
    {
        // θ = 45°, r = 2: t = r·tan(22.5°) = 2(√2 − 1); the arc spans π/2 − θ = π/4.
        // A_cut = r·t − (r²/2)(π/4) = 4(√2 − 1) − π/2, so A = 2000 − 8(√2 − 1) + π.
        // P = (10 − 2t) + 2(40√2 − t) + 2·r·π/4 = 10 + 80√2 − 8(√2 − 1) + π.
        var p = new FinProfile(10, 90, 40, 2);
        Assert.Equal(2000 - (8 * (Sqrt2 - 1)) + Math.PI, FinCrossSection.AreaNm2(p), 1e-10);
        Assert.Equal(10 + (80 * Sqrt2) - (8 * (Sqrt2 - 1)) + Math.PI, FinCrossSection.GatedPerimeterNm(p, GateFaces.TriGate), 1e-12);
    }

    [Fact]
    public void AreaAndPerimeter_RadiusAtMax_FlatTopVanishes()
    {
        // θ = 45°, r = r_max = 5(1 + √2): t = r_max·(√2 − 1) = 5 = Wt/2 (since (1 + √2)(√2 − 1) = 1), so the flat top
        // Wt − 2t is zero and the tri-gate perimeter is the sidewalls 2(40√2 − 5) plus the arcs 2·r_max·π/4.
        // The double gate drops the arcs (and the zero-length top): their difference is the arcs alone.
        double rMax = 5 * (1 + Sqrt2);
        var p = new FinProfile(10, 90, 40, rMax);
        double tri = FinCrossSection.GatedPerimeterNm(p, GateFaces.TriGate);
        double dbl = FinCrossSection.GatedPerimeterNm(p, GateFaces.DoubleGate);
        Assert.Equal((2 * ((40 * Sqrt2) - 5)) + (rMax * Math.PI / 2), tri, 1e-12);
        Assert.Equal(rMax * Math.PI / 2, tri - dbl, 1e-12);

        // A = 2000 − 2(r_max·5 − (r_max²/2)(π/4)) = 2000 − 10·r_max + (π/4)·r_max².
        Assert.Equal(2000 - (10 * rMax) + (Math.PI / 4 * rMax * rMax), FinCrossSection.AreaNm2(p), 1e-10);
    }

    [Fact]
    public void AreaAndPerimeter_RectangleRadiusAtMax_IsHalfDiscTop()
    {
        // θ = 0, r = W/2 = 5: the top is a half disc. A = W(H − r) + πr²/2 = 10·35 + 12.5π = 350 + 12.5π;
        // tri-gate P = 2(H − r) + πr = 70 + 5π; double gate 2(H − r) = 70.
        var p = new FinProfile(10, 10, 40, 5);
        Assert.Equal(350 + (12.5 * Math.PI), FinCrossSection.AreaNm2(p), 1e-12);
        Assert.Equal(70 + (5 * Math.PI), FinCrossSection.GatedPerimeterNm(p, GateFaces.TriGate), 1e-12);
        Assert.Equal(70.0, FinCrossSection.GatedPerimeterNm(p, GateFaces.DoubleGate), 1e-12);
    }

    [Fact]
    public void AreaAndPerimeter_NearlyTriangularFin_ApproachTriangle()
    {
        // Triangle-like limit W_t → 0 with r = r_max: the shape tends to the triangle with base Wb = 20, height 40,
        // area Wb·H/2 = 400, and the tri-gate perimeter tends to its two slant sides 2·√(40² + 10²) = 2√1700
        // (Pythagoras). Both differences are O(W_t): tolerance 100·W_t.
        const double wt = 1e-3;
        double rMax = FinCrossSection.MaxCornerRadiusNm(wt, FinCrossSection.TaperAngleRad(wt, 20, 40));
        var p = new FinProfile(wt, 20, 40, rMax);
        Assert.Equal(400.0, FinCrossSection.AreaNm2(p), 100 * wt);
        Assert.Equal(2 * Math.Sqrt(1700), FinCrossSection.GatedPerimeterNm(p, GateFaces.TriGate), 100 * wt);
    }

    [Fact]
    public void GatedPerimeter_DoubleGateRectangle_IsTwoStraightSidewallSegments()
    {
        // A.7 (hard mask): top and corners ungated; the straight sidewall below each arc is H − r, so 2(40 − 2) = 76.
        Assert.Equal(76.0, FinCrossSection.GatedPerimeterNm(new FinProfile(10, 10, 40, 2), GateFaces.DoubleGate), 1e-12);
    }

    [Fact]
    public void GatedPerimeter_DoubleGateSharpTrapezoid_IsFullSlantSidewalls()
    {
        // r = 0 at 45°: 2H/cos θ = 2·40√2 = 80√2 (no corner to remove).
        Assert.Equal(80 * Sqrt2, FinCrossSection.GatedPerimeterNm(new FinProfile(10, 90, 40, 0), GateFaces.DoubleGate), 1e-12);
    }

    [Fact]
    public void GatedPerimeter_DoubleGate45DegreesRounded_IsSidewallsMinusTangents()
    {
        // 2(H/cos θ − t) with t = 2(√2 − 1) at 45°: 80√2 − 4(√2 − 1).
        Assert.Equal((80 * Sqrt2) - (4 * (Sqrt2 - 1)), FinCrossSection.GatedPerimeterNm(new FinProfile(10, 90, 40, 2), GateFaces.DoubleGate), 1e-12);
    }

    [Fact]
    public void Area_RadiusAboveMax_UsesClippedRadius()
    {
        // Rectangle W = 10, r = 7 > r_max = 5: clipped to the half-disc top, A = 350 + 12.5π (as at r = 5).
        Assert.Equal(350 + (12.5 * Math.PI), FinCrossSection.AreaNm2(new FinProfile(10, 10, 40, 7)), 1e-12);
        Assert.Equal(70 + (5 * Math.PI), FinCrossSection.GatedPerimeterNm(new FinProfile(10, 10, 40, 7), GateFaces.TriGate), 1e-12);
    }

    [Fact]
    public void Area_ReEntrantSharp_IsStillMeanWidthTimesHeight()
    {
        // Wt = 12 > Wb = 8, r = 0: trapezoid area (12 + 8)·40/2 = 400; sidewalls √(40² + 2²) = √1604 each (Pythagoras).
        var p = new FinProfile(12, 8, 40, 0);
        Assert.Equal(400.0, FinCrossSection.AreaNm2(p), 1e-12);
        Assert.Equal(12 + (2 * Math.Sqrt(1604)), FinCrossSection.GatedPerimeterNm(p, GateFaces.TriGate), 1e-12);
    }

    [Fact]
    public void Area_RoundingOnlyRemovesMaterial_DecreasesWithRadius()
    {
        // dA_cut/dr = 2t − r(π/2 − θ) = 2r(tan φ − φ) with φ = π/4 − θ/2, positive since tan φ > φ on (0, π/2):
        // each corner cut grows with r, so the area falls strictly.
        double previous = double.PositiveInfinity;
        for (double r = 0; r <= 4; r += 0.5)
        {
            double area = FinCrossSection.AreaNm2(Tapered with { CornerRadiusNm = r });
            Assert.True(area < previous, $"area {area} at r = {r} is not below {previous}");
            previous = area;
        }
    }
}

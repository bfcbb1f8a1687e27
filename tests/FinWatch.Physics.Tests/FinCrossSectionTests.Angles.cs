namespace FinWatch.Physics.Tests;

/// <summary>Taper angle (A.1), corner tangent length and radius limit (A.4).</summary>
public sealed partial class FinCrossSectionTests
{
    [Fact]
    public void TaperAngle_VerticalFin_IsZero()
    {
        // Wt = Wb: atan(0) = 0 exactly, in both units.
        Assert.Equal(0.0, FinCrossSection.TaperAngleRad(10, 10, 40));
        Assert.Equal(0.0, FinCrossSection.TaperAngleDeg(10, 10, 40));
    }

    [Fact]
    public void TaperAngle_FootWiderByTwiceTheHeight_Is45Degrees()
    {
        // Wb − Wt = 80 = 2H, so θ = atan(80/80) = atan(1) = π/4 = 45° by A.1.
        Assert.Equal(Math.PI / 4, FinCrossSection.TaperAngleRad(10, 90, 40), 1e-15);
        Assert.Equal(45.0, FinCrossSection.TaperAngleDeg(10, 90, 40), 1e-12);
    }

    [Fact]
    public void TaperAngle_FootWiderByTwiceHeightTimesTan30_Is30Degrees()
    {
        // tan 30° = 1/√3, so Wb − Wt = 2H/√3 = 60/√3 = 20√3 for H = 30 gives θ = 30° (= π/6) by A.1.
        double wb = 10 + (20 * Math.Sqrt(3));
        Assert.Equal(Math.PI / 6, FinCrossSection.TaperAngleRad(10, wb, 30), 1e-15);
        Assert.Equal(30.0, FinCrossSection.TaperAngleDeg(10, wb, 30), 1e-12);
    }

    [Fact]
    public void TaperAngle_TopWiderThanFoot_IsNegative()
    {
        // Re-entrant fin: (Wb − Wt)/(2H) = (8 − 12)/80 = −0.05, so θ = atan(−0.05) = −atan(0.05) by A.1 (odd function).
        Assert.Equal(-Math.Atan(0.05), FinCrossSection.TaperAngleRad(12, 8, 40), 1e-16);
        Assert.Equal(-Math.Atan(0.05) * 180 / Math.PI, FinCrossSection.TaperAngleDeg(12, 8, 40), 1e-13);
    }

    [Fact]
    public void CornerTangentLength_VerticalSidewall_EqualsRadius()
    {
        // θ = 0: interior angle α = 90°, t = r·cot(45°) = r exactly (a square corner's tangent points are r from the vertex).
        Assert.Equal(3.0, FinCrossSection.CornerTangentLengthNm(3, 0));
    }

    [Fact]
    public void CornerTangentLength_ZeroRadius_IsZero()
    {
        // t = r·tan(π/4 − θ/2) = 0 for r = 0 at any angle.
        Assert.Equal(0.0, FinCrossSection.CornerTangentLengthNm(0, 0.3));
    }

    [Theory]
    [InlineData(Math.PI / 4, 0.41421356237309503)] // 45°: tan(22.5°) = √2 − 1 (half-angle formula).
    [InlineData(Math.PI / 6, 0.57735026918962573)] // 30°: tan(30°) = 1/√3.
    [InlineData(-Math.PI / 6, 1.7320508075688772)] // −30°: tan(60°) = √3 (re-entrant: sharper corner, longer tangent).
    public void CornerTangentLength_KnownAngles_MatchesTanOfHalfComplement(double taperRad, double expectedFactor)
    {
        // t = r·tan(π/4 − θ/2) (A.4); the expected tangents are the textbook values named beside each case.
        Assert.Equal(2 * expectedFactor, FinCrossSection.CornerTangentLengthNm(2, taperRad), 1e-14);
    }

    [Fact]
    public void CornerTangentLength_GeneralAngle_AgreesWithNoteFormula()
    {
        // Independent evaluation of the form t = r·tan(π/4 − θ/2) of docs/model.md §A with Math.Tan (the code uses cos θ/(1 + sin θ)).
        foreach (double theta in new[] { -1.2, -0.4, -0.05, 0.05, 0.2, 0.7, 1.3 })
        {
            Assert.Equal(2.5 * Math.Tan((Math.PI / 4) - (theta / 2)), FinCrossSection.CornerTangentLengthNm(2.5, theta), 1e-13);
        }
    }

    [Fact]
    public void MaxCornerRadius_VerticalSidewall_IsHalfTopWidth()
    {
        // A.4: r_max = W_t/2 for θ = 0 (a half-disc top); exact, since the code's tangent is exactly 1 at θ = 0.
        Assert.Equal(5.0, FinCrossSection.MaxCornerRadiusNm(10, 0));
    }

    [Fact]
    public void MaxCornerRadius_45Degrees_IsHalfWidthTimesOnePlusRoot2()
    {
        // A.4: r_max = (W_t/2)·tan(π/4 + π/8) = 5·tan(67.5°) = 5(1 + √2) (half-angle formula).
        Assert.Equal(5 * (1 + Math.Sqrt(2)), FinCrossSection.MaxCornerRadiusNm(10, Math.PI / 4), 1e-13);
    }

    [Fact]
    public void MaxCornerRadius_AtLimit_TangentIsHalfTopWidth()
    {
        // Definition of r_max (A.4): t(r_max) = W_t/2, since tan(π/4 − θ/2)·tan(π/4 + θ/2) = 1.
        foreach (double theta in new[] { -0.3, 0, 0.1, 0.6 })
        {
            double rMax = FinCrossSection.MaxCornerRadiusNm(7, theta);
            Assert.Equal(3.5, FinCrossSection.CornerTangentLengthNm(rMax, theta), 1e-14);
        }
    }

    [Fact]
    public void MaxCornerRadius_NearlyTriangularFin_TendsToHalfTopWidthTimesTan()
    {
        // Triangle-like limit W_t → 0 (Wb = 20, H = 40): r_max = (W_t/2)·tan(π/4 + θ/2) → 0 linearly in W_t,
        // checked against that formula evaluated with Math.Tan; θ → atan(20/80) = atan(1/4).
        const double wt = 1e-3;
        double theta = FinCrossSection.TaperAngleRad(wt, 20, 40);
        Assert.Equal(Math.Atan((20 - wt) / 80), theta, 1e-16);
        Assert.Equal(Math.Atan(0.25), theta, 1e-4);
        Assert.Equal(wt / 2 * Math.Tan((Math.PI / 4) + (theta / 2)), FinCrossSection.MaxCornerRadiusNm(wt, theta), 1e-18);
    }
}

namespace FinWatch.Physics.Tests;

/// <summary>Local width and the two-height extrapolation (A.2), mid-height width (A.3).</summary>
public sealed partial class FinCrossSectionTests
{
    // Straight sidewall w(z) = 14 − 0.15·z over H = 40: Wb = 14, Wt = 8.
    private static readonly FinProfile Tapered = new(TopWidthNm: 8, BottomWidthNm: 14, HeightNm: 40, CornerRadiusNm: 3);

    [Fact]
    public void LocalWidth_FootAndTop_AreBottomAndTopWidths()
    {
        // A.2: w(0) = W_b and w(H) = W_t by construction of the linear interpolation.
        Assert.Equal(14.0, FinCrossSection.LocalWidthNm(Tapered, 0), 1e-14);
        Assert.Equal(8.0, FinCrossSection.LocalWidthNm(Tapered, 40), 1e-14);
    }

    [Fact]
    public void LocalWidth_QuarterHeight_IsLinearInterpolation()
    {
        // A.2 by hand: w(10) = 14 + (8 − 14)·10/40 = 12.5.
        Assert.Equal(12.5, FinCrossSection.LocalWidthNm(Tapered, 10), 1e-14);
    }

    [Fact]
    public void LocalWidth_MidHeight_EqualsMidHeightWidth()
    {
        // A.3: w(H/2) = (W_t + W_b)/2 = 11.
        Assert.Equal(11.0, FinCrossSection.LocalWidthNm(Tapered, 20), 1e-14);
        Assert.Equal(11.0, FinCrossSection.MidHeightWidthNm(8, 14), 1e-14);
    }

    [Fact]
    public void LocalWidth_AboveTop_ExtrapolatesSidewallLine()
    {
        // Documented behaviour: no clamping; w(50) = 14 − 0.15·50 = 6.5 on the extended sidewall line.
        Assert.Equal(6.5, FinCrossSection.LocalWidthNm(Tapered, 50), 1e-14);
    }

    [Fact]
    public void ExtrapolateWidths_TwoInteriorHeights_RecoversTopAndBottom()
    {
        // Measurements on w(z) = 14 − 0.15 z: w(10) = 12.5, w(37) = 8.45 (the top CD taken 3 nm below the top, A.2).
        // Extrapolating the line to z = H = 40 and z = 0 gives back Wt = 8, Wb = 14.
        (double wt, double wb) = FinCrossSection.ExtrapolateWidths(12.5, 10, 8.45, 37, 40);
        Assert.Equal(8.0, wt, 1e-13);
        Assert.Equal(14.0, wb, 1e-13);
    }

    [Fact]
    public void ExtrapolateWidths_PointsSwapped_GivesSameWidths()
    {
        // The line through two points does not depend on their order.
        (double wt, double wb) = FinCrossSection.ExtrapolateWidths(8.45, 37, 12.5, 10, 40);
        Assert.Equal(8.0, wt, 1e-13);
        Assert.Equal(14.0, wb, 1e-13);
    }

    [Fact]
    public void ExtrapolateWidths_EqualWidths_GivesVerticalFin()
    {
        // w₁ = w₂: zero slope, so Wt = Wb = w₁ exactly.
        Assert.Equal((9.0, 9.0), FinCrossSection.ExtrapolateWidths(9, 5, 9, 30, 40));
    }

    [Fact]
    public void ExtrapolateWidths_AtFootAndTop_ReturnsInputs()
    {
        // z₁ = 0, z₂ = H: the extrapolation is the identity, W_b = w₁, W_t = w₂.
        (double wt, double wb) = FinCrossSection.ExtrapolateWidths(14, 0, 8, 40, 40);
        Assert.Equal(8.0, wt, 1e-14);
        Assert.Equal(14.0, wb, 1e-14);
    }

    [Fact]
    public void ExtrapolateWidths_LineCrossesZero_ReturnsNonPositiveWidth()
    {
        // Documented: results are returned as computed. w(z) = 10 − 0.5 z through (4, 8) and (16, 2) reaches
        // w(40) = −10 at the top.
        (double wt, double wb) = FinCrossSection.ExtrapolateWidths(8, 4, 2, 16, 40);
        Assert.Equal(-10.0, wt, 1e-13);
        Assert.Equal(10.0, wb, 1e-13);
    }
}

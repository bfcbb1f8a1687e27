namespace FinWatch.Physics.Tests;

/// <summary>Caller mistakes throw ArgumentOutOfRangeException (STYLE 3.3).</summary>
public sealed partial class FinCrossSectionTests
{
    public static TheoryData<double> BadLengths => new() { 0.0, -1.0, double.NaN, double.PositiveInfinity, double.NegativeInfinity };

    public static TheoryData<double> BadRadii => new() { -0.5, double.NaN, double.PositiveInfinity };

    [Theory]
    [MemberData(nameof(BadLengths))]
    public void TaperAngle_BadLength_Throws(double bad)
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.TaperAngleRad(bad, 10, 40));
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.TaperAngleRad(10, bad, 40));
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.TaperAngleDeg(10, 10, bad));
    }

    [Theory]
    [MemberData(nameof(BadLengths))]
    public void ProfileMethods_BadWidthOrHeight_Throw(double bad)
    {
        foreach (FinProfile p in new[] { Tapered with { TopWidthNm = bad }, Tapered with { BottomWidthNm = bad }, Tapered with { HeightNm = bad } })
        {
            AssertAllProfileMethodsThrow(p);
        }
    }

    [Theory]
    [MemberData(nameof(BadRadii))]
    public void ProfileMethods_BadRadius_Throw(double bad)
    {
        AssertAllProfileMethodsThrow(Tapered with { CornerRadiusNm = bad });
    }

    [Fact]
    public void ProfileMethods_DefaultProfile_Throw()
    {
        // default(FinProfile) has zero widths and height: a caller mistake, not a degenerate fin.
        AssertAllProfileMethodsThrow(default);
    }

    [Fact]
    public void ProfileMethods_BadParamName_NamesTheField()
    {
        ArgumentOutOfRangeException ex = Assert.Throws<ArgumentOutOfRangeException>(
            () => FinCrossSection.AreaNm2(Tapered with { HeightNm = -1 }));
        Assert.Equal("p.HeightNm", ex.ParamName);
    }

    [Fact]
    public void LocalWidth_NonFiniteHeight_Throws()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.LocalWidthNm(Tapered, double.NaN));
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.LocalWidthNm(Tapered, double.PositiveInfinity));
    }

    [Fact]
    public void IsInside_NaNCoordinate_Throws()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.IsInside(Tapered, double.NaN, 1));
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.IsInside(Tapered, 0, double.NaN));
    }

    [Fact]
    public void MidHeightWidth_BadWidth_Throws()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.MidHeightWidthNm(0, 10));
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.MidHeightWidthNm(10, double.NaN));
    }

    [Theory]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    [InlineData(2.0)]
    [InlineData(-1.6)]
    public void AngleMethods_BadTaper_Throw(double bad)
    {
        // |θ| must be finite and ≤ π/2 ≈ 1.5708.
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.CornerTangentLengthNm(1, bad));
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.MaxCornerRadiusNm(10, bad));
    }

    [Theory]
    [MemberData(nameof(BadRadii))]
    public void CornerTangentLength_BadRadius_Throws(double bad)
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.CornerTangentLengthNm(bad, 0.1));
    }

    [Fact]
    public void MaxCornerRadius_BadTopWidth_Throws()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.MaxCornerRadiusNm(0, 0.1));
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.MaxCornerRadiusNm(double.PositiveInfinity, 0.1));
    }

    [Fact]
    public void ExtrapolateWidths_BadInput_Throws()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.ExtrapolateWidths(10, 5, 10, 5, 40));          // z₁ = z₂
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.ExtrapolateWidths(0, 5, 10, 30, 40));          // w₁ = 0
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.ExtrapolateWidths(10, 5, -1, 30, 40));         // w₂ < 0
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.ExtrapolateWidths(10, double.NaN, 9, 30, 40)); // z₁ NaN
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.ExtrapolateWidths(10, 5, 9, 30, 0));           // H = 0
    }

    [Fact]
    public void FacesMethods_UndefinedFaces_Throw()
    {
        const GateFaces undefined = (GateFaces)7;
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.GatedPerimeterNm(Tapered, undefined));
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.Derive(Tapered, undefined));
    }

    private static void AssertAllProfileMethodsThrow(FinProfile p)
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.LocalWidthNm(p, 1));
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.AreaNm2(p));
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.GatedPerimeterNm(p, GateFaces.TriGate));
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.IsInside(p, 0, 1));
        Assert.Throws<ArgumentOutOfRangeException>(() => FinCrossSection.Derive(p, GateFaces.DoubleGate));
    }
}

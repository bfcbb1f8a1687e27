using FinWatch.Physics;

namespace FinWatch.SeedDemo;

/// <summary>
/// An invented demo product together with what only the generator needs: its share of the lots and its fixed
/// site pattern at the profile step.
/// </summary>
internal sealed class ProductRecipe
{
    private ProductRecipe(DemoProduct product, double lotShare, SitePosition[] profileSites)
    {
        Product = product;
        LotShare = lotShare;
        ProfileSites = profileSites;
        MeanRelativeRadiusSquared = profileSites.Average(site => site.RelativeRadiusSquared);
        MeanRelativeRadiusFourth = profileSites.Average(site => site.RelativeRadiusSquared * site.RelativeRadiusSquared);
    }

    public DemoProduct Product { get; }

    public DemoProfile Nominal => Product.Nominal;

    /// <summary>Probability that a lot is of this product (the shares sum to 1).</summary>
    public double LotShare { get; }

    public IReadOnlyList<SitePosition> ProfileSites { get; }

    /// <summary>Mean of (r/147 mm)² over the profile sites; the within-wafer pattern is centred on it.</summary>
    public double MeanRelativeRadiusSquared { get; }

    /// <summary>Mean of (r/147 mm)⁴ over the profile sites.</summary>
    public double MeanRelativeRadiusFourth { get; }

    /// <summary>Tri-gate logic: 13 sites (centre, 4 at 70 mm, 8 at 135 mm).</summary>
    public static readonly ProductRecipe TriGate = Create(
        "TRN7",
        "Tarn-7 logic",
        "Invented 7 nm-class tri-gate logic fin: the gate wraps the top and both sidewalls.",
        GateFaces.TriGate,
        new DemoProfile(6.0, 10.0, 42.0, 2.0, 2.5),
        lotShare: 0.6,
        SitePosition.CentreAndRings("S", (4, 70.0, 0.0), (8, 135.0, 22.5)),
        topWidth: (5.1, 6.9), bottomWidth: (8.8, 11.2), height: (39.0, 45.0),
        cornerRadius: (1.2, 2.8), liner: (2.15, 2.85), taperDeg: (1.8, 3.6), midWidth: (7.1, 8.9));

    /// <summary>Double-gate (hard mask on top): 9 sites (centre, 4 at 75 mm, 4 at 140 mm); corner radius has an upper limit only.</summary>
    public static readonly ProductRecipe DoubleGate = Create(
        "BRM7",
        "Brim-7 hard-mask",
        "Invented 7 nm-class double-gate fin: a hard mask stays on the top, only the two sidewalls are gated.",
        GateFaces.DoubleGate,
        new DemoProfile(7.0, 9.0, 38.0, 1.5, 2.0),
        lotShare: 0.4,
        SitePosition.CentreAndRings("S", (4, 75.0, 45.0), (4, 140.0, 0.0)),
        topWidth: (6.1, 7.9), bottomWidth: (7.9, 10.1), height: (35.0, 41.0),
        cornerRadius: (null, 2.2), liner: (1.7, 2.3), taperDeg: (0.8, 2.4), midWidth: (7.1, 8.9));

    public static IReadOnlyList<ProductRecipe> All { get; } = [TriGate, DoubleGate];

    /// <summary>The post-etch CD step uses the same 5 sites for every product (centre and 4 at 100 mm).</summary>
    public static IReadOnlyList<SitePosition> CdSites { get; } = SitePosition.CentreAndRings("C", (4, 100.0, 45.0));

    private static ProductRecipe Create(
        string code,
        string name,
        string description,
        GateFaces gateFaces,
        DemoProfile nominal,
        double lotShare,
        SitePosition[] profileSites,
        (double Lower, double Upper) topWidth,
        (double Lower, double Upper) bottomWidth,
        (double Lower, double Upper) height,
        (double? Lower, double? Upper) cornerRadius,
        (double Lower, double Upper) liner,
        (double Lower, double Upper) taperDeg,
        (double Lower, double Upper) midWidth)
    {
        DemoSpec[] specs =
        [
            new("top_width_nm", topWidth.Lower, nominal.TopWidthNm, topWidth.Upper),
            new("bottom_width_nm", bottomWidth.Lower, nominal.BottomWidthNm, bottomWidth.Upper),
            new("fin_height_nm", height.Lower, nominal.FinHeightNm, height.Upper),
            new("corner_radius_nm", cornerRadius.Lower, nominal.CornerRadiusNm, cornerRadius.Upper),
            new("liner_thickness_nm", liner.Lower, nominal.LinerThicknessNm, liner.Upper),
            new("taper_deg", taperDeg.Lower, Math.Round(nominal.TaperDeg, 2), taperDeg.Upper),
            new("mid_width_nm", midWidth.Lower, nominal.MidWidthNm, midWidth.Upper),
        ];
        return new ProductRecipe(new DemoProduct(code, name, description, gateFaces, nominal, specs), lotShare, profileSites);
    }
}

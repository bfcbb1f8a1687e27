namespace FinWatch.SeedDemo;

/// <summary>
/// The invented process model: a nested random-effects model (lot, wafer, site) around each product's nominal,
/// plus the planted behaviour listed in the README. Magnitudes are chosen for a 7 nm-class fin.
/// </summary>
internal static class FinModel
{
    /// <summary>Probability that a wafer is a bad (excursion) wafer: about 1 in 400.</summary>
    public const double ExcursionProbability = 1.0 / 400.0;

    // Lot-to-lot standard deviations (nm; the corner radius one is on the log scale). A lithography CD shift moves
    // top and bottom width together, so part of the width variation is shared.
    private const double LotSharedWidthSigma = 0.10;
    private const double LotTopWidthSigma = 0.05;
    private const double LotBottomWidthSigma = 0.07;
    private const double LotHeightSigma = 0.50;
    private const double LotLogRadiusSigma = 0.03;
    private const double LotLinerSigma = 0.025;

    // Wafer-to-wafer standard deviations.
    private const double WaferSharedWidthSigma = 0.05;
    private const double WaferTopWidthSigma = 0.04;
    private const double WaferBottomWidthSigma = 0.05;
    private const double WaferHeightSigma = 0.25;
    private const double WaferLogRadiusSigma = 0.02;
    private const double WaferLinerSigma = 0.015;

    // Site-to-site (including metrology repeatability) for the values the metrology tool does not set itself.
    private const double SiteHeightSigma = 0.40;
    private const double SiteLogRadiusSigma = 0.06;
    private const double SiteLinerSigma = 0.03;

    // Within-wafer centre-to-edge pattern (planted behaviour 6), in nm at the usable edge (ρ = r/147 mm = 1):
    // widths grow with ρ², the fin height drops with ρ⁴ (mostly in the outer ring), the liner is a little thinner outside.
    private const double EdgeTopWidthNm = 0.30;
    private const double EdgeBottomWidthNm = 0.40;
    private const double EdgeHeightNm = -1.5;
    private const double EdgeLinerNm = -0.04;

    // The radius is kept below the geometric limit by this factor (the limit itself is in FinWatch's fin model).
    private const double CornerRadiusLimitFraction = 0.97;

    /// <summary>
    /// The wafer states of a lot, slots 1..<paramref name="wafersPerLot"/>. Drawn from the lot's own stream, so every
    /// step of the lot (and <see cref="DemoFab.ExcursionWafers"/>) sees the same wafers.
    /// </summary>
    public static WaferState[] Wafers(int seed, LotPlan lot, int wafersPerLot)
    {
        var random = SeededRandom.Create(seed, lot.Index, SeededRandom.LotStream);
        DemoProfile nominal = lot.Recipe.Nominal;

        double lotShared = LotSharedWidthSigma * random.NextGaussian();
        double lotTop = lotShared + LotTopWidthSigma * random.NextGaussian();
        double lotBottom = lotShared + LotBottomWidthSigma * random.NextGaussian();
        double lotHeight = LotHeightSigma * random.NextGaussian();
        double lotLogRadius = LotLogRadiusSigma * random.NextGaussian();
        double lotLiner = LotLinerSigma * random.NextGaussian()
            + lot.Liner.ThicknessOffsetNm
            + FabLayout.LinerDrift(lot.Liner.Id, lot.LinedAtUtc);

        // During a maintenance the tool runs the whole lot on its other chamber.
        bool oddDown = FabLayout.IsDown(lot.EtchTool.OddSlots.Id, lot.EtchedAtUtc);
        bool evenDown = FabLayout.IsDown(lot.EtchTool.EvenSlots.Id, lot.EtchedAtUtc);

        // The process is centred on target: the within-wafer pattern averages to zero over the product's profile sites.
        ProductRecipe recipe = lot.Recipe;
        double centredTop = nominal.TopWidthNm - EdgeTopWidthNm * recipe.MeanRelativeRadiusSquared;
        double centredBottom = nominal.BottomWidthNm - EdgeBottomWidthNm * recipe.MeanRelativeRadiusSquared;
        double centredHeight = nominal.FinHeightNm - EdgeHeightNm * recipe.MeanRelativeRadiusFourth;
        double centredLiner = nominal.LinerThicknessNm - EdgeLinerNm * recipe.MeanRelativeRadiusSquared;

        var wafers = new WaferState[wafersPerLot];
        for (int i = 0; i < wafersPerLot; i++)
        {
            int slot = i + 1;
            bool odd = slot % 2 == 1;
            EtchChamber chamber = evenDown || (odd && !oddDown) ? lot.EtchTool.OddSlots : lot.EtchTool.EvenSlots;

            double waferShared = WaferSharedWidthSigma * random.NextGaussian();
            double top = waferShared + WaferTopWidthSigma * random.NextGaussian();
            double bottom = waferShared + WaferBottomWidthSigma * random.NextGaussian();
            double height = WaferHeightSigma * random.NextGaussian();
            double logRadius = WaferLogRadiusSigma * random.NextGaussian();
            double liner = WaferLinerSigma * random.NextGaussian();

            // Planted behaviour 4: about 1 wafer in 400 is under- or over-etched at every site.
            bool isExcursion = random.NextDouble() < ExcursionProbability;
            bool underEtch = random.NextDouble() < 0.5;
            double magnitude = random.NextUniform(0.8, 1.2);
            DemoExcursionKind? excursion = isExcursion ? (underEtch ? DemoExcursionKind.UnderEtch : DemoExcursionKind.OverEtch) : null;
            double excursionWidth = !isExcursion ? 0.0 : (underEtch ? 1.4 : -1.1) * magnitude;
            double excursionHeight = !isExcursion ? 0.0 : (underEtch ? -3.5 : 2.5) * magnitude;

            // Planted behaviour 1: the creeping chamber widens the foot (and slightly narrows the top) by the width
            // difference that tilts the nominal sidewall by the creep angle.
            double creepDeg = FabLayout.TaperCreepDeg(chamber.Id, lot.EtchedAtUtc);
            double nominalTaperRad = nominal.TaperDeg * Math.PI / 180.0;
            double creepWidthNm = 2.0 * nominal.FinHeightNm
                * (Math.Tan(nominalTaperRad + creepDeg * Math.PI / 180.0) - Math.Tan(nominalTaperRad));

            wafers[i] = new WaferState(
                slot,
                chamber,
                centredTop + chamber.TopWidthOffsetNm + lotTop + top + excursionWidth - 0.25 * creepWidthNm,
                centredBottom + chamber.BottomWidthOffsetNm + lotBottom + bottom + excursionWidth + 0.75 * creepWidthNm,
                centredHeight + chamber.HeightOffsetNm + lotHeight + height + excursionHeight,
                // Planted behaviour 2: the radius step after the chamber's maintenance.
                nominal.CornerRadiusNm + chamber.CornerRadiusOffsetNm + FabLayout.CornerRadiusStep(chamber.Id, lot.EtchedAtUtc),
                lotLogRadius + logRadius,
                centredLiner + lotLiner + liner,
                excursion,
                excursionWidth,
                excursionHeight);
        }

        return wafers;
    }

    /// <summary>All five values at a profile-step site, rounded as written and within the ingest validity ranges.</summary>
    public static (double Top, double Bottom, double Height, double Radius, double Liner) ProfileSite(
        in WaferState wafer, SitePosition site, MetrologyTool tool, Random noise)
    {
        double rho2 = site.RelativeRadiusSquared;
        double top = Width(wafer.TopWidthNm + EdgeTopWidthNm * rho2 + tool.TopWidthBiasNm + tool.TopWidthSigmaNm * noise.NextGaussian());
        double bottom = Width(wafer.BottomWidthNm + EdgeBottomWidthNm * rho2 + tool.BottomWidthBiasNm + tool.BottomWidthSigmaNm * noise.NextGaussian());
        double height = Nm(wafer.HeightNm + EdgeHeightNm * rho2 * rho2 + tool.HeightBiasNm + SiteHeightSigma * noise.NextGaussian(), 1.0, 300.0);

        // Lognormal site noise: the radius is skewed to the right and never negative.
        double radius = wafer.MedianCornerRadiusNm * Math.Exp(wafer.LogCornerRadiusOffset + SiteLogRadiusSigma * noise.NextGaussian());
        double taperRad = Math.Atan((bottom - top) / (2.0 * height));
        double radiusLimit = top / 2.0 * Math.Tan(Math.PI / 4.0 + taperRad / 2.0);
        radius = Nm(Math.Min(radius, CornerRadiusLimitFraction * radiusLimit), 0.0, 50.0);

        double liner = Nm(wafer.LinerNm + EdgeLinerNm * rho2 + tool.LinerBiasNm + SiteLinerSigma * noise.NextGaussian(), 0.0, 20.0);
        return (top, bottom, height, radius, liner);
    }

    /// <summary>Top and bottom width at a post-etch CD site (before the liner), rounded as written.</summary>
    public static (double Top, double Bottom) CdSite(in WaferState wafer, SitePosition site, MetrologyTool tool, Random noise)
    {
        double rho2 = site.RelativeRadiusSquared;
        double top = Width(wafer.TopWidthNm + EdgeTopWidthNm * rho2 + tool.TopWidthBiasNm + tool.TopWidthSigmaNm * noise.NextGaussian());
        double bottom = Width(wafer.BottomWidthNm + EdgeBottomWidthNm * rho2 + tool.BottomWidthBiasNm + tool.BottomWidthSigmaNm * noise.NextGaussian());
        return (top, bottom);
    }

    private static double Width(double value) => Nm(value, 0.5, 100.0);

    // The clamp keeps every row inside the ingest validity ranges whatever the parameters; at the magnitudes above it
    // never binds except for the radius limit.
    private static double Nm(double value, double min, double max) => Math.Round(Math.Clamp(value, min, max), 3);
}

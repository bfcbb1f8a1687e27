namespace FinWatch.SeedDemo;

/// <summary>A fin-etch chamber of the invented fab and its fixed offsets from the product nominal (nm).</summary>
internal sealed record EtchChamber(
    string Tool,
    string Id,
    double TopWidthOffsetNm,
    double BottomWidthOffsetNm,
    double HeightOffsetNm,
    double CornerRadiusOffsetNm);

/// <summary>A fin-etch tool; lots are split over its chambers by slot parity.</summary>
internal sealed record EtchTool(string Id, EtchChamber OddSlots, EtchChamber EvenSlots);

/// <summary>A liner deposition chamber and its fixed thickness offset (nm).</summary>
internal sealed record LinerChamber(string Tool, string Id, double ThicknessOffsetNm);

/// <summary>A metrology tool and its bias against the true profile (nm), with its per-site repeatability.</summary>
internal sealed record MetrologyTool(
    string Id,
    double TopWidthBiasNm,
    double BottomWidthBiasNm,
    double HeightBiasNm,
    double LinerBiasNm,
    double TopWidthSigmaNm,
    double BottomWidthSigmaNm);

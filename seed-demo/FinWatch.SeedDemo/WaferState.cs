namespace FinWatch.SeedDemo;

/// <summary>
/// The wafer-level truth of one wafer: nominal plus chamber, lot, wafer, excursion and planted drift effects (nm).
/// Site effects (within-wafer pattern, metrology bias and noise) are added per site by <see cref="FinModel"/>.
/// </summary>
internal readonly record struct WaferState(
    int Slot,
    EtchChamber Chamber,
    double TopWidthNm,
    double BottomWidthNm,
    double HeightNm,
    double MedianCornerRadiusNm,
    double LogCornerRadiusOffset,
    double LinerNm,
    DemoExcursionKind? Excursion,
    double ExcursionWidthNm,
    double ExcursionHeightNm);

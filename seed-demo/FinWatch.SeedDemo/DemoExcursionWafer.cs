namespace FinWatch.SeedDemo;

/// <summary>
/// A planted bad wafer (about 1 in 400): the whole wafer is shifted at every site. Unlike <see cref="DemoFab.Events"/>
/// these depend on the seed; <see cref="DemoFab.ExcursionWafers"/> lists the ones that appear in the data.
/// </summary>
/// <param name="LotId">Lot id.</param>
/// <param name="WaferSlot">Wafer slot, 1..25.</param>
/// <param name="ProductCode">Product code of the lot.</param>
/// <param name="EtchChamber">Chamber that etched the wafer.</param>
/// <param name="Kind">Under- or over-etch.</param>
/// <param name="WidthShiftNm">Shift added to top and bottom width at every site.</param>
/// <param name="HeightShiftNm">Shift added to the fin height at every site.</param>
public sealed record DemoExcursionWafer(
    string LotId,
    int WaferSlot,
    string ProductCode,
    string EtchChamber,
    DemoExcursionKind Kind,
    double WidthShiftNm,
    double HeightShiftNm);

namespace FinWatch.SeedDemo;

/// <summary>
/// One measured site of the invented demo fab: exactly one line of the ingest CSV, with the values already
/// rounded as written (3 decimals for nm, 1 for mm). A null value means "not measured" (an empty cell).
/// </summary>
/// <param name="LotId">Lot id, for example <c>Q30001</c>.</param>
/// <param name="WaferSlot">Slot 1..25.</param>
/// <param name="SiteId">Site id, for example <c>S07</c> (profile step) or <c>C03</c> (etch CD step).</param>
/// <param name="SiteXMm">Site x from the wafer centre, mm.</param>
/// <param name="SiteYMm">Site y from the wafer centre, mm.</param>
/// <param name="Product">Product code.</param>
/// <param name="Step">Measurement step: <see cref="DemoFab.ProfileStep"/> or <see cref="DemoFab.EtchCdStep"/>.</param>
/// <param name="EtchTool">Fin-etch tool.</param>
/// <param name="EtchChamber">Fin-etch chamber (includes the tool id).</param>
/// <param name="LinerTool">Liner tool; null at the etch CD step, which is measured before the liner is deposited.</param>
/// <param name="LinerChamber">Liner chamber; null at the etch CD step.</param>
/// <param name="MetrologyTool">Metrology tool that measured the site.</param>
/// <param name="MeasuredAtUtc">Measurement time, UTC, whole seconds.</param>
/// <param name="Operator">Invented operator badge id, for example <c>OP-0417</c>.</param>
/// <param name="TopWidthNm">Top width, nm.</param>
/// <param name="BottomWidthNm">Bottom width, nm.</param>
/// <param name="FinHeightNm">Fin height, nm; null at the etch CD step.</param>
/// <param name="CornerRadiusNm">Top-corner radius, nm; null at the etch CD step.</param>
/// <param name="LinerThicknessNm">Liner thickness, nm; null at the etch CD step.</param>
public readonly record struct DemoSiteRow(
    string LotId,
    int WaferSlot,
    string SiteId,
    double SiteXMm,
    double SiteYMm,
    string Product,
    string Step,
    string EtchTool,
    string EtchChamber,
    string? LinerTool,
    string? LinerChamber,
    string MetrologyTool,
    DateTime MeasuredAtUtc,
    string Operator,
    double? TopWidthNm,
    double? BottomWidthNm,
    double? FinHeightNm,
    double? CornerRadiusNm,
    double? LinerThicknessNm);

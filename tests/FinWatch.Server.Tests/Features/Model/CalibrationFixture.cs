using System.Globalization;
using System.Text;
using FinWatch.Physics;
using FinWatch.Physics.Analytic;
using FinWatch.Testing;

namespace FinWatch.Server.Tests.Features.Model;

/// <summary>
/// Synthetic electrical tests of a known truth for the calibration tests (CalibrationEndpointsTests, and the same on
/// PostgreSQL): made with the model itself under chosen (L_eff, barrier height, offset), so a correct fit must recover
/// that truth within its stated posterior uncertainty.
/// </summary>
public static class CalibrationFixture
{
    // Six wafers spanning width and height, so all three parameters are identified (G.3: L_eff moves the roll-off, which
    // depends on the width; the offset moves every wafer alike).
    private static readonly (string Lot, int Slot, double Top, double Bottom, double Height, double Radius)[] Wafers =
    [
        ("C0001", 1, 6.0, 10.0, 42.0, 2.0),
        ("C0001", 2, 5.0, 9.0, 40.0, 1.5),
        ("C0002", 1, 7.0, 11.0, 44.0, 2.5),
        ("C0002", 2, 4.5, 8.5, 42.0, 1.2),
        ("C0003", 1, 8.0, 11.0, 45.0, 2.0),
        ("C0003", 2, 6.5, 9.5, 38.0, 1.8),
    ];

    // The truth: L_eff 22 nm (default 20), barrier height 15 mV above its default, offset +110 mV.
    private static readonly double[] Truth = [22.0, 0.015, 0.11];

    /// <summary>Two sites of each wafer, as an ingest CSV.</summary>
    public static string FinsCsv() => SiteRow.Csv(Wafers.SelectMany(w => new[] { "S01", "S02" }.Select(site => new SiteRow
    {
        LotId = w.Lot, WaferSlot = w.Slot.ToString(CultureInfo.InvariantCulture), SiteId = site,
        TopWidthNm = F(w.Top), BottomWidthNm = F(w.Bottom), FinHeightNm = F(w.Height), CornerRadiusNm = F(w.Radius),
    })));

    private static string F(double v) => v.ToString(CultureInfo.InvariantCulture);

    public static CalibrationParameters Defaults() => new()
    {
        Name = "test",
        Version = "test",
        Nominal = new FinMeasurement(new FinProfile(6, 10, 42, 2), 0.9, 0.9, GateFaces.TriGate),
    };

    public static string ElectricalCsv(double[] theta, string product = TestProducts.TriGate)
    {
        var start = Defaults();
        var sb = new StringBuilder("lot_id,wafer_slot,product,vt_lin_v,vt_sat_v,tested_at\n");
        foreach (var w in Wafers)
        {
            var (lin, sat) = Calibration.Predict(start, start.Nominal with { Profile = new FinProfile(w.Top, w.Bottom, w.Height, w.Radius) }, theta);
            sb.Append(CultureInfo.InvariantCulture, $"{w.Lot},{w.Slot},{product},{lin:0.000000},{sat:0.000000},2026-11-28T09:00:00Z\n");
        }

        return sb.ToString();
    }

    public static double[] TruthTheta() => [Truth[0], Defaults().BarrierHeightV + Truth[1], Truth[2]];
}

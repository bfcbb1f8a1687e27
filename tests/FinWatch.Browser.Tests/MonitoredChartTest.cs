using static FinWatch.Testing.MonitorFixture;

namespace FinWatch.Browser.Tests;

/// <summary>
/// A browser test on one monitored chart (MonitorFixture): both test products, 20 baseline wafers, and the chart
/// <see cref="Chart"/> with its limits computed from them and approved.
/// </summary>
public abstract class MonitoredChartTest(BrowserFixture browser) : BrowserTest(browser)
{
    protected const string Chart = "TRI-TOP";

    public override async Task InitializeAsync()
    {
        await base.InitializeAsync();
        await FinWatch.Testing.TestProducts.CreateBothAsync(Client);
        await IngestAsync(Client, Wafers("B0001", BaselineDay, new double[20]));
        await ApprovedContextAsync(Client, Chart);
    }
}

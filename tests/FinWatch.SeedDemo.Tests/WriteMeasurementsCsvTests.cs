using System.Globalization;
using System.Text.RegularExpressions;

namespace FinWatch.SeedDemo.Tests;

public sealed partial class WriteMeasurementsCsvTests
{
    // The API contract, spelled out here rather than taken from DemoFab.CsvHeader.
    private const string ContractHeader =
        "lot_id,wafer_slot,site_id,site_x_mm,site_y_mm,product,step,etch_tool,etch_chamber,liner_tool,liner_chamber,"
        + "metrology_tool,measured_at,operator,top_width_nm,bottom_width_nm,fin_height_nm,corner_radius_nm,liner_thickness_nm";

    [Fact]
    public void WriteMeasurementsCsv_SameSeed_ByteIdenticalOutput()
    {
        string first = TestData.Csv(DemoFab.DefaultSeed, TestData.Tiny);
        string second = TestData.Csv(DemoFab.DefaultSeed, TestData.Tiny);

        Assert.Equal(first, second);
    }

    [Fact]
    public void WriteMeasurementsCsv_DifferentSeed_DifferentOutput()
    {
        string first = TestData.Csv(DemoFab.DefaultSeed, TestData.Tiny);
        string second = TestData.Csv(DemoFab.DefaultSeed + 1, TestData.Tiny);

        Assert.NotEqual(first, second);
    }

    [Fact]
    public void WriteMeasurementsCsv_FirstLine_IsTheContractHeader()
    {
        string csv = TestData.Csv(DemoFab.DefaultSeed, TestData.Tiny);

        Assert.Equal(ContractHeader, csv[..csv.IndexOf('\n', StringComparison.Ordinal)]);
        Assert.Equal(ContractHeader, DemoFab.CsvHeader);
    }

    [Fact]
    public void WriteMeasurementsCsv_EveryLine_HasNineteenCellsAndLfEndings()
    {
        string csv = TestData.Csv(DemoFab.DefaultSeed, TestData.Tiny);

        Assert.DoesNotContain('\r', csv);
        Assert.DoesNotContain('"', csv);
        Assert.EndsWith("\n", csv, StringComparison.Ordinal);
        string[] lines = csv.TrimEnd('\n').Split('\n');
        Assert.All(lines, line => Assert.Equal(19, line.Split(',').Length));
    }

    [Fact]
    public void WriteMeasurementsCsv_Cells_UseContractNumberAndTimeFormats()
    {
        string[] lines = TestData.Csv(DemoFab.DefaultSeed, TestData.Tiny).TrimEnd('\n').Split('\n');

        Assert.All(lines.Skip(1), line =>
        {
            string[] cells = line.Split(',');
            Assert.Matches(IntegerPattern(), cells[1]);
            Assert.Matches(MillimetrePattern(), cells[3]);
            Assert.Matches(MillimetrePattern(), cells[4]);
            Assert.Matches(TimePattern(), cells[12]);
            Assert.All(cells[14..], cell => Assert.Matches(NanometrePattern(), cell));
        });
    }

    [Fact]
    public void WriteMeasurementsCsv_Lines_MatchGenerateRowsFormattedWithInvariantCulture()
    {
        string[] lines = TestData.Csv(DemoFab.DefaultSeed, TestData.Tiny).TrimEnd('\n').Split('\n');
        DemoSiteRow[] rows = [.. DemoFab.GenerateRows(DemoFab.DefaultSeed, TestData.Tiny)];

        Assert.Equal(rows.Length, lines.Length - 1);
        for (int i = 0; i < rows.Length; i++)
        {
            Assert.Equal(Format(rows[i]), lines[i + 1]);
        }
    }

    [Fact]
    public void WriteMeasurementsCsv_CommaDecimalCurrentCulture_SameOutput()
    {
        string expected = TestData.Csv(DemoFab.DefaultSeed, TestData.Tiny);
        var commaCulture = (CultureInfo)CultureInfo.InvariantCulture.Clone();
        commaCulture.NumberFormat.NumberDecimalSeparator = ",";
        commaCulture.NumberFormat.NegativeSign = "~";
        CultureInfo previous = CultureInfo.CurrentCulture;
        try
        {
            CultureInfo.CurrentCulture = commaCulture;

            Assert.Equal(expected, TestData.Csv(DemoFab.DefaultSeed, TestData.Tiny));
        }
        finally
        {
            CultureInfo.CurrentCulture = previous;
        }
    }

    [Fact]
    public void WriteMeasurementsCsv_NullWriter_ThrowsArgumentNullException()
    {
        Assert.Throws<ArgumentNullException>(() => DemoFab.WriteMeasurementsCsv(null!));
    }

    // An independent formatter: standard "F1"/"F3" and the ISO-8601 pattern of the contract.
    private static string Format(DemoSiteRow r)
    {
        static string Nm(double? v) => v?.ToString("F3", CultureInfo.InvariantCulture) ?? "";
        static string Mm(double v) => v.ToString("F1", CultureInfo.InvariantCulture);
        return string.Join(',',
            r.LotId, r.WaferSlot.ToString(CultureInfo.InvariantCulture), r.SiteId, Mm(r.SiteXMm), Mm(r.SiteYMm), r.Product,
            r.Step, r.EtchTool, r.EtchChamber, r.LinerTool ?? "", r.LinerChamber ?? "", r.MetrologyTool,
            r.MeasuredAtUtc.ToString("yyyy-MM-dd'T'HH:mm:ss'Z'", CultureInfo.InvariantCulture), r.Operator,
            Nm(r.TopWidthNm), Nm(r.BottomWidthNm), Nm(r.FinHeightNm), Nm(r.CornerRadiusNm), Nm(r.LinerThicknessNm));
    }

    [GeneratedRegex(@"^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}Z$")]
    private static partial Regex TimePattern();

    [GeneratedRegex(@"^-?\d+\.\d$")]
    private static partial Regex MillimetrePattern();

    [GeneratedRegex(@"^(\d+\.\d{3})?$")]
    private static partial Regex NanometrePattern();

    [GeneratedRegex(@"^\d+$")]
    private static partial Regex IntegerPattern();
}

namespace FinWatch.Data.Entities;

/// <summary>
/// One electrical-test result of a wafer that was used in a calibration, with the mean measured fin it was joined to
/// and its residual after the fit. Kept so a calibration can always be traced to the data it was fitted on.
/// </summary>
public sealed class ElectricalTest
{
    public long Id { get; set; }
    public int ParameterSetId { get; set; }
    public int ProductId { get; set; }
    public required string LotId { get; set; }
    public int WaferSlot { get; set; }

    /// <summary>Linear and saturation threshold voltage from electrical test, V.</summary>
    public double VtLinV { get; set; }
    public double VtSatV { get; set; }

    public long TestedAtMs { get; set; }

    /// <summary>The wafer's mean measured fin (nm) over its sites with a full profile, and how many sites.</summary>
    public double MeanTopWidthNm { get; set; }
    public double MeanBottomWidthNm { get; set; }
    public double MeanFinHeightNm { get; set; }
    public double MeanCornerRadiusNm { get; set; }
    public int Sites { get; set; }

    /// <summary>Measured minus fitted threshold, mV.</summary>
    public double ResidualLinMv { get; set; }
    public double ResidualSatMv { get; set; }
}

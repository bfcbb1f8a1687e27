namespace FinWatch.Data.Entities;

/// <summary>
/// A fitted calibration of a product's analytic model (docs/model.md §G.3): the three fitted parameters with their
/// posterior standard deviations, the fit quality, and who made it, when and why. Versions count up per product; the
/// highest is the product's current set. Rows are never changed or deleted: a new fit is a new version.
/// </summary>
public sealed class ModelParameterSet
{
    public int Id { get; set; }
    public int ProductId { get; set; }

    /// <summary>1, 2, 3 … per product.</summary>
    public int Version { get; set; }

    /// <summary>L_eff in nm and its posterior standard deviation.</summary>
    public double GateLengthNm { get; set; }
    public double GateLengthSdNm { get; set; }

    /// <summary>The short-channel prefactor V_bi − φ_th in V and its posterior standard deviation.</summary>
    public double BarrierHeightV { get; set; }
    public double BarrierHeightSdV { get; set; }

    /// <summary>The constant threshold offset in V and its posterior standard deviation.</summary>
    public double ThresholdOffsetV { get; set; }
    public double ThresholdOffsetSdV { get; set; }

    /// <summary>Root-mean-square threshold residual in mV with the physics defaults and with the fitted set.</summary>
    public double RmsResidualBeforeMv { get; set; }
    public double RmsResidualAfterMv { get; set; }

    /// <summary>Assumed standard deviation of one electrical-test threshold, mV.</summary>
    public double MeasurementSdMv { get; set; }

    public int Observations { get; set; }
    public int Iterations { get; set; }

    /// <summary>The analytic model's code version that fitted the set.</summary>
    public required string CodeVersion { get; set; }

    public long CreatedAtMs { get; set; }
    public required string CreatedBy { get; set; }
    public required string Reason { get; set; }

    /// <summary>The uploaded file's name, when it came as a form file.</summary>
    public string? SourceName { get; set; }
}

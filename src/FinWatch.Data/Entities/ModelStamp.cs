namespace FinWatch.Data.Entities;

/// <summary>Which model made a stored prediction: the product, its parameter set and version, and the code version.</summary>
public sealed class ModelStamp
{
    public int Id { get; set; }
    public int ProductId { get; set; }
    public required string ParameterSet { get; set; }
    public required string ParameterSetVersion { get; set; }
    public required string CodeVersion { get; set; }
}

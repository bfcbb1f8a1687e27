namespace FinWatch.Data.Entities;

/// <summary>Lower spec, target and upper spec of one parameter of one product, each optional, in the parameter's unit.</summary>
public sealed class SpecLimit
{
    public int Id { get; set; }
    public int ProductId { get; set; }
    public required string Parameter { get; set; }
    public double? Lower { get; set; }
    public double? Target { get; set; }
    public double? Upper { get; set; }
}

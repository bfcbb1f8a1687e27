namespace FinWatch.Data.Entities;

/// <summary>A chamber (etch or liner) that processed some wafers of a lot at a step; used to filter lots by chamber.</summary>
public sealed class LotChamber
{
    public required string LotId { get; set; }
    public required string Step { get; set; }
    public required string Chamber { get; set; }
}

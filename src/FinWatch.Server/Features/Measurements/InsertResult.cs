namespace FinWatch.Server.Features.Measurements;

/// <summary>What happened to one site on insert.</summary>
public enum InsertResult
{
    /// <summary>Stored.</summary>
    Inserted,

    /// <summary>An earlier batch stored the same lot, wafer, site, step and time; reported, not duplicated.</summary>
    AlreadyPresent,

    /// <summary>The same key appears twice in this batch: an error.</summary>
    DuplicateInBatch,
}

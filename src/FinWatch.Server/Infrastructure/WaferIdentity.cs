namespace FinWatch.Server.Infrastructure;

/// <summary>
/// How a wafer is named in every file FinWatch reads (measurements, electrical tests): a lot id and its other text
/// identifiers of at most <see cref="MaxTextLength"/> characters, and a slot from 1 to <see cref="MaxSlot"/>.
/// </summary>
public static class WaferIdentity
{
    /// <summary>Longest lot id, site id, product code, step, tool or chamber name, as stored.</summary>
    public const int MaxTextLength = 64;

    /// <summary>A 25-slot carrier (FOUP): wafer slots 1 to 25.</summary>
    public const int MaxSlot = 25;
}

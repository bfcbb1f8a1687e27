namespace FinWatch.Data.Entities;

/// <summary>
/// The live feed: every new point and every alert change, numbered by <see cref="Seq"/> in commit order, so that a
/// browser that lost its connection catches up from the last number it saw with no gap and no duplicate.
/// </summary>
public sealed class FeedEvent
{
    public long Seq { get; set; }
    public long AtMs { get; set; }

    /// <summary>"point" or "alert".</summary>
    public required string Kind { get; set; }

    public int ContextId { get; set; }

    /// <summary>The message as sent to clients (JSON).</summary>
    public required string Payload { get; set; }
}

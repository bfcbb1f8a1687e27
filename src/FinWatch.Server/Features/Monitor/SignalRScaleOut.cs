namespace FinWatch.Server.Features.Monitor;

/// <summary>Settings of the Redis backplane for SignalR (README Scale-out); without them pushes stay in the process.</summary>
public static class SignalRScaleOut
{
    /// <summary>A StackExchange.Redis connection string, for example <c>redis:6379</c>.</summary>
    public const string RedisKey = "FinWatch:SignalR:Redis";

    /// <summary>Keeps the channels of several FinWatch installations on one Redis apart.</summary>
    public const string ChannelPrefixKey = "FinWatch:SignalR:RedisChannelPrefix";

    public const string DefaultChannelPrefix = "finwatch";
}

namespace FinWatch.Server.Tests.Faults;

/// <summary>Tests that run the server as a separate process with large ingests: one at a time, and not beside other tests.</summary>
[CollectionDefinition(Name, DisableParallelization = true)]
public sealed class ServerProcessCollection
{
    public const string Name = "server processes";
}

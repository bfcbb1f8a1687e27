namespace FinWatch.Server.Infrastructure;

public static class HostExtensions
{
    /// <summary>
    /// What every feature stands on: the listen address, the API's JSON and problem answers with OpenAPI and health,
    /// telemetry, and the database.
    /// </summary>
    public static WebApplicationBuilder AddFinWatchHost(this WebApplicationBuilder builder) =>
        builder.UseDefaultListenAddress().AddFinWatchApiDefaults().AddFinWatchTelemetry().AddFinWatchData();
}

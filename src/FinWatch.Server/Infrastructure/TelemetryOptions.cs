using System.ComponentModel.DataAnnotations;

namespace FinWatch.Server.Infrastructure;

/// <summary>
/// Telemetry settings (section "FinWatch:Telemetry"). The OTLP exporter is set by the standard OTEL_* variables instead
/// (<see cref="TelemetryExtensions"/>); these cover what OpenTelemetry has no standard variable for.
/// </summary>
public sealed class TelemetryOptions
{
    public const string Section = "FinWatch:Telemetry";

    /// <summary>
    /// Serves the metrics in Prometheus text exposition at <see cref="PrometheusPath"/>, without sign-in: a scraper
    /// cannot sign in, and the figures are counts and durations, no measurement, lot or person. Off by default; where
    /// it is on, keep the path off the public side of the reverse proxy.
    /// </summary>
    public bool PrometheusEnabled { get; set; }

    /// <summary>Where the scrape answers, one or more path segments.</summary>
    [Required, RegularExpression("^(/[A-Za-z0-9._~-]+)+$", ErrorMessage = "the Prometheus path is one or more segments, such as /metrics")]
    public string PrometheusPath { get; set; } = "/metrics";
}

using System.Collections.Concurrent;
using System.Diagnostics.Metrics;
using FinWatch.Server.Infrastructure;
using Microsoft.Extensions.DependencyInjection;

namespace FinWatch.Server.Tests.Infrastructure;

/// <summary>
/// Records every measurement of FinWatch's instruments in one app, from the moment it starts. The meter comes from the
/// app's own <see cref="IMeterFactory"/>, so apps of tests running beside this one are not heard.
/// </summary>
public sealed class MetricRecorder : IDisposable
{
    private readonly MeterListener listener = new();
    private readonly ConcurrentQueue<(string Instrument, double Value, Dictionary<string, string?> Tags)> recorded = new();

    public MetricRecorder(IServiceProvider services)
    {
        var factory = services.GetRequiredService<IMeterFactory>();
        listener.InstrumentPublished = (instrument, l) =>
        {
            if (instrument.Meter.Name == Telemetry.Name && ReferenceEquals(instrument.Meter.Scope, factory))
            {
                l.EnableMeasurementEvents(instrument);
            }
        };
        listener.SetMeasurementEventCallback<long>((i, value, tags, _) => Add(i, value, tags));
        listener.SetMeasurementEventCallback<double>((i, value, tags, _) => Add(i, value, tags));
        listener.Start();
    }

    private void Add(Instrument instrument, double value, ReadOnlySpan<KeyValuePair<string, object?>> tags)
    {
        var copy = new Dictionary<string, string?>(StringComparer.Ordinal);
        foreach (var (key, tag) in tags)
        {
            copy[key] = tag?.ToString();
        }

        recorded.Enqueue((instrument.Name, value, copy));
    }

    /// <summary>The values recorded on <paramref name="instrument"/> whose tags include all of <paramref name="tags"/> ("key=value").</summary>
    public double[] Values(string instrument, params string[] tags) =>
        [.. recorded.Where(r => r.Instrument == instrument && tags.All(t => Matches(r.Tags, t))).Select(r => r.Value)];

    public double Sum(string instrument, params string[] tags) => Values(instrument, tags).Sum();

    /// <summary>Every distinct tag set recorded on <paramref name="instrument"/>, as "key=value" joined by commas, sorted.</summary>
    public string[] TagSets(string instrument) =>
        [.. recorded.Where(r => r.Instrument == instrument)
            .Select(r => string.Join(",", r.Tags.OrderBy(t => t.Key, StringComparer.Ordinal).Select(t => $"{t.Key}={t.Value}")))
            .Distinct().Order(StringComparer.Ordinal)];

    /// <summary>Waits up to 10 s for <paramref name="condition"/> (what is recorded after the answer, such as a push).</summary>
    public static async Task<bool> EventuallyAsync(Func<bool> condition)
    {
        for (var i = 0; i < 100 && !condition(); i++)
        {
            await Task.Delay(100);
        }

        return condition();
    }

    private static bool Matches(Dictionary<string, string?> tags, string tag)
    {
        var split = tag.IndexOf('=', StringComparison.Ordinal);
        return tags.TryGetValue(tag[..split], out var value) && value == tag[(split + 1)..];
    }

    public void Dispose() => listener.Dispose();
}

using System.Text.RegularExpressions;
using FinWatch.Testing;
using YamlDotNet.Core;
using YamlDotNet.Serialization;

namespace FinWatch.Server.Tests.Features.ScaleOut;

/// <summary>
/// docker-compose.yml as the Compose specification reads it (compose-spec.io: YAML anchors and "&lt;&lt;" merge keys, and
/// <c>${NAME:-default}</c> interpolation), for tests that run its services without Docker.
/// </summary>
public sealed partial class ComposeFile
{
    private readonly Dictionary<object, object> services;

    private ComposeFile(Dictionary<object, object> root)
    {
        services = (Dictionary<object, object>)root["services"];
    }

    public static ComposeFile Load()
    {
        var text = File.ReadAllText(Path.Combine(TestPaths.RepositoryRoot(), "docker-compose.yml"));
        var root = new DeserializerBuilder().Build().Deserialize<Dictionary<object, object>>(new MergingParser(new Parser(new StringReader(text))));
        return new ComposeFile(root);
    }

    public IEnumerable<string> ServiceNames => services.Keys.Select(k => (string)k);

    /// <summary>One service's environment, interpolated with <paramref name="variables"/> (else each default).</summary>
    public Dictionary<string, string> Environment(string service, IReadOnlyDictionary<string, string> variables) =>
        ((Dictionary<object, object>)Service(service)["environment"])
            .ToDictionary(e => (string)e.Key, e => Interpolate((string)e.Value, variables));

    /// <summary>The service's volumes as "name:/path" entries.</summary>
    public IReadOnlyList<string> Volumes(string service) =>
        Service(service).TryGetValue("volumes", out var v) ? [.. ((List<object>)v).Cast<string>()] : [];

    /// <summary>The health-check test of a service, as its argument list (without the leading "CMD").</summary>
    public IReadOnlyList<string> HealthCheck(string service)
    {
        var test = ((List<object>)((Dictionary<object, object>)Service(service)["healthcheck"])["test"]).Cast<string>().ToList();
        Assert.Equal("CMD", test[0]);
        return test[1..];
    }

    public bool HasHealthCheck(string service) => Service(service).ContainsKey("healthcheck");

    private Dictionary<object, object> Service(string name) =>
        services.TryGetValue(name, out var s) ? (Dictionary<object, object>)s : throw new KeyNotFoundException($"docker-compose.yml has no service '{name}'");

    // ${NAME:-default}: the variable if set and not empty, else the default; ${NAME}: the variable or empty.
    private static string Interpolate(string value, IReadOnlyDictionary<string, string> variables) =>
        Variable().Replace(value, m => variables.TryGetValue(m.Groups[1].Value, out var v) && v.Length > 0
            ? v
            : m.Groups[3].Success ? m.Groups[3].Value : "");

    /// <summary>
    /// The ENV settings of the runtime stage (after the last FROM) of the Dockerfile the FinWatch services build, which
    /// a container starts with and its compose environment then overrides.
    /// </summary>
    public static Dictionary<string, string> ImageEnvironment()
    {
        var text = File.ReadAllText(Path.Combine(TestPaths.RepositoryRoot(), "src", "FinWatch.Server", "Dockerfile")).Replace("\\\n", " ", StringComparison.Ordinal);
        var lines = text.Split('\n');
        var runtime = lines.Skip(Array.FindLastIndex(lines, l => l.StartsWith("FROM ", StringComparison.Ordinal)));
        return runtime.Where(l => l.StartsWith("ENV ", StringComparison.Ordinal))
            .SelectMany(l => l[4..].Split(' ', StringSplitOptions.RemoveEmptyEntries))
            .Select(pair => pair.Split('=', 2))
            .ToDictionary(kv => kv[0], kv => kv[1]);
    }

    [GeneratedRegex(@"\$\{([A-Za-z_][A-Za-z0-9_]*)(:-([^}]*))?\}")]
    private static partial Regex Variable();
}

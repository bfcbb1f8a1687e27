using Xunit;

namespace FinWatch.Testing;

/// <summary>
/// What the tests need from outside their process, read where the test command (tests/run-all.sh) leaves it: the
/// private PostgreSQL and Redis it starts, the programs Debian's packages install, and the quick run that leaves the
/// browser and scale-out tests out on purpose. A test whose service is missing fails with a message naming it; it is
/// skipped only on a quick run.
/// </summary>
public static class TestServices
{
    /// <summary>Set to 1 by <c>tests/run-all.sh --quick</c>.</summary>
    public const string QuickVariable = "FINWATCH_TEST_QUICK";

    /// <summary>Debian's Chromium, which the browser tests drive (package chromium).</summary>
    public const string ChromiumPath = "/usr/bin/chromium";

    /// <summary>Debian's nginx, which the proxy tests start with the repository's configuration (package nginx).</summary>
    public const string NginxPath = "/usr/sbin/nginx";

    public static bool QuickRun => Environment.GetEnvironmentVariable(QuickVariable) == "1";

    /// <summary>The skip reason of a test of <paramref name="part"/> on a quick run, or null when the test runs.</summary>
    public static string? QuickRunSkip(string part) =>
        QuickRun ? $"quick run ({QuickVariable}=1, tests/run-all.sh --quick): the {part} tests are left out on purpose" : null;

    /// <summary>The PostgreSQL server's connection string, or an error naming what is missing.</summary>
    public static string RequirePostgres() =>
        PostgresTestDatabase.Server ?? throw Missing("a PostgreSQL server", $"{PostgresTestDatabase.Variable} is not set");

    /// <summary>The Redis server's address, or an error naming what is missing.</summary>
    public static string RequireRedis() =>
        PostgresTestDatabase.Redis ?? throw Missing("a Redis server", $"{PostgresTestDatabase.RedisVariable} is not set");

    public static string RequireChromium() => RequireProgram(ChromiumPath, "chromium");

    public static string RequireNginx() => RequireProgram(NginxPath, "nginx");

    private static string RequireProgram(string path, string package) =>
        File.Exists(path) ? path : throw Missing($"{path} (Debian package {package})", "it is not installed");

    private static InvalidOperationException Missing(string what, string detail) =>
        new($"This test needs {what}, and {detail}. Run the tests with ./tests/run-all.sh, which installs the Debian " +
            "packages the tests need and starts a private PostgreSQL and Redis for the run; or leave the browser and " +
            $"scale-out tests out on purpose with ./tests/run-all.sh --quick ({QuickVariable}=1).");
}

/// <summary>A test that needs PostgreSQL (and perhaps Redis and nginx): skipped only on a quick run, otherwise it fails when they are missing.</summary>
public sealed class ScaleOutFactAttribute : FactAttribute
{
    public ScaleOutFactAttribute() => Skip = TestServices.QuickRunSkip("PostgreSQL, Redis and proxy");
}

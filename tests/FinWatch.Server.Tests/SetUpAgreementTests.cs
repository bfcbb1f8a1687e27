using System.Diagnostics;
using System.Runtime.Versioning;
using System.Text.RegularExpressions;
using FinWatch.Testing;

namespace FinWatch.Server.Tests;

/// <summary>
/// The set-up holds together: the README's quick start gives exactly two commands (the demo server and the test
/// command), CI's entry point runs the README's test command and nothing else, the test command sets up what the
/// tests read, and the README names every package it installs. A change to one that the others do not follow fails
/// here.
/// </summary>
public partial class SetUpAgreementTests
{
    private const string DemoCommand = "dotnet run --project src/FinWatch.Server -- --demo";

    [GeneratedRegex(@"^## Quick start\n(?<body>.*?)^## ", RegexOptions.Multiline | RegexOptions.Singleline)]
    private static partial Regex QuickStartSection();

    [GeneratedRegex("```sh\n(?<body>.*?)```", RegexOptions.Singleline)]
    private static partial Regex ShellBlock();

    [GeneratedRegex(@"^debian_packages=\((?<list>[^)]*)\)", RegexOptions.Multiline)]
    private static partial Regex PackageList();

    private static string Read(params string[] path) => File.ReadAllText(Path.Combine([TestPaths.RepositoryRoot(), .. path]));

    private static string QuickStart()
    {
        var match = QuickStartSection().Match(Read("README.md"));
        Assert.True(match.Success, "README.md has no section headed \"## Quick start\" followed by another section");
        return match.Groups["body"].Value;
    }

    private static List<string> QuickStartCommands() =>
        ShellBlock().Matches(QuickStart()).Select(m => m.Groups["body"].Value.Trim()).ToList();

    private static string TestCommand() => QuickStartCommands()[1];

    [Fact]
    public void QuickStart_GivesExactlyTwoCommands_TheDemoServerThenTheTestCommand()
    {
        var commands = QuickStartCommands();
        Assert.Equal(2, commands.Count);
        Assert.All(commands, c => Assert.DoesNotContain('\n', c));
        Assert.Equal(DemoCommand, commands[0]);
        Assert.Equal("./tests/run-all.sh", commands[1]);
    }

    [Fact]
    public void CiRun_RunsTheReadmeTestCommandAndNothingElse()
    {
        // Everything but the interpreter line, comments, blank lines, strict mode and the move to the repository root.
        string[] frame = ["set -euo pipefail", "cd \"$(dirname \"$0\")/..\""];
        var lines = Read(".ci", "run").Split('\n').Select(l => l.Trim())
            .Where(l => l.Length > 0 && !l.StartsWith('#') && !frame.Contains(l))
            .ToList();
        Assert.Equal(["exec " + TestCommand()], lines);
    }

    [Fact]
    [UnsupportedOSPlatform("windows")] // the test command is a bash script; file modes are Unix's
    public void TestCommand_IsAnExecutableBashScriptInTheRepository()
    {
        var path = Path.Combine(TestPaths.RepositoryRoot(), TestCommand());
        Assert.True(File.Exists(path), path + " is missing");
        Assert.True(File.GetUnixFileMode(path).HasFlag(UnixFileMode.UserExecute), path + " is not executable");
        Assert.StartsWith("#!/usr/bin/env bash\n", File.ReadAllText(path), StringComparison.Ordinal);
        Assert.True(File.GetUnixFileMode(Path.Combine(TestPaths.RepositoryRoot(), ".ci", "run")).HasFlag(UnixFileMode.UserExecute));
    }

    [Fact]
    public void QuickStart_NamesEveryPackageTheTestCommandInstalls_AndTheQuickRun()
    {
        var script = Read(TestCommand());
        var match = PackageList().Match(script);
        Assert.True(match.Success, "the test command has no debian_packages=(...) line");
        var packages = match.Groups["list"].Value.Split(' ', StringSplitOptions.RemoveEmptyEntries);
        Assert.Contains("chromium", packages);
        Assert.Contains("postgresql", packages);
        Assert.Contains("redis-server", packages);
        var text = QuickStart();
        Assert.All(packages, p => Assert.Contains($"`{p}`", text, StringComparison.Ordinal));
        Assert.Contains("--quick", text, StringComparison.Ordinal);
    }

    [Fact]
    public void TestCommand_SetsUpWhatTheTestsRead()
    {
        var script = Read(TestCommand());
        Assert.Contains($"export {PostgresTestDatabase.Variable}=", script, StringComparison.Ordinal);
        Assert.Contains($"export {PostgresTestDatabase.RedisVariable}=", script, StringComparison.Ordinal);
        Assert.Contains($"export {TestServices.QuickVariable}=1", script, StringComparison.Ordinal);
        // It checks for the very programs the tests start, so a package it thinks present is one the tests find.
        Assert.Contains(TestServices.ChromiumPath, script, StringComparison.Ordinal);
        Assert.Contains(TestServices.NginxPath, script, StringComparison.Ordinal);
    }

    [Fact]
    public async Task TestCommand_UnknownOption_FailsNamingItBeforeSettingUpAnything()
    {
        var start = new ProcessStartInfo("bash", [Path.Combine(TestPaths.RepositoryRoot(), TestCommand()), "--no-such-option"])
        {
            RedirectStandardError = true,
            RedirectStandardOutput = true,
        };
        using var process = Process.Start(start)!;
        var error = await process.StandardError.ReadToEndAsync();
        var output = await process.StandardOutput.ReadToEndAsync();
        await process.WaitForExitAsync();
        Assert.Equal(2, process.ExitCode);
        Assert.Contains("unknown option '--no-such-option'", error, StringComparison.Ordinal);
        Assert.Equal("", output);
    }
}

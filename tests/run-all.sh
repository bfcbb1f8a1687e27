#!/usr/bin/env bash
# Runs every FinWatch test: restores tools and packages, builds the solution, runs each test project, and prints one
# closing line "N passed, N failed, N skipped". The benchmarks (tests/FinWatch.Benchmarks) are not part of this run.
set -uo pipefail
cd "$(dirname "$0")/.."

if ! command -v dotnet >/dev/null 2>&1; then
  echo "FinWatch needs the .NET 10 SDK (dotnet) on PATH." >&2
  exit 1
fi

export DOTNET_CLI_TELEMETRY_OPTOUT=1 DOTNET_NOLOGO=1 DOTNET_SKIP_FIRST_TIME_EXPERIENCE=1

dotnet tool restore >/dev/null || exit 1
dotnet build FinWatch.sln -c Release --nologo -v quiet -clp:ErrorsOnly || exit 1

log=$(mktemp)
trap 'rm -f "$log"' EXIT
dotnet test FinWatch.sln -c Release --no-build --nologo 2>&1 | tee "$log"
status=${PIPESTATUS[0]}

# Each test project prints e.g. "Passed!  - Failed:     0, Passed:   110, Skipped:     0, Total:   110, ...".
awk '
  /(Passed|Failed)! +- +Failed:/ {
    for (i = 1; i <= NF; i++) {
      if ($i == "Failed:")  { f += $(i + 1) }
      if ($i == "Passed:")  { p += $(i + 1) }
      if ($i == "Skipped:") { s += $(i + 1) }
    }
    projects++
  }
  END {
    if (projects == 0) { print "no test project ran" > "/dev/stderr"; exit 1 }
    printf "%d passed, %d failed, %d skipped\n", p, f, s
  }' "$log" || status=1
exit "$status"

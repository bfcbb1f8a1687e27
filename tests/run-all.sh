#!/usr/bin/env bash
# Runs every FinWatch test, after setting up everything the tests need:
#   1. installs the Debian packages the suite needs and the machine lacks (as root, or through sudo without a
#      password; otherwise it says exactly which are missing and stops);
#   2. starts a private, throw-away PostgreSQL (initdb in a temporary folder, a free port) and Redis (a free port),
#      never the machine's own cluster or services, and exports the variables the tests read;
#   3. restores tools and packages, builds the solution, runs each test project and prints one closing line
#      "N passed, N failed, N skipped";
#   4. stops and removes both servers when it exits: at the end, on failure and on Ctrl+C.
# The benchmarks (tests/FinWatch.Benchmarks) are not part of this run.
#
# Usage: ./tests/run-all.sh [--quick] [--filter EXPRESSION]
#   --quick       leaves out, on purpose, the browser tests and the PostgreSQL, Redis and proxy tests (no package
#                 installed, no server started); the closing line says so
#   --filter EXPR runs only the tests that dotnet test's filter expression selects, e.g. FullyQualifiedName~ScaleOut
set -uo pipefail
cd "$(dirname "$0")/.."

quick=0
filter=()
while [ $# -gt 0 ]; do
  case "$1" in
    --quick) quick=1 ;;
    --filter)
      [ $# -ge 2 ] || { echo "--filter needs an expression, e.g. --filter FullyQualifiedName~ScaleOut" >&2; exit 2; }
      filter=(--filter "$2")
      shift ;;
    -h|--help) sed -n '2,15p' "$0" | sed 's/^# \{0,1\}//'; exit 0 ;;
    *) echo "unknown option '$1' (known: --quick, --filter EXPRESSION, --help)" >&2; exit 2 ;;
  esac
  shift
done

if ! command -v dotnet >/dev/null 2>&1; then
  echo "FinWatch needs the .NET 10 SDK (dotnet) on PATH." >&2
  exit 1
fi

# The Debian packages the suite needs beyond the .NET SDK. npm builds the server (LibMan takes Chart.js and the
# SignalR browser client from node_modules); chromium runs the browser tests; postgresql, redis-server and nginx run
# the scale-out tests (a private PostgreSQL and Redis started below; nginx is started by the proxy tests themselves).
debian_packages=(npm chromium postgresql redis-server nginx)
quick_packages=(npm)

# The newest PostgreSQL server programs Debian installed (initdb, pg_ctl), or nothing.
postgres_bin() {
  local dir
  dir=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1)
  [ -n "$dir" ] && [ -x "$dir/initdb" ] && [ -x "$dir/pg_ctl" ] && echo "$dir"
}

# Whether what the tests use of a package is there: the files they start, not the package database.
present() {
  case "$1" in
    npm) command -v npm >/dev/null 2>&1 ;;
    chromium) [ -x /usr/bin/chromium ] ;;
    postgresql) [ -n "$(postgres_bin)" ] ;;
    redis-server) command -v redis-server >/dev/null 2>&1 && command -v redis-cli >/dev/null 2>&1 ;;
    nginx) [ -x /usr/sbin/nginx ] ;;
    *) return 1 ;;
  esac
}

if [ "$quick" -eq 1 ]; then needed=("${quick_packages[@]}"); else needed=("${debian_packages[@]}"); fi
missing=()
for pkg in "${needed[@]}"; do
  present "$pkg" || missing+=("$pkg")
done

if [ "${#missing[@]}" -gt 0 ]; then
  as_root=()
  if [ "$(id -u)" -ne 0 ]; then
    if command -v sudo >/dev/null 2>&1 && sudo -n true 2>/dev/null; then
      as_root=(sudo -n)
    else
      echo "The tests need these Debian packages, which are not installed: ${missing[*]}." >&2
      echo "This run cannot install them (it is not root and sudo asks for a password). As root:" >&2
      echo "  apt-get install -y ${missing[*]}" >&2
      [ "$quick" -eq 0 ] && echo "or leave the browser and scale-out tests out on purpose: ./tests/run-all.sh --quick" >&2
      exit 1
    fi
  fi
  if ! command -v apt-get >/dev/null 2>&1; then
    echo "The tests need these Debian packages, which are not installed: ${missing[*]}; this machine has no apt-get to install them." >&2
    exit 1
  fi
  echo "Installing the Debian packages the tests need: ${missing[*]} (a first run only; about two minutes) ..."
  apt_log=$(mktemp)
  if ! { "${as_root[@]}" apt-get update -qq && "${as_root[@]}" env DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "${missing[@]}"; } >"$apt_log" 2>&1; then
    tail -n 30 "$apt_log" >&2
    echo "Installing ${missing[*]} failed (apt-get's last lines above)." >&2
    rm -f "$apt_log"
    exit 1
  fi
  rm -f "$apt_log"
  for pkg in "${missing[@]}"; do
    present "$pkg" || { echo "The package $pkg was installed, but what the tests use of it is still not there." >&2; exit 1; }
  done
fi

export DOTNET_CLI_TELEMETRY_OPTOUT=1 DOTNET_NOLOGO=1 DOTNET_SKIP_FIRST_TIME_EXPERIENCE=1

workdir=""
redis_pid=""
pg_data=""
log=""
tests_pid=""

# Runs a PostgreSQL program as the user that owns the private cluster: postgres when this run is root (initdb and
# the server refuse to run as root), this run's own user otherwise.
as_postgres() {
  if [ "$(id -u)" -eq 0 ]; then runuser -u postgres -- "$@"; else "$@"; fi
}

cleanup() {
  local status=$?
  trap - EXIT INT TERM
  # The test run is a process group of its own (dotnet test, its test hosts, the servers and nginx the tests start);
  # the test hosts do not always end on SIGTERM, so what is left after five seconds is killed.
  if [ -n "$tests_pid" ] && kill -0 -- "-$tests_pid" 2>/dev/null; then
    kill -TERM -- "-$tests_pid" 2>/dev/null
    for _ in $(seq 1 50); do
      kill -0 -- "-$tests_pid" 2>/dev/null || break
      sleep 0.1
    done
    kill -KILL -- "-$tests_pid" 2>/dev/null
  fi
  if [ -n "$redis_pid" ]; then
    kill "$redis_pid" 2>/dev/null
    wait "$redis_pid" 2>/dev/null
  fi
  if [ -n "$pg_data" ]; then
    as_postgres "$(postgres_bin)/pg_ctl" -D "$pg_data" -m immediate -w stop >/dev/null 2>&1
  fi
  [ -n "$workdir" ] && rm -rf "$workdir"
  [ -n "$log" ] && rm -f "$log"
  exit "$status"
}
trap cleanup EXIT
trap 'exit 130' INT
trap 'exit 143' TERM

# A port on 127.0.0.1 that nothing listens on now (the server started on it may still lose a race; callers retry).
free_port() {
  local port
  while :; do
    port=$((20000 + RANDOM % 40000))
    (exec 3<>"/dev/tcp/127.0.0.1/$port") 2>/dev/null || { echo "$port"; return; }
  done
}

start_postgres() {
  local bin dir password port attempt
  bin=$(postgres_bin)
  dir="$workdir/postgres"
  mkdir -p "$dir"
  if [ "$(id -u)" -eq 0 ]; then
    id postgres >/dev/null 2>&1 || { echo "PostgreSQL cannot run as root and this machine has no postgres user." >&2; return 1; }
    chown postgres "$dir"
  fi
  chmod 0700 "$dir"
  password=$(od -An -N16 -tx1 /dev/urandom | tr -d ' \n')
  printf '%s\n' "$password" >"$dir/password"
  [ "$(id -u)" -eq 0 ] && chown postgres "$dir/password"
  if ! as_postgres "$bin/initdb" -D "$dir/data" -U finwatch --pwfile="$dir/password" --auth=scram-sha-256 \
      --encoding=UTF8 --locale=C >"$dir/initdb.log" 2>&1; then
    cat "$dir/initdb.log" >&2
    echo "initdb failed: the private PostgreSQL for the scale-out tests could not be created." >&2
    return 1
  fi
  rm -f "$dir/password"
  pg_data="$dir/data"
  # A throw-away cluster: nothing needs to survive a crash, so no fsync; the sockets stay in its own folder.
  for attempt in 1 2 3 4 5; do
    port=$(free_port)
    if as_postgres "$bin/pg_ctl" -D "$pg_data" -l "$dir/server.log" -w -t 60 -o "-p $port -k $dir \
        -c listen_addresses=127.0.0.1 -c max_connections=200 -c fsync=off -c synchronous_commit=off \
        -c full_page_writes=off" start >/dev/null 2>&1; then
      export FINWATCH_TEST_POSTGRES="Host=127.0.0.1;Port=$port;Username=finwatch;Password=$password;Database=postgres"
      echo "PostgreSQL for the tests: a private server on 127.0.0.1:$port (removed at the end of the run)"
      return 0
    fi
  done
  tail -n 20 "$dir/server.log" >&2
  echo "The private PostgreSQL for the scale-out tests did not start (its log's last lines above)." >&2
  return 1
}

start_redis() {
  local dir port attempt
  dir="$workdir/redis"
  mkdir -p "$dir"
  for attempt in 1 2 3 4 5; do
    port=$(free_port)
    redis-server --bind 127.0.0.1 --port "$port" --save '' --appendonly no --dir "$dir" \
      --logfile "$dir/redis.log" >/dev/null 2>&1 &
    redis_pid=$!
    for _ in $(seq 1 50); do
      kill -0 "$redis_pid" 2>/dev/null || break
      # Ours, not another server that took the port first: the process id it reports is the one started here.
      if redis-cli -p "$port" info server 2>/dev/null | tr -d '\r' | grep -qx "process_id:$redis_pid"; then
        export FINWATCH_TEST_REDIS="127.0.0.1:$port"
        echo "Redis for the tests: a private server on 127.0.0.1:$port (stopped at the end of the run)"
        return 0
      fi
      sleep 0.1
    done
    kill "$redis_pid" 2>/dev/null
    wait "$redis_pid" 2>/dev/null
    redis_pid=""
  done
  tail -n 20 "$dir/redis.log" >&2
  echo "The private Redis for the scale-out tests did not start (its log's last lines above)." >&2
  return 1
}

unset FINWATCH_TEST_POSTGRES FINWATCH_TEST_REDIS FINWATCH_TEST_QUICK
if [ "$quick" -eq 1 ]; then
  export FINWATCH_TEST_QUICK=1
else
  workdir=$(mktemp -d "${TMPDIR:-/tmp}/finwatch-tests.XXXXXX")
  chmod 0711 "$workdir" # the postgres user reaches its own folder inside
  start_postgres || exit 1
  start_redis || exit 1
fi

dotnet tool restore >/dev/null || exit 1
dotnet build FinWatch.sln -c Release --nologo -v quiet -clp:ErrorsOnly || exit 1

# dotnet test runs in the background, in a process group of its own, so that Ctrl+C reaches this script at once (a
# foreground dotnet test keeps running after it) and the exit trap can end the whole run before removing the servers.
log=$(mktemp)
setsid dotnet test FinWatch.sln -c Release --no-build --nologo "${filter[@]}" >"$log" 2>&1 &
tests_pid=$!
tail -n +1 -f --pid="$tests_pid" "$log" &
tail_pid=$!
wait "$tests_pid"
status=$?
wait "$tail_pid" # tail prints the last lines once the run has ended

# Each test project prints e.g. "Passed!  - Failed:     0, Passed:   110, Skipped:     0, Total:   110, ..." (or
# "Skipped!" when it ran none, as the browser tests on a quick run).
note=""
[ "$quick" -eq 1 ] && note=" (quick run: the browser, PostgreSQL, Redis and proxy tests were left out on purpose)"
awk -v note="$note" '
  /(Passed|Failed|Skipped)! +- +Failed:/ {
    for (i = 1; i <= NF; i++) {
      if ($i == "Failed:")  { f += $(i + 1) }
      if ($i == "Passed:")  { p += $(i + 1) }
      if ($i == "Skipped:") { s += $(i + 1) }
    }
    projects++
  }
  END {
    if (projects == 0) { print "no test project ran" > "/dev/stderr"; exit 1 }
    printf "%d passed, %d failed, %d skipped%s\n", p, f, s, note
  }' "$log" || status=1
exit "$status"

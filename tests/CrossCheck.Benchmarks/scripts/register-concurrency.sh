#!/usr/bin/env bash
# Four processes writing into one register at once, on a PostgreSQL server and on an SQLite file on the local disk:
#  1. four `crosscheck screen` processes (one reviewer each), each screening its own copy of the same N generated
#     submissions with a comment line added (so every reference gets four rounds, recorded by four processes that race
#     for them): reviews recorded per second of wall time, and the rounds checked (none lost, none taken twice);
#  2. four register writers (tests/CrossCheck.TestTools `register-write`) recording W reviews each into one shared
#     reference, the worst case for round numbering: register writes per second, collisions run again;
#  3. the same four writers, each into a reference of its own (the usual case: no two screens record one calculation).
#     The writers' lines give each one's own recording time (without starting the process and reviewing).
# PostgreSQL: the server in CROSSCHECK_BENCH_POSTGRES (an Npgsql connection string for a user who may create
# databases), else a throwaway cluster started here (.ci/postgres.sh: Debian's postgresql, default settings, fsync on).
# Usage (repository root): tests/CrossCheck.Benchmarks/scripts/register-concurrency.sh [N] [W]
set -euo pipefail
n="${1:-60}"; w="${2:-100}"
root="$(cd "$(dirname "$0")/../../.." && pwd)"
work="$(mktemp -d)"
source "$root/.ci/postgres.sh"
trap 'pg_throwaway_stop; rm -rf "$work"' EXIT
trap 'exit 130' INT TERM

if [ -n "${CROSSCHECK_BENCH_POSTGRES:-}" ]; then
  server="$CROSSCHECK_BENCH_POSTGRES"
else
  pg_throwaway_start >/dev/null
  server="$CROSSCHECK_TEST_POSTGRES"
fi
field() { printf '%s' "$server" | tr ';' '\n' | sed -n "s/^[[:space:]]*$1[[:space:]]*=//Ip" | head -1; }
pgbin="$(ls -d /usr/lib/postgresql/*/bin | sort -V | tail -1)"
pg() { PGPASSWORD="$(field password)" "$pgbin/$1" -h "$(field host)" -p "$(field port)" -U "$(field username)" "${@:2}"; }
database() { printf '%s' "$server" | sed -E 's/(^|;)[[:space:]]*database[[:space:]]*=[^;]*//I'; printf ';Database=%s' "$1"; }

dotnet publish "$root/src/CrossCheck.Cli" -c Release -o "$work/cli" >"$work/publish.log" || { cat "$work/publish.log" >&2; exit 1; }
dotnet build "$root/tests/CrossCheck.TestTools" -c Release -o "$work/tools" >"$work/build.log" || { cat "$work/build.log" >&2; exit 1; }
cli="$work/cli/crosscheck"; tools() { dotnet "$work/tools/CrossCheck.TestTools.dll" "$@"; }
tools generate "$work/subs" "$n" 7 >/dev/null
for i in 1 2 3 4; do
  cp -r "$work/subs" "$work/copy$i"
  find "$work/copy$i" -name '*.csv' -size +0 -exec sh -c 'printf "\n# resubmitted, copy %s\n" "$1" >> "$2"' _ "$i" {} \;
done
calc="$(find "$work/subs" -maxdepth 1 -name '*.csv' -size +1k | sort | head -1)"

now() { date +%s%N; }
echo "register concurrency: 4 processes; $n submissions per screen, $w writes per writer; $(nproc) cores, load $(cut -d' ' -f1-3 /proc/loadavg)"
echo "PostgreSQL $("$pgbin/postgres" --version | awk '{print $3}'); SQLite on $(df -T "$work" | awk 'NR==2 {print $2}') at $work"
for backend in postgresql sqlite; do
  for test in screens writers distinct; do
    if [ "$backend" = postgresql ]; then
      db="cc_bench_${test}_$$"; pg createdb "$db"; reg="$(database "$db")"
    else
      reg="$work/$test.db"
    fi
    s=$(now)
    pids=()
    for i in 1 2 3 4; do
      if [ "$test" = screens ]; then
        "$cli" screen "$work/copy$i" --out "$work/out-$backend-$i" --register "$reg" --jobs 1 --date 2026-12-01 --quiet >"$work/$backend-$test-$i.log" 2>&1 &
      else
        tag=SHARED; [ "$test" = distinct ] && tag="OWN-$i"
        tools register-write "$reg" "$calc" "$w" "$tag" >"$work/$backend-$test-$i.log" 2>&1 &
      fi
      pids+=($!)
    done
    for p in "${pids[@]}"; do wait "$p" || true; done
    e=$(now); ms=$(( (e - s) / 1000000 ))
    stats="$(tools register-stats "$reg" || true)"
    reviews="$(echo "$stats" | awk '/^reviews/ {print $2}')"
    extra=""
    [ "$test" != screens ] && extra="; run again after a collision: $(cat "$work/$backend-$test-"*.log | sed -n 's/.*(\([0-9]*\) run again.*/\1/p' | awk '{s += $1} END {print s + 0}'); each writer: $(sed -n 's/recorded [0-9]* in \([0-9.]*\) s.*/\1 s/p' "$work/$backend-$test-"*.log | paste -sd' ')"
    awk -v b="$backend" -v t="$test" -v r="$reviews" -v ms="$ms" -v x="$extra" 'BEGIN {
      printf "%-10s %-8s %5d reviews in %6.2f s = %6.1f reviews/s%s\n", b, t, r, ms / 1000, r / (ms / 1000), x }'
    echo "           $stats" | head -3
    if [ "$backend" = postgresql ]; then pg dropdb "$db"; fi
  done
done

#!/usr/bin/env bash
# Review of building frames against `solve` of the same submission, whole process. Each frame is an invented office
# block (tests/CrossCheck.TestTools `building`: 300, 1,000 and 5,000 members, two cases) whose claims carry one planted
# mistake: one beam's fixed-end moments taken as wL²/8 instead of wL²/12. Both builds (native ahead-of-time and
# framework-dependent portable) are timed, runs alternating so that they see the same background load, with GNU time
# for the wall time and the peak resident memory. Prints medians and the ratio review / solve (targets: at most 10x
# at every size; at most 3 s and 400 MB at 5,000 members with the native build), then the diagnosis's hypotheses tried,
# focused and (with EXHAUSTIVE=1, slow at 5,000 members) exhaustive: every hypothesis the diagnosis formed before it
# searched where the evidence is.
# Usage (repository root): tests/CrossCheck.Benchmarks/scripts/review-scale.sh [RUNS] [SIZE...]   (needs clang, zlib1g-dev)
set -euo pipefail
runs="${1:-5}"
shift || true
sizes=("$@")
[ "${#sizes[@]}" -gt 0 ] || sizes=(300 1000 5000)
root="$(cd "$(dirname "$0")/../../.." && pwd)"
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
rid="linux-$(uname -m | sed 's/x86_64/x64/; s/aarch64/arm64/')"
command -v /usr/bin/time >/dev/null || { echo "needs GNU time (apt-get install time)" >&2; exit 1; }

dotnet publish "$root/src/CrossCheck.Cli" -c Release -o "$work/jit" > "$work/publish.log" || { cat "$work/publish.log" >&2; echo "publish failed" >&2; exit 1; }
dotnet publish "$root/src/CrossCheck.Cli" -c Release -r "$rid" -p:PublishAot=true -o "$work/native" > "$work/publish.log" || { cat "$work/publish.log" >&2; echo "publish failed" >&2; exit 1; }
dotnet build -c Release "$root/tests/CrossCheck.Benchmarks" > "$work/build.log" || { cat "$work/build.log" >&2; echo "build failed" >&2; exit 1; }
for n in "${sizes[@]}"; do
  dotnet run -c Release --project "$root/tests/CrossCheck.TestTools" -- building "$work/frame-$n.csv" "$n" fem 1
done

# One run: prints "milliseconds kilobytes" (exit code 1 is a review with comments, which is what these frames get).
run() { /usr/bin/time -f "%e %M" -o "$work/time.txt" "$@" >/dev/null 2>&1 || true; tail -n 1 "$work/time.txt" | awk '{printf "%d %d\n", $1 * 1000, $2}'; }
median() { printf '%s\n' "$@" | sort -n | awk '{a[NR]=$1} END {print a[int((NR+1)/2)]}'; }
echo "runs: $runs per contestant, machine: $(nproc) cores, load $(cut -d' ' -f1-3 /proc/loadavg)"
printf '%-8s %-7s %12s %12s %12s %12s %10s\n' members build "solve ms" "review ms" "solve MB" "review MB" "ratio"
for n in "${sizes[@]}"; do
  declare -A t=() m=()
  for i in $(seq 1 "$runs"); do
    for build in native jit; do
      bin="$work/$build/crosscheck"
      read -r ms kb < <(run "$bin" solve "$work/frame-$n.csv" --format csv --out "$work/solve-$build.csv"); t[$build-solve]+="$ms "; m[$build-solve]+="$kb "
      read -r ms kb < <(run "$bin" review "$work/frame-$n.csv" --date 2026-12-01 --quiet --out "$work/review-$build.md"); t[$build-review]+="$ms "; m[$build-review]+="$kb "
    done
  done
  cmp -s "$work/review-native.md" "$work/review-jit.md" || { echo "the native and JIT builds wrote different memos" >&2; exit 1; }
  for build in native jit; do
    # shellcheck disable=SC2086
    S=$(median ${t[$build-solve]}); R=$(median ${t[$build-review]}); SM=$(median ${m[$build-solve]}); RM=$(median ${m[$build-review]})
    awk -v n="$n" -v b="$build" -v s="$S" -v r="$R" -v sm="$SM" -v rm="$RM" \
      'BEGIN { printf "%-8s %-7s %12d %12d %12.0f %12.0f %9.1fx\n", n, b, s, r, sm / 1024, rm / 1024, r / s }'
  done
  unset t m
done
for n in "${sizes[@]}"; do
  dotnet "$root/tests/CrossCheck.Benchmarks/bin/Release/net10.0/CrossCheck.Benchmarks.dll" hypotheses "$work/frame-$n.csv" ${EXHAUSTIVE:+exhaustive}
done

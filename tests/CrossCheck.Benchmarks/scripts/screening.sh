#!/usr/bin/env bash
# Screening throughput against invoking `crosscheck review` once per submission (target: at least 10x), for both
# builds: framework-dependent (JIT) and native ahead-of-time compiled (needs clang). Generates N invented
# submissions (default 1000; mixed correct, wrong and broken, see tests/CrossCheck.TestTools), screens them all in
# one process, and reviews them one process each (an HTML memo per submission, as `screen` writes). Per-process
# reviews run over the first SAMPLE submissions (default 200) and are reported as a rate.
# Usage (repository root): tests/CrossCheck.Benchmarks/scripts/screening.sh [N] [SAMPLE]
set -euo pipefail
n="${1:-1000}"; sample="${2:-200}"
root="$(cd "$(dirname "$0")/../../.." && pwd)"
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
rid="linux-$(uname -m | sed 's/x86_64/x64/; s/aarch64/arm64/')"

dotnet publish "$root/src/CrossCheck.Cli" -c Release -o "$work/jit" > "$work/publish.log" || { cat "$work/publish.log" >&2; echo "publish failed" >&2; exit 1; }
dotnet publish "$root/src/CrossCheck.Cli" -c Release -r "$rid" -p:PublishAot=true -o "$work/native" > "$work/publish.log" || { cat "$work/publish.log" >&2; echo "publish failed" >&2; exit 1; }
dotnet run -c Release --project "$root/tests/CrossCheck.TestTools" -- generate "$work/subs" "$n" 1 >/dev/null
mapfile -t subs < <(find "$work/subs" -mindepth 1 -maxdepth 1 | sort | head -n "$sample")
total=$(find "$work/subs" -mindepth 1 -maxdepth 1 | wc -l)

now() { date +%s%N; }
echo "submissions: $total generated, per-process sample: ${#subs[@]}; machine: $(nproc) cores, load $(cut -d' ' -f1-3 /proc/loadavg)"
for build in jit native; do
  bin="$work/$build/crosscheck"
  s=$(now)
  "$bin" screen "$work/subs" --out "$work/screen-$build" --register "$work/$build.db" --date 2026-12-01 --quiet >/dev/null || true
  e=$(now); screen_ms=$(( (e - s) / 1000000 ))
  mkdir -p "$work/each-$build"
  s=$(now)
  for sub in "${subs[@]}"; do
    "$bin" review "$sub" --format html --date 2026-12-01 --quiet --out "$work/each-$build/$(basename "$sub").html" >/dev/null 2>&1 || true
  done
  e=$(now); each_ms=$(( (e - s) / 1000000 ))
  awk -v b="$build" -v t="$total" -v sm="$screen_ms" -v k="${#subs[@]}" -v em="$each_ms" 'BEGIN {
    rs = t / (sm / 1000); re = k / (em / 1000)
    printf "%-7s screen: %d submissions in %.1f s (%.1f per second); review per process: %.1f per second; ratio %.1fx\n", b, t, sm / 1000, rs, re, rs / re }'
done

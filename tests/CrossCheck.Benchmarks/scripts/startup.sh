#!/usr/bin/env bash
# Review start-up against the runtime's own floor: a trivial console program, run on the same machine in the same
# loop. Both are measured as shipped: framework-dependent and portable (JIT only, the `dotnet publish` default, what
# `dotnet run` and the tool's portable package give), framework-dependent for this platform (the tool's linux-x64
# package: ReadyToRun code, `dotnet publish -r RID`), and native ahead-of-time compiled (`-p:PublishAot=true`, needs
# clang). The review is of a typical 21-member frame submission (tests/CrossCheck.Benchmarks/fixtures/office-frame-21.csv),
# written as JSON. Prints medians and ratios (target: review within 2x the floor).
# Usage: tests/CrossCheck.Benchmarks/scripts/startup.sh [runs]   (from the repository root)
set -euo pipefail
runs="${1:-20}"
root="$(cd "$(dirname "$0")/../../.." && pwd)"
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
rid="linux-$(uname -m | sed 's/x86_64/x64/; s/aarch64/arm64/')"

dotnet publish "$root/src/CrossCheck.Cli" -c Release -o "$work/cc" > "$work/publish.log" || { cat "$work/publish.log" >&2; echo "publish failed" >&2; exit 1; }
dotnet publish "$root/src/CrossCheck.Cli" -c Release -r "$rid" -o "$work/cc-r2r" > "$work/publish.log" || { cat "$work/publish.log" >&2; echo "publish failed" >&2; exit 1; }
dotnet publish "$root/src/CrossCheck.Cli" -c Release -r "$rid" -p:PublishAot=true -o "$work/cc-native" > "$work/publish.log" || { cat "$work/publish.log" >&2; echo "publish failed" >&2; exit 1; }
mkdir -p "$work/hello-src"
cat > "$work/hello-src/hello.csproj" <<'PROJ'
<Project Sdk="Microsoft.NET.Sdk">
  <PropertyGroup>
    <OutputType>Exe</OutputType>
    <TargetFramework>net10.0</TargetFramework>
    <ImplicitUsings>enable</ImplicitUsings>
    <InvariantGlobalization>true</InvariantGlobalization>
  </PropertyGroup>
</Project>
PROJ
echo 'Console.WriteLine("hello");' > "$work/hello-src/Program.cs"
# Built outside the repository so that its build settings do not apply.
(cd "$work/hello-src" && dotnet publish -c Release -o "$work/hello" >/dev/null \
  && dotnet publish -c Release -r "$rid" -p:PublishAot=true -o "$work/hello-native" >/dev/null)

demo="$root/tests/CrossCheck.Benchmarks/fixtures/office-frame-21.csv"
ms() { local s e; s=$(date +%s%N); "$@" >/dev/null 2>&1 || true; e=$(date +%s%N); echo $(( (e - s) / 1000000 )); }
h=(); hn=(); r=(); rr=(); rn=()
for i in $(seq 1 "$runs"); do
  h+=("$(ms "$work/hello/hello")")
  hn+=("$(ms "$work/hello-native/hello")")
  r+=("$(ms "$work/cc/crosscheck" review "$demo" --format json --out "$work/r.json" --quiet)")
  rr+=("$(ms "$work/cc-r2r/crosscheck" review "$demo" --format json --out "$work/rr.json" --quiet)")
  rn+=("$(ms "$work/cc-native/crosscheck" review "$demo" --format json --out "$work/rn.json" --quiet)")
done
cmp -s "$work/r.json" "$work/rn.json" || { echo "the native and JIT builds wrote different reviews" >&2; exit 1; }
cmp -s "$work/r.json" "$work/rr.json" || { echo "the ReadyToRun and JIT builds wrote different reviews" >&2; exit 1; }
median() { printf '%s\n' "$@" | sort -n | awk '{a[NR]=$1} END {print a[int((NR+1)/2)]}'; }
H=$(median "${h[@]}"); HN=$(median "${hn[@]}"); R=$(median "${r[@]}"); RR=$(median "${rr[@]}"); RN=$(median "${rn[@]}")
echo "runs: $runs, machine: $(nproc) cores, load $(cut -d' ' -f1-3 /proc/loadavg)"
echo "trivial console, framework-dependent (the runtime's floor): median ${H} ms"
echo "trivial console, native AOT:                              median ${HN} ms"
echo "crosscheck review, framework-dependent, portable (JIT):   median ${R} ms"
echo "crosscheck review, framework-dependent, ReadyToRun:       median ${RR} ms"
echo "crosscheck review, native AOT:                            median ${RN} ms"
awk -v r="$R" -v rr="$RR" -v rn="$RN" -v h="$H" -v hn="$HN" 'BEGIN {
  printf "ratio review (portable) / floor:            %.2f\n", r / h
  printf "ratio review (ReadyToRun) / floor:          %.2f\n", rr / h
  printf "ratio review (ReadyToRun) / (portable):     %.2f\n", rr / r
  printf "ratio review (native AOT) / floor:          %.2f\n", rn / h
  printf "ratio review (native AOT) / native trivial: %.2f\n", rn / hn }'

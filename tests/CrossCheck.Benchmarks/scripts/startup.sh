#!/usr/bin/env bash
# Review start-up against the runtime's own floor: a trivial console program built the same way, run on the same
# machine in the same loop. Prints the median wall time of each and the ratio (target: review within 2x the floor).
# Usage: tests/CrossCheck.Benchmarks/scripts/startup.sh [runs]   (from the repository root)
set -euo pipefail
runs="${1:-20}"
root="$(cd "$(dirname "$0")/../../.." && pwd)"
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT

dotnet publish "$root/src/CrossCheck.Cli" -c Release -o "$work/cc" >/dev/null
mkdir -p "$work/hello-src"
cat > "$work/hello-src/hello.csproj" <<'PROJ'
<Project Sdk="Microsoft.NET.Sdk">
  <PropertyGroup>
    <OutputType>Exe</OutputType>
    <TargetFramework>net10.0</TargetFramework>
    <ImplicitUsings>enable</ImplicitUsings>
  </PropertyGroup>
</Project>
PROJ
echo 'Console.WriteLine("hello");' > "$work/hello-src/Program.cs"
# Built outside the repository so that its build settings do not apply.
(cd "$work/hello-src" && dotnet publish -c Release -o "$work/hello" >/dev/null)

demo="$root/fixtures/demo/footbridge.csv"
ms() { local s e; s=$(date +%s%N); "$@" >/dev/null 2>&1 || true; e=$(date +%s%N); echo $(( (e - s) / 1000000 )); }
review=(); hello=()
for i in $(seq 1 "$runs"); do
  hello+=("$(ms "$work/hello/hello")")
  review+=("$(ms "$work/cc/crosscheck" review "$demo" --format json --quiet)")
done
median() { printf '%s\n' "$@" | sort -n | awk '{a[NR]=$1} END {print a[int((NR+1)/2)]}'; }
h=$(median "${hello[@]}"); r=$(median "${review[@]}")
echo "runs: $runs"
echo "trivial console program: median ${h} ms"
echo "crosscheck review (20-member class demo, json): median ${r} ms"
awk -v r="$r" -v h="$h" 'BEGIN { printf "ratio review / floor: %.2f\n", r / h }'

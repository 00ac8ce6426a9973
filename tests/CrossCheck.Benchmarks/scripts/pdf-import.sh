#!/usr/bin/env bash
# PDF import against poppler's `pdftotext -layout` on the same multi-page calc package (whole processes, same
# machine, alternating runs). Builds an invented 20-storey x 5-bay frame calc (HTML printed by headless chromium),
# then prints the median of each and the ratios (target: CrossCheck within 3x), for CrossCheck built framework-dependent
# (JIT, the `dotnet publish` default) and native ahead-of-time compiled (`-p:PublishAot=true`).
# Needs: chromium, poppler-utils, clang (for the native build). Usage (repository root): tests/CrossCheck.Benchmarks/scripts/pdf-import.sh [runs]
set -euo pipefail
runs="${1:-7}"
root="$(cd "$(dirname "$0")/../../.." && pwd)"
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
command -v chromium >/dev/null && command -v pdftotext >/dev/null || { echo "needs chromium and poppler-utils" >&2; exit 2; }

python3 - "$work/calc.html" <<'PY'
import sys
storeys, bays, cases = 20, 5, 4
rows = []
def table(caption, header, body):
    h = "".join(f"<th>{c}</th>" for c in header)
    b = "\n".join("<tr>" + "".join(f"<td>{c}</td>" for c in r) + "</tr>" for r in body)
    return f"<p class='cap'>{caption}</p><table><tr>{h}</tr>\n{b}\n</table>"
joints = [(f"J{i}_{j}", 6*i, 3.5*j, "fixed" if j == 0 else "free") for i in range(bays+1) for j in range(storeys+1)]
members = [(f"C{i}_{j}", f"J{i}_{j-1}", f"J{i}_{j}", 210, 300) for i in range(bays+1) for j in range(1, storeys+1)]
members += [(f"B{i}_{j}", f"J{i-1}_{j}", f"J{i}_{j}", 210, 450) for i in range(1, bays+1) for j in range(1, storeys+1)]
loads = [(c, m[0], "udl", 18 + c) for c in range(1, cases+1) for m in members if m[0].startswith("B")]
moments = [(c, m[0], m[1 + k], f"{(-1)**k * (10 + (hash((c, m[0], k)) % 900) / 10):.1f}") for c in range(1, cases+1) for m in members for k in (0, 1)]
html = f"""<!DOCTYPE html><html><head><meta charset='utf-8'><style>
@page {{ size: A4; margin: 16mm; }} body {{ font-family: 'DejaVu Sans'; font-size: 9pt; }}
table {{ border-collapse: collapse; }} th {{ border-bottom: 0.8pt solid #000; padding: 1mm 3mm; }} td {{ padding: 0.5mm 3mm; text-align: right; }}
.cap {{ font-style: italic; margin-top: 4mm; }}</style></head><body>
<h1>Office block frame, grid C (fictional benchmark calc)</h1>
<p>Project: Benchmark frame (invented)</p><p>Job No.: BENCH-01</p><p>Units: kN, m unless noted otherwise.</p>
{table("Table 1 - Joints", ["Joint", "x [m]", "y [m]", "Restraint"], joints)}
{table("Table 2 - Members", ["Member", "Start", "End", "E [GPa]", "I [10^6 mm^4]"], members)}
{table("Table 3 - Loads", ["Case", "On", "Kind", "w [kN/m]"], loads)}
{table("Table 4 - End moments", ["Case", "Member", "At", "Moment [kN·m]"], moments)}
</body></html>"""
open(sys.argv[1], "w").write(html)
PY
chromium --headless --no-sandbox --disable-gpu --no-pdf-header-footer --disable-background-networking --disable-component-update \
  --disable-sync --no-first-run --user-data-dir="$work/profile" --print-to-pdf="$work/calc.pdf" "$work/calc.html" 2>/dev/null
pages=$(pdfinfo "$work/calc.pdf" 2>/dev/null | awk '/^Pages:/ {print $2}')
rid="linux-$(uname -m | sed 's/x86_64/x64/; s/aarch64/arm64/')"
dotnet publish "$root/src/CrossCheck.Cli" -c Release -o "$work/cc" > "$work/publish.log" || { cat "$work/publish.log" >&2; echo "publish failed" >&2; exit 1; }
dotnet publish "$root/src/CrossCheck.Cli" -c Release -r "$rid" -p:PublishAot=true -o "$work/cc-native" > "$work/publish.log" || { cat "$work/publish.log" >&2; echo "publish failed" >&2; exit 1; }

ms() { local s e; s=$(date +%s%N); "$@" >/dev/null 2>&1 || true; e=$(date +%s%N); echo $(( (e - s) / 1000000 )); }
cc=(); cn=(); pt=()
for i in $(seq 1 "$runs"); do
  pt+=("$(ms pdftotext -layout "$work/calc.pdf" "$work/out.txt")")
  cc+=("$(ms "$work/cc/crosscheck" extract "$work/calc.pdf" --out "$work/tables-$i")")
  cn+=("$(ms "$work/cc-native/crosscheck" extract "$work/calc.pdf" --out "$work/tables-native-$i")")
done
diff -r "$work/tables-1" "$work/tables-native-1" >/dev/null || { echo "the native and JIT builds read different tables" >&2; exit 1; }
median() { printf '%s\n' "$@" | sort -n | awk '{a[NR]=$1} END {print a[int((NR+1)/2)]}'; }
p=$(median "${pt[@]}"); c=$(median "${cc[@]}"); n=$(median "${cn[@]}")
echo "calc package: $pages pages; runs: $runs; machine: $(nproc) cores, load $(cut -d' ' -f1-3 /proc/loadavg)"
echo "pdftotext -layout:                        median ${p} ms"
echo "crosscheck extract, framework-dependent:  median ${c} ms"
echo "crosscheck extract, native AOT:           median ${n} ms"
awk -v c="$c" -v n="$n" -v p="$p" 'BEGIN {
  printf "ratio crosscheck (framework-dependent) / pdftotext: %.2f\n", c / p
  printf "ratio crosscheck (native AOT) / pdftotext:          %.2f\n", n / p }'

#!/usr/bin/env bash
# A fresh round of hostile inputs (issue 19): makes them from a variant number in a temporary folder (special files, links, encodings,
# huge and odd values, terminal escapes, injection strings, mechanisms, submissions over their time budget, outputs that name
# inputs or devices, damaged registers, odd models, interrupted screens), runs each through the command line as its own
# process, and prints the counts per category: tried / clear error / reviewed as it should be / crash / hang / wrong
# acceptance / overwrite / other. Exits 1 if any lands in crash, hang, wrong acceptance or overwrite.
# Usage: tests/CrossCheck.Benchmarks/scripts/hostile.sh [VARIANT]   (needs mkfifo and kill from coreutils/procps)
set -euo pipefail
cd "$(dirname "$0")/../../.."
variant="${1:-$RANDOM}"
dotnet build src/CrossCheck.Cli -c Release -v q -nologo >/dev/null
dotnet build tests/CrossCheck.TestTools -c Release -v q -nologo >/dev/null
dotnet tests/CrossCheck.TestTools/bin/Release/net10.0/CrossCheck.TestTools.dll hostile src/CrossCheck.Cli/bin/Release/net10.0/crosscheck.dll "$variant"

#!/bin/sh
# Solves every file of ../shared/data/mps-public (netlib LP and MIPLIB 3
# problems with published optima) with rigmix's engine and with CBC
# (single thread, `cbc FILE -threads 1 -solve -quit`) in the same run and
# prints a Markdown table. Needs ../shared/data/mps-public next to the
# repository and cbc on PATH (otherwise only our times are printed).
# Usage: optimizer/mip/bench-mps.sh [-mps.sec 300]   (time limit per file and solver)
set -eu
cd "$(dirname "$0")"
exec go test -run '^TestMPSPublicBenchmark$' -count=1 -timeout 0 . -args -mps.bench "$@"

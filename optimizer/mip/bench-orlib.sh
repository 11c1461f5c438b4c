#!/bin/sh
# Solves OR-Library set-covering sets 4, 5, 6, A, B, C and D with rigmix's
# MIP engine and with CBC (single thread) and prints per-instance and
# total times. Needs ../shared/data/orlib-scp next to the repository and
# cbc on PATH (otherwise only our times are printed).
# Usage: optimizer/mip/bench-orlib.sh [-orlib.only scp41,scpd1]
set -eu
cd "$(dirname "$0")"
exec go test -v -run '^TestORLibBenchmark$' -count=1 -timeout 0 . -args -orlib.bench "$@"

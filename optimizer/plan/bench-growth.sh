#!/usr/bin/env bash
# How each stage before the search grows with the site: runs
# BenchmarkPrepareGrowth (generated sites of 1, 10, 100 and 1,000 acres and
# corridors of 2 and 20 miles, invented by scenarios/sitegen) and prints, per
# stage, its time and the growth exponent k in t ∝ n^k between successive
# sizes, n being the number of candidate points. n log n shows as k a little
# above 1; a quadratic step as k near 2.
#
#   bash optimizer/plan/bench-growth.sh            # -benchtime 3x
#   BENCHTIME=10x bash optimizer/plan/bench-growth.sh
set -euo pipefail
cd "$(dirname "$0")/../.."
out=$(go test -run '^$' -bench 'BenchmarkPrepareGrowth' -benchtime "${BENCHTIME:-3x}" ./optimizer/plan 2>/dev/null)
python3 - "$out" <<'PY'
import math, re, sys
# The in-process plugin harness logs lines that can land inside a
# benchmark's result line; drop them, which joins the line again.
text = re.sub(r'\d{4}-\d\d-\d\dT[^\n]*\n', '', sys.argv[1])
rows = []
for line in text.splitlines():
    if not line.startswith('BenchmarkPrepareGrowth/'):
        continue
    name = re.match(r'BenchmarkPrepareGrowth/(\S+?)-\d+\s', line).group(1)
    m = dict((u, float(v)) for v, u in re.findall(r'\s(\d[0-9.e+]*)\s+(\S+)', line))
    rows.append((name, m))
stages = ["cand-ms", "rigcalls-ms", "cover-ms", "model-ms", "presolve-ms"]
print("%-11s %7s %7s %8s" % ("site", "cands", "cover", "model") + "".join(" %14s" % s[:-3] for s in stages))
print("%-11s %7s %7s %8s" % ("", "", "rows", "rows") + "".join(" %14s" % "ms (k)" for s in stages))
for group in (["acres="], ["miles="]):
    prev = None
    for name, m in rows:
        if not name.startswith(group[0]):
            continue
        cells = []
        for s in stages:
            k = ""
            if prev is not None and prev["candidates"] != m["candidates"] and prev[s] > 0:
                k = "(%.2f)" % (math.log(m[s] / prev[s]) / math.log(m["candidates"] / prev["candidates"]))
            cells.append("%7.1f %6s" % (m[s], k))
        print("%-11s %7d %7d %8d" % (name.replace("=", " "), m["candidates"], m["cover-rows"], m["model-rows"]) + "".join(" %14s" % c for c in cells))
        prev = m
PY

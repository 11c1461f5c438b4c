#!/usr/bin/env bash
# Whole-plan scale run: invented sites of 1, 10, 100 and 1,000 acres and a
# 20-mile corridor (rigmix gen-site), each planned by rigmix with stage
# timings and peak memory, and its exported model solved by CBC single
# thread in the same run (CBC_SEC caps CBC's seconds, default 600), and the
# saving of each plan over its hand-laid grid. Prints one table. Needs cbc
# (Debian coinor-cbc) and /usr/bin/time (Debian time).
#
#   bash optimizer/plan/bench-scale.sh [sizes...]   # default: 1 10 100 1000 corridor
#   RIGMIX_BIN=/path/to/rigmix bash optimizer/plan/bench-scale.sh   # measure a built binary
set -euo pipefail
cd "$(dirname "$0")/../.."
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
if [ -n "${RIGMIX_BIN:-}" ]; then cp "$RIGMIX_BIN" "$work/rigmix"; else go build -o "$work/rigmix" ./cmd/rigmix; fi
sizes=("$@")
[ ${#sizes[@]} -gt 0 ] || sizes=(1 10 100 1000 corridor)

printf '%-10s %7s %13s %13s %5s %9s %8s %8s %8s %9s %8s %7s %14s %12s %10s\n' \
  site cands "rows×cols" "presolved" pts "total s" "solve s" "peak MB" gap "cbc s" ratio "cbc ok" "obj diff" "grid saving" "days saved"
for s in "${sizes[@]}"; do
  if [ "$s" = corridor ]; then
    "$work/rigmix" gen-site --miles 20 --seed 1 > "$work/site.yaml"; name="20 mi"
  else
    "$work/rigmix" gen-site --acres "$s" --seed 1 > "$work/site.yaml"; name="$s ac"
  fi
  /usr/bin/time -f '%e %M' -o "$work/time" "$work/rigmix" plan "$work/site.yaml" --quiet --timings \
    --json "$work/plan.json" --model-mps "$work/model.mps" 2> "$work/timings" || true
  read -r wall kb < <(tail -1 "$work/time")
  # The solve column counts the start solution (zone covers) and the
  # search: both are the solver's work on the model.
  solve=$(awk '/^  (solve|start solution) /{print $NF}' "$work/timings" | tr '\n' ' ')
  gap=$(python3 -c "import json;print('%.3f%%'%(100*json.load(open('$work/plan.json'))['solver']['gap']))" 2>/dev/null || echo "-")
  obj=$(python3 -c "import json;print(json.load(open('$work/plan.json'))['solver']['objective'])" 2>/dev/null || echo nan)
  cands=$(python3 -c "import json;print(json.load(open('$work/plan.json'))['solver']['candidates'])" 2>/dev/null || echo -)
  pts=$(python3 -c "import json;print(len(json.load(open('$work/plan.json'))['points']))" 2>/dev/null || echo -)
  size=$(awk '/model .* rows/{print $2"×"$5, $9"×"$11}' "$work/timings")
  start=$(date +%s.%N)
  # CBC is asked for the same relative gap the scenario asks of rigmix (1%).
  cbc "$work/model.mps" -threads 1 -ratioGap 0.01 -sec "${CBC_SEC:-600}" -solve -quit > "$work/cbc.log" 2>&1 || true
  end=$(date +%s.%N)
  cbct=$(python3 -c "print('%.2f'%($end-$start))")
  cbcobj=$(awk '/^Objective value:/{print $3}' "$work/cbc.log")
  cbcok=$(grep -q 'Optimal solution found' "$work/cbc.log" && echo yes || echo no)
  solve_s=$(python3 -c "
import re
s='$solve'  # a Go duration as printed: 230ms, 4.88s, 1m0.038s
v=0.0
for n,u in re.findall(r'([0-9.]+)(ms|h|m|s)', s):
    v+=float(n)*{'ms':1e-3,'s':1,'m':60,'h':3600}[u]
print('%.2f'%v)")
  ratio=$(python3 -c "print('%.1f'%($solve_s/max(1e-3,$cbct)))")
  diff=$(python3 -c "a=float('$obj'); b=float('${cbcobj:-nan}'); print('%+.4f%%'%(100*(a-b)/max(1,abs(b))))")
  # The hand-laid grid (plan.Baseline): the saving of the optimized plan.
  read -r save days < <(python3 -c "
import json
b=json.load(open('$work/plan.json')).get('hand_grid_baseline') or {}
print('%.1f%%'%b['saving_percent'] if b else '-', b.get('field_days_saved','-'))" 2>/dev/null || echo "- -")
  printf '%-10s %7s %13s %13s %5s %9s %8s %8d %8s %9s %8s %7s %14s %12s %10s\n' \
    "$name" "$cands" ${size:-- -} "$pts" "$wall" "$solve_s" $((kb/1024)) "$gap" "$cbct" "$ratio" "$cbcok" "$diff" "$save" "$days"
done

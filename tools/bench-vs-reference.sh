#!/usr/bin/env bash
# Interleaves an outside C reference kernel (optional, not part of this repository: the script named by
# REFERENCE_KERNEL, called as SCRIPT NX NY THREADS SECONDS PRECISION and printing mcells=RATE) with `evanesce bench` on the
# same grid and thread count, round after round, and prints each round's rates and ratio and the
# median ratio. Interleaving matters on shared machines, whose speed drifts by tens of percent
# within minutes; compare only rounds taken together.
# Usage: REFERENCE_KERNEL=path/to/run-reference.sh tools/bench-vs-reference.sh N THREADS [ROUNDS=5] [PRECISION=float]
#        (build the jar first)
set -euo pipefail
here="$(cd "$(dirname "$0")/.." && pwd)"
n=${1:?grid size N}; t=${2:?threads}; rounds=${3:-5}; prec=${4:-float}
ref="${REFERENCE_KERNEL:-}"
[[ -n "$ref" ]] || { echo "bench-vs-reference: set REFERENCE_KERNEL to the C reference kernel's run script (an optional outside tool)" >&2; exit 2; }
[[ -f "$ref" ]] || { echo "bench-vs-reference: REFERENCE_KERNEL=$ref not found" >&2; exit 2; }
ratios=()
for r in $(seq "$rounds"); do
    c=$(bash "$ref" "$n" "$n" "$t" 2 "$prec" | grep -o 'mcells=[0-9.]*' | cut -d= -f2)
    j=$("$here/evanesce" bench --size "$n" --threads "$t" --precision "$prec" --csv 2>/dev/null \
        | awk -F, 'NR==1 {for (i = 1; i <= NF; i++) if ($i == "mcells_per_s") col = i} NR==2 {print $col}')
    ratio=$(awk -v j="$j" -v c="$c" 'BEGIN {printf "%.3f", j / c}')
    ratios+=("$ratio")
    echo "round $r: N=$n threads=$t $prec  C ${c} Mcell/s  evanesce ${j} Mcell/s  ratio ${ratio}"
done
printf '%s\n' "${ratios[@]}" | sort -n | awk '{a[NR] = $1} END {m = (NR % 2) ? a[(NR + 1) / 2] : (a[NR / 2] + a[NR / 2 + 1]) / 2;
    printf "median ratio %.3f (min %.3f, max %.3f, %d rounds)\n", m, a[1], a[NR], NR}'

#!/usr/bin/env bash
# How the energy fraction of `until: {energy_below: F, latest: T}` changes T and R: runs a case at
# F = 1e-3 ... 1e-7 and at 1e-9 (taken as converged) with a latest time long enough for each, and prints
# the largest change of T and R over the case's flux wavelengths against the 1e-9 run, the energy left
# and the steps. This is the measurement behind StopSpec.DEFAULT_ENERGY_FRACTION (docs/case-file.md, `until`).
#   tools/energy-fraction-study.sh cases/two-prism-attenuator-beam.yaml [WORKDIR]
# The case must have a flux section and an `until:` line of its own; a copy with that line replaced
# is run, the case itself is not touched. Needs the jar built (mvn -B -q -DskipTests package).
set -euo pipefail

case_file=${1:?usage: $0 CASE [WORKDIR]}
root="$(cd "$(dirname "$(readlink -f "${BASH_SOURCE[0]}")")/.." && pwd)"
work=${2:-$(mktemp -d)}
mkdir -p "$work"
name=$(basename "$case_file" .yaml)
study="$work/$name-fraction.yaml"
grep -q '^until:' "$case_file" || { echo "$case_file has no 'until:' line of its own" >&2; exit 2; }
sed -e 's/^until:.*/until: {energy_below: frac, latest: 3 ps}/' -e 's/^parameters:/parameters:\n  frac: 1e-5/' \
    "$case_file" > "$study"

fractions="1e-3 1e-4 1e-5 1e-6 1e-7 1e-9"
for f in $fractions; do
    "$root/evanesce" run "$study" --set "frac=$f" --out "$work/$name-$f" --force --progress-seconds 600 \
        > "$work/$name-$f.log" 2>&1 || { echo "the run at $f failed; see $work/$name-$f.log" >&2; exit 1; }
done

# column of a named field in a flux.csv header
col() { head -1 "$1" | tr ',' '\n' | grep -nx "$2" | cut -d: -f1; }
ref="$work/$name-1e-9/flux.csv"
tc=$(col "$ref" T_transmitted); rc=$(col "$ref" R_reflected)
printf '%-8s %-12s %-12s %-12s %s\n' fraction energy_left max_dT max_dR steps
for f in $fractions; do
    d="$work/$name-$f"
    left=$(grep -o '"energy_fraction" *: *[^,}]*' "$d/summary.json" | head -1 | sed 's/.*: *//')
    steps=$(grep -o '"steps" *: *[0-9]*' "$d/run.json" | head -1 | sed 's/.*: *//')
    paste -d, "$d/flux.csv" "$ref" | awk -F, -v t="$tc" -v r="$rc" -v n="$(head -1 "$ref" | tr ',' '\n' | wc -l)" \
        -v f="$f" -v left="$left" -v steps="$steps" 'NR > 1 {
            dt = $t - $(t + n); if (dt < 0) dt = -dt; if (dt > mt) mt = dt
            dr = $r - $(r + n); if (dr < 0) dr = -dr; if (dr > mr) mr = dr }
        END { printf "%-8s %-12.3g %-12.2g %-12.2g %s\n", f, left, mt, mr, steps }'
done
echo "results under $work"

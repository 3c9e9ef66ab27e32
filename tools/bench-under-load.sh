#!/usr/bin/env bash
# Measures evanesce with one thread and with the default thread count (all cores) while competing
# busy processes hold the cores, and prints both rates and their ratio (default / one thread) for
# each round and the median ratio. The solver is meant to be never slower with the default than
# with one thread, on a quiet machine or a busy one.
#
# Usage: tools/bench-under-load.sh [--busy K] [--rounds R] [--size N] [--seconds S] [--warm-up W]
#                                  [--case FILE [--set name=value]...]       (build the jar first)
#   --busy K     competing busy processes, each `yes > /dev/null` (one core's worth of work each);
#                default: one per core (nproc); 0 measures the quiet machine the same way
#   --rounds R   rounds (default 3), each in a fresh JVM
#   --size N     the bench grid, N x N (default 1024). Each round is one `evanesce bench
#                --interleave` of one thread and all cores: both warmed up (at least W seconds
#                each, default 2: on a busy machine the JIT compiler itself gets little time),
#                then 9 timed repeats of each in turn, S seconds per case in all (default 6), so
#                that the machine's drift reaches both alike; the rates are the medians.
#   --case FILE  run this case file instead, one thread then the default, each its own
#                `evanesce run` into a temporary folder removed afterwards, and take the rates
#                from the runs' 'done:' lines; --set passes overrides
# The busy processes are stopped by their process ids when the script ends, however it ends.
set -euo pipefail
here="$(cd "$(dirname "$0")/.." && pwd)"
busy=$(nproc); rounds=3; size=1024; seconds=6; warm=2; case_file=""; sets=()
while [[ $# -gt 0 ]]; do
    case "$1" in
        --busy) busy=${2:?--busy needs a count}; shift 2 ;;
        --rounds) rounds=${2:?--rounds needs a count}; shift 2 ;;
        --size) size=${2:?--size needs N}; shift 2 ;;
        --seconds) seconds=${2:?--seconds needs S}; shift 2 ;;
        --warm-up) warm=${2:?--warm-up needs W}; shift 2 ;;
        --case) case_file=${2:?--case needs a file}; shift 2 ;;
        --set) sets+=(--set "${2:?--set needs name=value}"); shift 2 ;;
        *) echo "bench-under-load: unknown argument '$1' (see the header of $0)" >&2; exit 2 ;;
    esac
done
for v in "$busy" "$rounds" "$size"; do
    [[ "$v" =~ ^[0-9]+$ ]] || { echo "bench-under-load: '$v' is not a whole number" >&2; exit 2; }
done
[[ -z "$case_file" || -f "$case_file" ]] || { echo "bench-under-load: case file '$case_file' not found" >&2; exit 2; }

pids=(); tmp=""
cleanup() {
    for p in "${pids[@]}"; do kill "$p" 2>/dev/null || true; done
    [[ -n "$tmp" ]] && rm -rf -- "$tmp"
}
trap cleanup EXIT
trap 'exit 130' INT TERM

# One case run: prints its rate in Mcell/s ('all' = the default thread count).
case_rate() {
    local opt=(--threads "$1")
    [[ "$1" == all ]] && opt=()   # the default: the case's numerics.threads, else every core
    rm -rf -- "$tmp/out"
    "$here/evanesce" run "$case_file" --out "$tmp/out" "${opt[@]}" "${sets[@]}" 2>/dev/null \
        | sed -n 's/^done: .*(\([0-9.]*\) Mcell\/s.*/\1/p'
}

# One round: prints "ONE ALL" in Mcell/s, and for the bench grid the default's share of timed steps on fewer threads.
round() {
    if [[ -n "$case_file" ]]; then
        echo "$(case_rate 1) $(case_rate all)"
    else
        "$here/evanesce" bench --interleave --size "$size" --threads 1 --threads all --repeats 9 \
            --seconds "$seconds" --warm-up "$warm" --csv 2>/dev/null \
            | awk -F, 'NR==1 {for (i = 1; i <= NF; i++) {if ($i == "mcells_per_s") c = i; if ($i == "fewer_threads_percent") f = i}}
                       NR==2 {one = $c} NR==3 {all = $c; fewer = $f} END {if (one != "" && all != "") print one, all, fewer}'
    fi
}

tmp=$(mktemp -d)
for _ in $(seq "$busy"); do
    yes > /dev/null &
    pids+=($!)
done
cores=$(nproc)
what="bench grid ${size}x${size}"
[[ -n "$case_file" ]] && what="case $case_file"
echo "$what; $busy competing busy process(es) (yes > /dev/null) on $cores core(s); default = $cores threads"
ratios=()
for r in $(seq "$rounds"); do
    read -r one all fewer <<< "$(round)" || true
    [[ -n "${one:-}" && -n "${all:-}" ]] || { echo "bench-under-load: a measurement printed no rate (is the jar built?)" >&2; exit 3; }
    ratio=$(awk -v a="$all" -v o="$one" 'BEGIN {printf "%.3f", a / o}')
    ratios+=("$ratio")
    note=""
    [[ -n "${fewer:-}" ]] && note="  default on fewer threads for ${fewer} % of its timed steps"
    echo "round $r: 1 thread ${one} Mcell/s  default ${all} Mcell/s  ratio ${ratio}${note}  (load average $(cut -d' ' -f1 /proc/loadavg))"
done
printf '%s\n' "${ratios[@]}" | sort -n | awk '{a[NR] = $1} END {m = (NR % 2) ? a[(NR + 1) / 2] : (a[NR / 2] + a[NR / 2 + 1]) / 2;
    printf "median ratio default / 1 thread %.3f (min %.3f, max %.3f, %d rounds)\n", m, a[1], a[NR], NR}'

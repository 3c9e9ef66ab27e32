#!/usr/bin/env bash
# Runs every shipped example (cases/*.yaml, or the files given) as a user would, one `evanesce run`
# each into a temporary folder, and right after each one `evanesce bench` at the same cell count and
# thread count, and prints per example:
#   useful Mcell/s = main grid cells x steps of the main run / the whole command's wall time
#                    (start-up, planning, the incident-power run and the writing of outputs included),
#   the stepping rate the run reports itself ('done:' line), the bench rate for a square grid of
#   about the same number of cells (side round(sqrt(nx*ny)), the case's polarization, float), and
#   the ratio useful / bench. Issue 18's goal: at least 0.6 for examples with a flux section, 0.8
#   for the others. A case run in both polarizations counts both main runs' steps (steps column: s+p).
#   ceiling = the best ratio any build could reach: the main grids' work at the bench rate over that
#   time plus the start-up floor (the least wall time of three `evanesce --version`, printed first: the
#   JVM and launcher alone). A small example's ceiling is far below the goal; its ratio says little.
#
# Usage: tools/example-speeds.sh [--threads N] [--bench-seconds S] [--jar JAR] [CASE.yaml ...]   (build the jar first)
#   --threads N        passed to every run (default: the runs' own default, all cores); the bench
#                      uses the thread count the run reports
#   --bench-seconds S  timed seconds per bench repeat (default 2; 3 repeats, the median)
#   --jar JAR          run this build's jar (runs and bench) instead of io/target/evanesce.jar, e.g. an
#                      older build kept aside, to compare two builds example by example; its class-data
#                      archive JAR with .jsa for .jar is passed where it lies beside it, but the JVM uses it
#                      only for the jar at the path it was made for (another checkout's io/target, not a
#                      copy: a copied jar runs without it, silently)
# The figures drift with other work on the machine: compare examples measured in one sitting only,
# and on a shared machine call them provisional. A bench rate marked * did not settle during its
# warm-up (the bench's CSV column 'settled'): on a very busy machine the JIT compiler itself gets
# too little time, and that rate means nothing. Temporary folders are removed when the script ends.
set -euo pipefail
here="$(cd "$(dirname "$0")/.." && pwd)"
threads=(); bench_seconds=2; cases=(); jar=""
while [[ $# -gt 0 ]]; do
    case "$1" in
        --threads) threads=(--threads "${2:?--threads needs a count}"); shift 2 ;;
        --bench-seconds) bench_seconds=${2:?--bench-seconds needs S}; shift 2 ;;
        --jar) jar=${2:?--jar needs a file}; [[ -f "$jar" ]] || { echo "example-speeds: jar '$jar' not found" >&2; exit 2; }
               shift 2 ;;
        -h|--help) sed -n '2,27p' "$0"; exit 0 ;;
        -*) echo "example-speeds: unknown option '$1' (see the header of $0)" >&2; exit 2 ;;
        *) [[ -f "$1" ]] || { echo "example-speeds: case file '$1' not found" >&2; exit 2; }; cases+=("$1"); shift ;;
    esac
done
if [[ ${#cases[@]} -eq 0 ]]; then
    cases=("$here"/cases/*.yaml)
fi
[[ -n "$jar" || -f "$here/io/target/evanesce.jar" ]] || { echo "example-speeds: build the jar first (mvn -B -q -DskipTests package)" >&2; exit 2; }
# the launcher, or the given jar with the launcher's JVM flags
# (with its class-data archive, JAR's name ending .jsa instead of .jar, where one newer than it lies beside it; the
# JVM ignores it for a jar other than the one it was made for)
evanesce() {
    if [[ -n "$jar" ]]; then
        local cds=()
        if [[ -f "${jar%.jar}.jsa" && "${jar%.jar}.jsa" -nt "$jar" ]]; then
            cds=(-XX:SharedArchiveFile="${jar%.jar}.jsa" -Xlog:cds*=off)
        fi
        # the launcher's compiler thresholds (see ./evanesce)
        # shellcheck disable=SC2086
        java --add-modules jdk.incubator.vector -XX:+UseParallelGC -XX:Tier4InvocationThreshold=15000 \
            -XX:Tier4CompileThreshold=45000 -XX:Tier4BackEdgeThreshold=4000000 "${cds[@]}" ${JAVA_OPTS:-} -jar "$jar" "$@"
    else
        "$here/evanesce" "$@"
    fi
}

tmp="$(mktemp -d)"
trap 'rm -rf -- "$tmp"' EXIT
trap 'exit 130' INT TERM

floor=9
for _ in 1 2 3; do
    f0=$(date +%s%N); evanesce --version >/dev/null 2>&1; f1=$(date +%s%N)
    floor=$(awk -v a="$f0" -v b="$f1" -v m="$floor" 'BEGIN { t = (b - a) / 1e9; printf "%.3f", (t < m ? t : m) }')
done
echo "start-up floor (evanesce --version, least of 3): $floor s"
printf '%-40s %11s %6s %7s %8s %9s %9s %9s %6s %7s %s\n' example grid steps threads wall_s useful run_rate bench ratio ceiling flux
for c in "${cases[@]}"; do
    name="$(basename "$c" .yaml)"
    log="$tmp/$name.log"
    t0=$(date +%s%N)
    if ! evanesce run "$c" --out "$tmp/$name" "${threads[@]}" >"$log" 2>&1; then
        echo "example-speeds: $name failed; its output:" >&2
        tail -5 "$log" >&2
        continue
    fi
    t1=$(date +%s%N)
    # '<file>: NX x NY cells of ...' and 'done: STEPS steps in ... (RATE Mcell/s, K threads)'
    read -r nx ny < <(sed -n 's/.*: \([0-9]*\) x \([0-9]*\) cells of .*/\1 \2/p' "$log" | head -1)
    pol=$(sed -n 's/.* cells of .*, \([sp]\) polarization.*/\1/p' "$log" | head -1)
    done_line=$(grep -m1 '^done:' "$log")
    steps=$(sed -n 's/^done: \([0-9]*\) steps.*/\1/p' "$log" | paste -sd+ -)
    rate=$(sed -n 's/.*(\([0-9.]*\) Mcell\/s.*/\1/p' <<<"$done_line")
    used=$(sed -n 's/.*Mcell\/s, \([0-9]*\) thread.*/\1/p' <<<"$done_line")
    wall=$(awk -v a="$t0" -v b="$t1" 'BEGIN { printf "%.2f", (b - a) / 1e9 }')
    useful=$(awk -v x="$nx" -v y="$ny" -v s="$steps" -v w="$wall" 'BEGIN { n = split(s, p, "+"); t = 0;
        for (i = 1; i <= n; i++) t += p[i]; printf "%.1f", x * y * t / w / 1e6 }')
    side=$(awk -v x="$nx" -v y="$ny" 'BEGIN { printf "%d", sqrt(x * y) + 0.5 }')
    bench=$(evanesce bench --size "$side" --threads "$used" --polarization "${pol:-s}" --seconds "$bench_seconds" \
        --repeats 3 --csv 2>/dev/null | awk -F, 'NR == 1 { for (i = 1; i <= NF; i++) { if ($i == "mcells_per_s") col = i;
        if ($i == "settled") st = i }; next } { printf "%.1f%s", $col, ($st == "false" ? "*" : "") }')
    ratio=$(awk -v u="$useful" -v b="${bench%\*}" 'BEGIN { printf "%.2f", (b > 0 ? u / b : 0) }')
    ceiling=$(awk -v u="$useful" -v w="$wall" -v b="${bench%\*}" -v f="$floor" 'BEGIN { t = u * w / b;
        printf "%.2f", (b > 0 ? t / (t + f) : 0) }')
    flux=$(grep -q '^flux:' "$c" && echo yes || echo no)
    printf '%-40s %11s %6s %7s %8s %9s %9s %9s %6s %7s %s\n' "$name" "${nx}x${ny}" "$steps" "$used" "$wall" "$useful" "$rate" \
        "$bench" "$ratio" "$ceiling" "$flux"
    rm -rf -- "${tmp:?}/$name"
done

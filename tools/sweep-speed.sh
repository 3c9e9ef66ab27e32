#!/usr/bin/env bash
# The sweep benchmark of issue 17: a 20-point gap sweep (100 to 300 nm) of
# cases/gap-tunnelling-plane-wave.yaml, run by two builds of the program in turn, round after round,
# each as one whole `sweep` command into a fresh temporary folder. Prints per round each build's wall
# and CPU (user + system) seconds and the ratios NEW/OLD, then the medians, and whether both builds
# wrote the same sweep.csv, byte for byte (else the largest difference of a number in it, and which
# column: builds before the incident-power strip differ by about 1e-7). Issue 17's goal: a wall ratio of
# at most 0.6 against the program before the issue's work (commit 08e1029).
#
# Usage: tools/sweep-speed.sh OLD.jar NEW.jar [ROUNDS]   (default 3 rounds)
#   e.g. git clone -q . /tmp/old && git -C /tmp/old checkout -q 08e1029 &&
#        (cd /tmp/old && mvn -B -ntp -q -o -DskipTests package) &&
#        tools/sweep-speed.sh /tmp/old/io/target/evanesce.jar io/target/evanesce.jar 3
# Both jars run with the launcher's JVM flags (see ./evanesce); CPU times come from GNU time (the
# `time` program, not the shell keyword). The figures drift with other work on
# the machine: compare builds measured in one sitting only, and on a shared machine call them
# provisional. The temporary folder is removed when the script ends.
set -euo pipefail
here="$(cd "$(dirname "$0")/.." && pwd)"
old=${1:?usage: tools/sweep-speed.sh OLD.jar NEW.jar [ROUNDS]}
new=${2:?usage: tools/sweep-speed.sh OLD.jar NEW.jar [ROUNDS]}
rounds=${3:-3}
for j in "$old" "$new"; do
    [[ -f "$j" ]] || { echo "sweep-speed: $j not found" >&2; exit 2; }
done
[[ "$rounds" =~ ^[1-9][0-9]*$ ]] || { echo "sweep-speed: ROUNDS must be a positive whole number, not '$rounds'" >&2; exit 2; }
java="java"
[[ -n "${JAVA_HOME:-}" ]] && java="$JAVA_HOME/bin/java"
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
{
    cat "$here/cases/gap-tunnelling-plane-wave.yaml"
    printf 'sweep:\n  parameters:\n    gap: {from: 100 nm, to: 300 nm, count: 20}\n'
} > "$tmp/gap20.yaml"

# one_run JAR OUT: prints "WALL CPU" in seconds (bash's own clock and the process's rusage)
one_run() {
    local jar=$1 out=$2 t0 t1 cpu
    rm -rf "$out"
    t0=$(date +%s.%N)
    /usr/bin/env time -o "$out.time" -f '%U %S' "$java" --add-modules jdk.incubator.vector -XX:+UseParallelGC \
        -jar "$jar" sweep "$tmp/gap20.yaml" --out "$out" > "$out.log" 2>&1 || true
    t1=$(date +%s.%N)
    cpu=$(tail -n 1 "$out.time")
    grep -q '^merged 20 of 20 points' "$out.log" || { echo "sweep-speed: the sweep with $jar failed; see its output:" >&2;
        tail -n 5 "$out.log" >&2; exit 1; }
    awk -v a="$t0" -v b="$t1" -v c="$cpu" 'BEGIN { split(c, u, " "); printf "%.2f %.2f\n", b - a, u[1] + u[2] }'
}

printf '%-6s %10s %10s %10s %10s %8s %8s\n' round old_wall old_cpu new_wall new_cpu wall_r cpu_r
rows=()
for ((r = 1; r <= rounds; r++)); do
    read -r ow oc < <(one_run "$old" "$tmp/old")
    read -r nw nc < <(one_run "$new" "$tmp/new")
    row=$(awk -v ow="$ow" -v oc="$oc" -v nw="$nw" -v nc="$nc" 'BEGIN { printf "%.3f %.3f", nw / ow, nc / oc }')
    rows+=("$ow $oc $nw $nc $row")
    printf '%-6s %10s %10s %10s %10s %8s %8s\n' "$r" "$ow" "$oc" "$nw" "$nc" $row
done
median() { sort -g | awk '{ v[NR] = $1 } END { print (NR % 2) ? v[(NR + 1) / 2] : (v[NR / 2] + v[NR / 2 + 1]) / 2 }'; }
printf '%-6s' median
for c in 1 2 3 4 5 6; do
    printf ' %10s' "$(printf '%s\n' "${rows[@]}" | awk -v c=$c '{ print $c }' | median)"
done
echo
if cmp -s "$tmp/old/sweep.csv" "$tmp/new/sweep.csv"; then
    echo "sweep.csv: the same bytes from both builds"
else
    paste -d '\n' "$tmp/old/sweep.csv" "$tmp/new/sweep.csv" | awk -F, '
        NR == 1 { for (i = 1; i <= NF; i++) name[i] = $i; next }
        NR % 2 == 1 { for (i = 1; i <= NF; i++) a[i] = $i; next }
        { for (i = 1; i <= NF; i++) if (a[i] ~ /^-?[0-9.]+(e[-+][0-9]+)?$/ && $i != a[i]) {
              d = a[i] - $i; if (d < 0) d = -d; if (d > best) { best = d; col = name[i] } } }
        END { printf "sweep.csv: the builds differ; largest difference %.3g (column %s)\n", best, col }'
fi

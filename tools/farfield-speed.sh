#!/usr/bin/env bash
# Cost of a far-field contour (issue 16: "with ten wavelengths on a contour of 2,000 cells, the whole run
# must be at most 10 % slower than without them"). Runs the same case twice, alternating round by round:
# a glass rod (r = 200 nm, n = 1.5) lit at 633 nm by a plane-wave box, 20 nm cells, 200 fs (longer on
# larger grids, in proportion to the width: the continuous wave must settle across the domain), once without
# a surfaces section and once with a far-field contour of 4 x 500 = 2000 cells and ten wavelengths.
# Prints each round's wall and CPU (user + sys) seconds of the whole command, from /usr/bin/time, their
# ratios (with / without) and the medians. On a shared machine alternate several rounds and prefer CPU.
#
# usage: tools/farfield-speed.sh [--cells N] [--rounds R] [--threads T] [--jar JAR] [--keep DIR]
#   --cells N    grid of N x N nodes (default 601; at least 601, e.g. 1201 where the contour is a smaller share)
#   --rounds R   pairs of runs (default 3)
#   --threads T  passed to 'evanesce run --threads' (default: the program's choice)
#   --jar JAR    time this build's jar instead of io/target/evanesce.jar
#   --keep DIR   write the two case files and the results there (default: a temporary folder, removed)
set -euo pipefail

here="$(cd "$(dirname "$(readlink -f "${BASH_SOURCE[0]}")")/.." && pwd)"
cells=601
rounds=3
threads=""
jar="$here/io/target/evanesce.jar"
keep=""
while [[ $# -gt 0 ]]; do
    case "$1" in
        --cells) cells="$2"; shift 2 ;;
        --rounds) rounds="$2"; shift 2 ;;
        --threads) threads="$2"; shift 2 ;;
        --jar) jar="$2"; shift 2 ;;
        --keep) keep="$2"; shift 2 ;;
        -h|--help) sed -n '2,16p' "$0"; exit 0 ;;
        *) echo "farfield-speed.sh: unknown argument '$1' (see --help)" >&2; exit 2 ;;
    esac
done
if ! [[ "$cells" =~ ^[0-9]+$ ]] || (( cells < 601 )); then
    echo "farfield-speed.sh: --cells $cells: expected a whole number of at least 601 (the contour spans 501 nodes inside the PMLs)" >&2
    exit 2
fi
if ! [[ "$rounds" =~ ^[0-9]+$ ]] || (( rounds < 1 )); then
    echo "farfield-speed.sh: --rounds $rounds: expected a whole number of at least 1" >&2
    exit 2
fi
if [[ ! -f "$jar" ]]; then
    echo "farfield-speed.sh: $jar not found; build it first: mvn -B -q -DskipTests package" >&2
    exit 2
fi
if [[ ! -x /usr/bin/time ]]; then
    echo "farfield-speed.sh: /usr/bin/time is needed (Debian package 'time')" >&2
    exit 2
fi
java="java"
if [[ -n "${JAVA_HOME:-}" ]]; then
    java="$JAVA_HOME/bin/java"
fi

if [[ -n "$keep" ]]; then
    mkdir -p "$keep"
    dir="$(cd "$keep" && pwd)"
else
    dir="$(mktemp -d)"
    trap 'rm -rf "$dir"' EXIT
fi
# the domain spans (cells - 1) cells of 20 nm; the run lasts 200 fs per 600 cells of width (the far-field
# transform takes whole periods once the wave has settled, which takes longer on a wider domain)
width_nm=$(( (cells - 1) * 20 ))
time_fs=$(( 200 * (cells - 1) / 600 ))
cat > "$dir/without.yaml" <<EOF
title: Far-field contour cost, without the contour
design_wavelength: 633 nm
polarization: s
domain: {width: $width_nm nm, height: $width_nm nm}
grid: {cell: 20 nm}
materials:
  glass: {index: 1.5}
shapes:
  - disk: {centre: [0, 0], radius: 200 nm, material: glass}
boundaries: {all: pml 0.5 um}
sources:
  - plane_wave_box:
      from: [-1 um, -1 um]
      to: [1 um, 1 um]
      heading: 30 deg
      signal: {ramped_wave: {wavelength: 633 nm}}
until: {time: $time_fs fs}
EOF
sed -e 's/without the contour/with the contour/' -e '/^until:/d' "$dir/without.yaml" > "$dir/with.yaml"
cat >> "$dir/with.yaml" <<EOF
surfaces:
  wavelengths: {from: 590 nm, to: 680 nm, count: 10}
  far_field:
    - {name: ring, from: [-5 um, -5 um], to: [5 um, 5 um], angles: 360}
until: {time: $time_fs fs}
EOF

# one run: sets WALL and CPU (seconds)
measure() {
    local name="$1"
    local args=(run "$dir/$name.yaml" --out "$dir/out-$name" --force)
    if [[ -n "$threads" ]]; then
        args+=(--threads "$threads")
    fi
    /usr/bin/time -f "%e %U %S" -o "$dir/time-$name" "$java" --add-modules jdk.incubator.vector -XX:+UseParallelGC \
        ${JAVA_OPTS:-} -jar "$jar" "${args[@]}" > "$dir/log-$name" 2>&1 || {
        echo "farfield-speed.sh: the run of $name.yaml failed; its output:" >&2
        cat "$dir/log-$name" >&2
        exit 1
    }
    read -r WALL CPU < <(awk '{printf "%.2f %.2f\n", $1, $2 + $3}' "$dir/time-$name")
}

median() {
    sort -g | awk '{v[NR] = $1} END {if (NR % 2) printf "%.3f", v[(NR + 1) / 2]; else printf "%.3f", (v[NR / 2] + v[NR / 2 + 1]) / 2}'
}

echo "grid ${cells}x${cells} (20 nm cells), $time_fs fs; contour 2000 cells, 10 wavelengths; $rounds round(s); load $(cut -d' ' -f1-3 /proc/loadavg)"
printf "%5s %12s %11s %12s %11s %10s %9s\n" round without_wall without_cpu with_wall with_cpu wall_ratio cpu_ratio
wall_ratios=()
cpu_ratios=()
for ((r = 1; r <= rounds; r++)); do
    # alternate which goes first, so that a drift in the machine's load does not favour one
    if (( r % 2 )); then
        measure without; w0=$WALL; c0=$CPU
        measure with; w1=$WALL; c1=$CPU
    else
        measure with; w1=$WALL; c1=$CPU
        measure without; w0=$WALL; c0=$CPU
    fi
    wr=$(awk -v a="$w1" -v b="$w0" 'BEGIN {printf "%.3f", a / b}')
    cr=$(awk -v a="$c1" -v b="$c0" 'BEGIN {printf "%.3f", a / b}')
    wall_ratios+=("$wr")
    cpu_ratios+=("$cr")
    printf "%5d %12s %11s %12s %11s %10s %9s\n" "$r" "$w0" "$c0" "$w1" "$c1" "$wr" "$cr"
done
echo "median ratio (with / without): wall $(printf '%s\n' "${wall_ratios[@]}" | median), CPU $(printf '%s\n' "${cpu_ratios[@]}" | median)"
echo "load after: $(cut -d' ' -f1-3 /proc/loadavg)"

#!/usr/bin/env bash
# Issue #7's cluster check: a sweep run as a Slurm job array on a real (single-node) Slurm cluster
# gives the same merged sweep.csv as the same sweep run on this machine alone.
# Needs root and Debian's slurmctld slurmd slurm-client munge (installed when missing and apt-get
# is there). Starts the daemons with tools/slurm-cluster.sh and stops them on exit.
# Exit: 0 passed (or skipped with a note when no cluster can be started), 1 the results differ.
set -euo pipefail
root=$(cd "$(dirname "$0")/.." && pwd)
# a skip is printed and also recorded in target/skipped-checks.txt, which .ci/run lists at its end
skip() {
  echo "note: slurm check skipped: $1"
  mkdir -p "$root/target" && echo "tools/slurm-sweep-check.sh (sweep as a Slurm job array): $1" >> "$root/target/skipped-checks.txt"
  exit 0
}
if [ "$(id -u)" != 0 ]; then skip "needs root"; fi
work=$(mktemp -d /tmp/evanesce-slurm.XXXXXX)
if ! command -v slurmctld >/dev/null 2>&1; then
  if command -v apt-get >/dev/null 2>&1 && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq slurmctld slurmd \
      slurm-client munge >/dev/null 2>&1; then :; else skip "cannot install Slurm"; fi
fi
if [ -f /etc/slurm/slurm.conf ] && ! grep -q "evanesce single-node check" /etc/slurm/slurm.conf; then
  skip "this machine has its own Slurm configuration"
fi
trap '"$root/tools/slurm-cluster.sh" stop "$work/cluster" || true' EXIT
if ! "$root/tools/slurm-cluster.sh" start "$work/cluster"; then
  skip "the single-node cluster did not start (see $work/cluster/log)"
fi
cat > "$work/gap.yaml" <<'CASE'
# a small sweep of the gap in front of a plane wave: three points
parameters:
  gap: 150 nm
design_wavelength: 633 nm
polarization: s
domain: {width: 0.1 um, height: 3 um, background: glass}
grid: {cells_per_wavelength: 16}
materials:
  glass: {index: 1.5}
  gap_fill: {index: 1.0}
shapes:
  - layer_stack: {start: [0, -gap/2], layers: [{material: gap_fill, thickness: gap}]}
boundaries: {left: periodic, right: periodic, bottom: pml 0.5 um, top: pml 0.5 um}
sources:
  - plane_wave: {y: -0.8 um, angle: 45 deg, signal: {pulse: {wavelength: 633 nm, bandwidth: 20 nm}}}
flux:
  wavelengths: 633 nm
  lines:
    - {y: -0.95 um, measures: reflected}
    - {y: 0.8 um, measures: transmitted}
until: {energy_below: 1e-6, latest: 400 fs}
sweep:
  parameters:
    gap: [100 nm, 200 nm, 300 nm]
CASE
# a step that fails says why (its log lives in the temporary folder, removed on exit)
run_logged() { local log=$1; shift; "$@" > "$log" 2>&1 || { echo "slurm-sweep-check: '$*' failed; its output:" >&2; tail -20 "$log" >&2; exit 1; }; }
run_logged "$work/local.log" "$root/evanesce" sweep "$work/gap.yaml" --out "$work/local" --progress-seconds 60
# a folder name with a space, a quote and a dollar sign: the script must quote every path (issue 13)
run="$work/cluster run's \$x"
run_logged "$work/script.log" "$root/evanesce" sweep "$work/gap.yaml" --out "$run" --slurm-script 2
if ! timeout 900 sbatch --wait "$run/sweep.slurm" > "$work/sbatch.log" 2>&1; then
  if grep -q "COMPLETED\|exit code" "$work/sbatch.log" 2>/dev/null; then :; fi
  if ! ls "$run"/point-* >/dev/null 2>&1; then
    skip "the job array did not run on the local cluster (see $work/sbatch.log)"
  fi
fi
run_logged "$work/merge.log" "$root/evanesce" sweep "$work/gap.yaml" --out "$run" --merge-only
if ! ls "$run"/slurm-*_0.out >/dev/null 2>&1; then
  echo "slurm check FAILED: the tasks' logs are not in $run (#SBATCH --output)"; exit 1
fi
if cmp -s "$work/local/sweep.csv" "$run/sweep.csv"; then
  echo "slurm check passed: the job array's merged sweep.csv equals the local sweep's ($work)"
else
  echo "slurm check FAILED: sweep.csv differs between the local sweep and the Slurm job array ($work)"
  diff "$work/local/sweep.csv" "$run/sweep.csv" | head -20 || true
  exit 1
fi

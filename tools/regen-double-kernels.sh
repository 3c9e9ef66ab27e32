#!/usr/bin/env bash
# Regenerates the double-precision kernel classes (Double*.java) from the single-precision ones
# (Float*.java) in solver/.../kernel, so the two paths stay the same code. Edit the Float* files,
# run this, then build and run the tests. Needs only the JDK (java runs the generator from source).
# `tools/regen-double-kernels.sh --check` changes nothing and exits 1 if a Double* file differs from
# the generator's output; GeneratedKernelsTest makes the same check in `mvn test`.
set -euo pipefail
cd "$(dirname "$0")/.."
exec java solver/src/test/java/org/evanesce/solver/kernel/DoubleKernelGenerator.java "$@"

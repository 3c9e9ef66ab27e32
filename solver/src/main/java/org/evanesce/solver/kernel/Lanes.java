package org.evanesce.solver.kernel;

import jdk.incubator.vector.DoubleVector;
import jdk.incubator.vector.FloatVector;
import jdk.incubator.vector.VectorShape;
import jdk.incubator.vector.VectorSpecies;

/**
 * Picks the vector width of the kernels once per JVM. The stencil's unaligned neighbour loads
 * straddle cache lines more often with 512-bit vectors, which measured 1.15–1.6× slower than
 * 256-bit ones on this project's machines (docs/architecture.md), so the width is capped at 256 bits.
 * Developers may override it for measurements with {@code -Devanesce.vectorBits=128|256|512}.
 */
final class Lanes {

    private Lanes() {
    }

    static int bits() {
        int preferred = VectorShape.preferredShape().vectorBitSize();
        int wanted = Integer.getInteger("evanesce.vectorBits", 256);
        return Math.min(preferred, wanted);
    }

    static VectorSpecies<Float> floatSpecies() {
        return FloatVector.SPECIES_PREFERRED.withShape(VectorShape.forBitSize(bits()));
    }

    static VectorSpecies<Double> doubleSpecies() {
        return DoubleVector.SPECIES_PREFERRED.withShape(VectorShape.forBitSize(bits()));
    }
}

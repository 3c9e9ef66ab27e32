package org.evanesce.io.bench;

import java.util.Locale;
import jdk.incubator.vector.VectorShape;
import org.evanesce.solver.Simulation;

/**
 * What a benchmark ran on: JVM, operating system, processors, heap and the Vector API width
 * the JVM prefers on this CPU.
 *
 * @param java               Java version
 * @param vm                 JVM name and vendor
 * @param os                 operating system name, version and architecture
 * @param cores              processors available to the JVM
 * @param maxHeapBytes       the JVM's heap limit, in bytes
 * @param preferredVectorBits the JVM's preferred vector width in bits, or 0 when the Vector API
 *                           module is not loaded
 * @param vectorBitsOverride  the {@code evanesce.vectorBits} system property, or null if unset
 * @param kernelVectorBits    the width the solver's kernels use, or 0 when the module is not loaded
 */
public record MachineInfo(String java, String vm, String os, int cores, long maxHeapBytes,
                          int preferredVectorBits, String vectorBitsOverride, int kernelVectorBits) {

    /** The name of the Vector API's incubator module. */
    public static final String VECTOR_MODULE = "jdk.incubator.vector";

    /** Whether the Vector API module was loaded (the JVM was started with --add-modules for it). */
    public static boolean vectorModuleLoaded() {
        return ModuleLayer.boot().findModule(VECTOR_MODULE).isPresent();
    }

    /** Describes the running JVM and machine. */
    public static MachineInfo current() {
        int bits = vectorModuleLoaded() ? VectorShape.preferredShape().vectorBitSize() : 0;
        return new MachineInfo(
                System.getProperty("java.version"),
                System.getProperty("java.vm.name") + ", " + System.getProperty("java.vendor"),
                System.getProperty("os.name") + " " + System.getProperty("os.version") + " " + System.getProperty("os.arch"),
                Runtime.getRuntime().availableProcessors(),
                Runtime.getRuntime().maxMemory(),
                bits,
                System.getProperty("evanesce.vectorBits"),
                vectorModuleLoaded() ? Simulation.kernelVectorBits() : 0);
    }

    /** One line for a report header. */
    public String describe() {
        String vector = preferredVectorBits == 0 ? "Vector API not loaded"
                : "kernels use " + kernelVectorBits + "-bit vectors (JVM prefers " + preferredVectorBits + ")"
                        + (vectorBitsOverride == null ? "" : ", -Devanesce.vectorBits=" + vectorBitsOverride);
        return String.format(Locale.ROOT, "Java %s (%s); %s; %d cores; max heap %.1f GiB; %s",
                java, vm, os, cores, maxHeapBytes / (1024.0 * 1024 * 1024), vector);
    }
}

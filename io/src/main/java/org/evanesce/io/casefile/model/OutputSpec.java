package org.evanesce.io.casefile.model;

import java.util.List;
import java.util.Optional;
import org.evanesce.io.casefile.text.Located;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;
import org.evanesce.solver.grid.Component;

/**
 * What a run writes and where.
 *
 * @param folder        the output folder as written (relative paths are taken from the folder that
 *                      holds the case file); empty means the case file's name without its extension
 * @param write         what to write, in the order given
 * @param frameInterval simulated time between field frames, seconds (when frames are written by interval)
 * @param frameSteps    steps between field frames (when the interval was given as a number of steps)
 * @param frameTimes    the simulated times of field frames, seconds (when listed instead)
 * @param components    the field components written to field files; empty means every component of the
 *                      case's polarization
 * @param region        the part of the domain field files cover; empty means the interior (outside the PMLs)
 */
public record OutputSpec(Optional<Located<String>> folder, List<Located<Item>> write, Optional<Value> frameInterval,
        Optional<Long> frameSteps, List<Value> frameTimes, List<Located<Component>> components, Optional<Region> region) {

    public OutputSpec {
        write = List.copyOf(write);
        frameTimes = List.copyOf(frameTimes);
        components = List.copyOf(components);
    }

    /** The defaults: write probes only. */
    public OutputSpec(Optional<Located<String>> folder, List<Located<Item>> write, Optional<Value> frameInterval) {
        this(folder, write, frameInterval, Optional.empty(), List.of(), List.of(), Optional.empty());
    }

    /** A rectangle of the domain given by two opposite corners. */
    public record Region(Point from, Point to, SourcePosition at) {

        public double xMin() {
            return Math.min(from.x().si(), to.x().si());
        }

        public double xMax() {
            return Math.max(from.x().si(), to.x().si());
        }

        public double yMin() {
            return Math.min(from.y().si(), to.y().si());
        }

        public double yMax() {
            return Math.max(from.y().si(), to.y().si());
        }
    }

    /** Things a run can write; run.json is always written. */
    public enum Item {
        /** Each probe's time series (CSV). */
        PROBES("probes"),
        /** The fields at the last step (HDF5 + XDMF, and a PNG per component). */
        FIELDS("fields"),
        /** The fields at each frame time (one HDF5 file per frame + one XDMF time series). */
        FIELD_FRAMES("field_frames"),
        /** The permittivity on the grid (HDF5 + XDMF). */
        PERMITTIVITY("permittivity"),
        /** A picture of the permittivity with axes in the case's units (PNG). */
        PREVIEW("preview");

        private final String caseName;

        Item(String caseName) {
            this.caseName = caseName;
        }

        public String caseName() {
            return caseName;
        }
    }

    public boolean writes(Item item) {
        return write.stream().anyMatch(l -> l.value() == item);
    }
}

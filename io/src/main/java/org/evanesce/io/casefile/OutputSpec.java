package org.evanesce.io.casefile;

import java.util.List;
import java.util.Optional;

/**
 * What a run writes and where.
 *
 * @param folder        the output folder as written (relative paths are taken from the folder that
 *                      holds the case file); empty means the case file's name without its extension
 * @param write         what to write, in the order given
 * @param frameInterval simulated time between field frames, seconds (present when frames are written)
 */
public record OutputSpec(Optional<Located<String>> folder, List<Located<Item>> write, Optional<Value> frameInterval) {

    public OutputSpec {
        write = List.copyOf(write);
    }

    /** Things a run can write; run.json is always written. */
    public enum Item {
        /** Each probe's time series (CSV). */
        PROBES("probes"),
        /** The fields at the last step (HDF5 + XDMF). */
        FIELDS("fields"),
        /** The fields every frame_interval (HDF5 frames + one XDMF time series). */
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

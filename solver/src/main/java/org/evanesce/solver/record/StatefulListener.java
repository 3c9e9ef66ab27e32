package org.evanesce.solver.record;

import java.io.DataInput;
import java.io.DataOutput;
import java.io.IOException;

/**
 * A step listener whose accumulated results (running transforms, recorded samples) are part of a
 * checkpoint, so that a restored run continues them bit for bit.
 */
public interface StatefulListener extends StepListener {

    void writeState(DataOutput out) throws IOException;

    /** Reads what {@link #writeState} wrote, into a listener set up like the one that wrote it. */
    void readState(DataInput in) throws IOException;
}

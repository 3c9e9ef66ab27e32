package org.evanesce.io.casefile.model;

import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;

/**
 * A point of the plane in metres. Coordinates: x to the right, y up, the origin at the centre of
 * the domain.
 */
public record Point(Value x, Value y) {

    public SourcePosition at() {
        return x.at();
    }
}

package org.evanesce.io.casefile;

/**
 * A point of the plane in metres. Coordinates: x to the right, y up, the origin at the centre of
 * the domain.
 */
public record Point(Value x, Value y) {

    public SourcePosition at() {
        return x.at();
    }
}

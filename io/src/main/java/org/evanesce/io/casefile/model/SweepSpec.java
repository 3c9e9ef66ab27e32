package org.evanesce.io.casefile.model;

import java.util.List;
import java.util.Locale;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.text.SourcePosition;

/**
 * A case's {@code sweep} section: the values each swept parameter takes and how they combine into
 * points. A point is a set of parameter overrides, read exactly like {@code --set name=value} on the
 * command line, so every point is validated by the normal reader.
 *
 * @param parameters the swept parameters in file order (the first one varies slowest in a product)
 * @param combine    how the parameters' values combine into points
 * @param at         where {@code sweep} was written
 * @param sample     the sample form: points drawn at random (its parameters are then the axes, each with no listed
 *                   values, and {@code combine} is zip)
 */
public record SweepSpec(List<Axis> parameters, Combine combine, SourcePosition at, java.util.Optional<SampleSpec> sample) {

    public SweepSpec {
        parameters = List.copyOf(parameters);
    }

    /** A sweep of listed values (no sample). */
    public SweepSpec(List<Axis> parameters, Combine combine, SourcePosition at) {
        this(parameters, combine, at, java.util.Optional.empty());
    }

    /** How the swept values combine into points. */
    public enum Combine {
        /** Every combination; the first parameter varies slowest. */
        PRODUCT,
        /** The n-th point takes the n-th value of every parameter (all lists have the same length). */
        ZIP;

        /** The word used in case files. */
        public String caseName() {
            return name().toLowerCase(Locale.ROOT);
        }
    }

    /**
     * One swept parameter.
     *
     * @param name       the parameter (defined under {@code parameters})
     * @param kind       the parameter's kind (a length for a length)
     * @param values     the expression texts it takes, in order, each usable as {@code --set name=text}
     * @param definition the values as written, e.g. {@code [40 deg, 45 deg]} or
     *                   {@code {from: 100 nm, to: 300 nm, count: 5, spacing: linear}}
     * @param at         where the parameter's key was written
     */
    public record Axis(String name, Dimension kind, List<String> values, String definition, SourcePosition at) {

        public Axis {
            values = List.copyOf(values);
        }
    }

    /** The number of points: the product of the value counts, or the common count for {@code zip}. */
    public long pointCount() {
        return sample.isPresent() ? sample.get().count() : count(parameters, combine);
    }

    static long count(List<Axis> axes, Combine combine) {
        if (axes.isEmpty()) {
            return 0;
        }
        if (combine == Combine.ZIP) {
            return axes.get(0).values().size();
        }
        long n = 1;
        for (Axis a : axes) {
            n = Math.multiplyExact(n, a.values().size());
        }
        return n;
    }
}

package org.evanesce.io.casefile.model;

import org.evanesce.io.casefile.text.SourcePosition;

import java.util.List;
import org.evanesce.io.casefile.expr.Dimension;

/**
 * The {@code sample} form of a case's sweep: {@code count} points whose named parameters are drawn at
 * random (one generator seeded with {@code seed}, the parameters drawn in file order for each point in
 * turn, so the points are the same on every machine and in every shard), and the specification limits
 * a point's results are judged against.
 *
 * @param count      the number of points
 * @param seed       the random generator's seed
 * @param parameters the drawn parameters in file order
 * @param require    the limits, per result column, in file order (possibly none)
 * @param at         where {@code sample} was written
 */
public record SampleSpec(int count, long seed, List<Varied> parameters, List<Limit> require, SourcePosition at) {

    public SampleSpec {
        parameters = List.copyOf(parameters);
        require = List.copyOf(require);
    }

    /** The distributions a parameter may be drawn from. */
    public enum Kind {
        /** Normal with a mean and standard deviation, truncated to [low, high] when either is given. */
        NORMAL,
        /** Uniform on [low, high]. */
        UNIFORM
    }

    /**
     * One drawn parameter, values in SI units.
     *
     * @param name       the parameter (defined under {@code parameters})
     * @param dimension  its kind
     * @param kind       normal or uniform
     * @param mean       normal: the mean (NaN for uniform)
     * @param sd         normal: the standard deviation (NaN for uniform)
     * @param low        the lower bound (−∞ for a normal without one)
     * @param high       the upper bound (+∞ for a normal without one)
     * @param definition as written, e.g. {@code {distribution: normal, mean: 150 nm, standard_deviation: 5 nm}}
     * @param at         where its key was written
     */
    public record Varied(String name, Dimension dimension, Kind kind, double mean, double sd, double low, double high,
                         String definition, SourcePosition at) { }

    /**
     * A specification: a point meets it when the result column's value lies in [min, max].
     *
     * @param column a column of sweep.csv, e.g. {@code T_back}
     * @param min    the lower limit (−∞ when none)
     * @param max    the upper limit (+∞ when none)
     * @param at     where the column's key was written
     */
    public record Limit(String column, double min, double max, SourcePosition at) {

        /** {@code T_back in [0.45, 0.55]}. */
        public String describe() {
            return column + " in [" + (Double.isFinite(min) ? Double.toString(min) : "-inf") + ", "
                    + (Double.isFinite(max) ? Double.toString(max) : "+inf") + "]";
        }
    }
}

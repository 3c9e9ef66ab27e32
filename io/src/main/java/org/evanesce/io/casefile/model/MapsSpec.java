package org.evanesce.io.casefile.model;

import java.util.List;
import java.util.Optional;
import org.evanesce.io.casefile.text.Located;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;

/**
 * Frequency-domain field maps: running Fourier transforms of every field component over a region
 * at chosen frequencies, written as HDF5 + XDMF with PNG quick-looks, and exponential fits of the
 * field's decay along chosen lines.
 *
 * @param frequencies Hz
 * @param region      the part of the domain mapped; empty means the output region, else the interior
 * @param logDecades  the decades below the peak shown by the log-magnitude pictures
 * @param decay       lines along which |E| is fitted by an exponential
 * @param at          where the section starts
 */
public record MapsSpec(List<Value> frequencies, Optional<OutputSpec.Region> region, Value logDecades, List<DecayLine> decay,
        SourcePosition at) {

    public MapsSpec {
        frequencies = List.copyOf(frequencies);
        decay = List.copyOf(decay);
    }

    /**
     * A straight segment along which the field magnitude is fitted by A e^{−s/L}, s the distance from
     * {@code from}.
     */
    public record DecayLine(Located<String> name, Point from, Point to, SourcePosition at) {

        public double length() {
            return Math.hypot(to.x().si() - from.x().si(), to.y().si() - from.y().si());
        }
    }
}

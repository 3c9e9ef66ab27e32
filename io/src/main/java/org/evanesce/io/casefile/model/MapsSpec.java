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
 * @param normalise   what the maps are divided by: nothing, or the incident field's amplitude at each wavelength
 * @param at          where the section starts
 */
public record MapsSpec(List<Value> frequencies, Optional<OutputSpec.Region> region, Value logDecades, List<DecayLine> decay,
        Located<Normalise> normalise, SourcePosition at) {

    public MapsSpec {
        frequencies = List.copyOf(frequencies);
        decay = List.copyOf(decay);
    }

    /** What the maps are divided by. */
    public enum Normalise {
        /** Nothing: the transforms in V·s/m (E) and V·s/m (η0H). */
        ABSOLUTE("absolute"),
        /**
         * The amplitude |E_inc| of the case's plane wave or Gaussian beam's incident electric field at each wavelength
         * (the transform of the incident wave, io.run.IncidentField): the maps become dimensionless.
         */
        INCIDENT("incident");

        private final String caseName;

        Normalise(String caseName) {
            this.caseName = caseName;
        }

        /** The value as the case file writes it. */
        public String caseName() {
            return caseName;
        }
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

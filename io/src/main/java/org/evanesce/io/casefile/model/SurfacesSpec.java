package org.evanesce.io.casefile.model;

import org.evanesce.io.casefile.text.Located;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;

import java.util.List;

/**
 * Power through surfaces anywhere in the domain and where it goes: segments (any axis-aligned line), boxes (the net
 * power out of a rectangle), far-field contours (the angular pattern of what radiates out of a rectangle in a
 * homogeneous medium) and exit spectra (the angular distribution of the light leaving through a horizontal line
 * across the whole width), for every source kind.
 *
 * @param frequencies the frequencies at which the fields are transformed, Hz
 * @param normalise   how the powers are reported
 * @param segments    possibly none
 * @param boxes       possibly none
 * @param farFields   possibly none
 * @param exitSpectra possibly none (at least one of the four lists is not empty)
 * @param at          where the section starts
 * @param incidentRun how the incident norm of a case without a flux section is obtained ({@code incident_run}): auto
 *                    computes a pulsed beam's from its sheets where it can, full always steps the incident-power run
 */
public record SurfacesSpec(List<Value> frequencies, Located<Normalise> normalise, List<Segment> segments, List<Box> boxes,
                           List<FarField> farFields, List<ExitSpectrum> exitSpectra, SourcePosition at,
                           Located<FluxSpec.IncidentRun> incidentRun) {

    public SurfacesSpec {
        frequencies = List.copyOf(frequencies);
        segments = List.copyOf(segments);
        boxes = List.copyOf(boxes);
        farFields = List.copyOf(farFields);
        exitSpectra = List.copyOf(exitSpectra);
    }

    /** What the surfaces' powers are divided by. */
    public enum Normalise {
        /**
         * The incident power of the case's plane wave or Gaussian beam (measured in the incident-power run); with a
         * plane-wave box, the incident wave's intensity (W/m², computed), so that powers become widths in metres.
         */
        INCIDENT("incident"),
        /**
         * The power the point and line sources radiate into the medium they sit in, measured in a run of the same
         * grid filled with that medium by a box round the sources.
         */
        SOURCE("source"),
        /** None: W per metre of z for a continuous wave, J per metre of z per Hz for a pulse, for the stated amplitudes. */
        ABSOLUTE("absolute");

        private final String caseName;

        Normalise(String caseName) {
            this.caseName = caseName;
        }

        public String caseName() {
            return caseName;
        }
    }

    /**
     * An axis-aligned segment; the flux is counted along +x through a vertical one and along +y through a horizontal one.
     *
     * @param name heads its columns in surfaces.csv
     */
    public record Segment(Located<String> name, Point from, Point to, SourcePosition at) {

        /** Whether the segment runs along y. */
        public boolean vertical() {
            return from.x().si() == to.x().si();
        }
    }

    /** A rectangle by two opposite corners; its net power out. */
    public record Box(Located<String> name, Point from, Point to, SourcePosition at) { }

    /**
     * A closed rectangle in a homogeneous transparent medium whose fields are transformed to the far field.
     *
     * @param angles how many equally spaced angles its table lists
     */
    public record FarField(Located<String> name, Point from, Point to, Located<Integer> angles, SourcePosition at) { }

    /** Which way light leaves through an exit spectrum's line. */
    public enum Towards {
        UP("up"), DOWN("down");

        private final String caseName;

        Towards(String caseName) {
            this.caseName = caseName;
        }

        public String caseName() {
            return caseName;
        }
    }

    /**
     * A horizontal line across the whole width (between the side PMLs), in a homogeneous transparent half-space on
     * its exit side: the plane-wave spectrum of the fields on it as power per angle in the exit medium, and the power
     * within a numerical aperture about the exit normal when one is given.
     *
     * @param numericalAperture NA = n sin α of a detector facing the line, or null
     */
    public record ExitSpectrum(Located<String> name, Value y, Located<Towards> towards, Value numericalAperture,
                               SourcePosition at) { }
}

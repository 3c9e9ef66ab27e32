package org.evanesce.io.casefile.model;

import org.evanesce.geometry.dispersion.DispersiveMaterial;
import org.evanesce.geometry.dispersion.SourcedMaterial;

/**
 * The model of a dispersive material of a case, with where its numbers come from.
 *
 * @param model the model (named after the case's material), its citation, data and validity band
 * @param kind  how the case gave it
 */
public record MetalSpec(SourcedMaterial model, Kind kind) {

    /** How a case file gives a dispersive material. */
    public enum Kind {
        /** {@code drude}/{@code lorentz} terms written out. */
        TERMS("drude/lorentz terms"),
        /** {@code library: gold} and the like. */
        LIBRARY("library"),
        /** {@code index: n+ki at WAVELENGTH}. */
        MEASURED_INDEX("single measured index"),
        /** {@code table: FILE.csv}, fitted over the run's band. */
        TABLE("fit to an n, k table");

        private final String text;

        Kind(String text) {
            this.text = text;
        }

        /** E.g. {@code fit to an n, k table}. */
        public String text() {
            return text;
        }
    }

    /** The model itself. */
    public DispersiveMaterial material() {
        return model.material();
    }
}

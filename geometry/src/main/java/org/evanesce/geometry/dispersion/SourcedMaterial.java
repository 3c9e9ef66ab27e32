package org.evanesce.geometry.dispersion;

/**
 * A material model with where it comes from, what it was fitted to, and the band of wavelengths in
 * which it may be trusted: what a run writes into its results beside the model's ε, and checks its
 * band against. Library metals ({@link MetalLibrary}), fits to tables ({@link PoleFit.Result#sourced})
 * and single-wavelength models ({@link SingleIndexModel#sourced}) all give one.
 *
 * @param key      a name ({@code gold}, {@code gold-jc}, or the case's material name)
 * @param material the model
 * @param citation the publication of the model
 * @param fittedTo the measurements the model reproduces
 * @param validity the band of the fit (a single wavelength for a single measured index)
 * @param notes    caveats a user should see (accuracy, recalled values)
 */
public record SourcedMaterial(String key, DispersiveMaterial material, String citation, String fittedTo,
                              WavelengthBand validity, String notes) {

    /** Whether a run's band lies wholly inside the fit's band (if not, warn). */
    public boolean covers(WavelengthBand band) {
        return validity.contains(band);
    }
}

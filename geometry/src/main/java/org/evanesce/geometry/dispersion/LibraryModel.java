package org.evanesce.geometry.dispersion;

/**
 * A library material: a model with where it comes from, what it was fitted to, and the band of
 * wavelengths in which it may be trusted.
 *
 * @param key      the library name ({@code gold}, {@code gold-jc}, …)
 * @param material the model
 * @param citation the publication of the model
 * @param fittedTo the measurements the model reproduces
 * @param validity the band of the fit
 * @param notes    caveats a user should see (accuracy, recalled values)
 */
public record LibraryModel(String key, DispersiveMaterial material, String citation, String fittedTo,
                           WavelengthBand validity, String notes) {

    /** Whether a run's band lies wholly inside the fit's band (if not, warn). */
    public boolean covers(WavelengthBand band) {
        return validity.contains(band);
    }
}

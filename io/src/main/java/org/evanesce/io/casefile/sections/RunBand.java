package org.evanesce.io.casefile.sections;

import org.evanesce.io.casefile.model.FluxSpec;
import org.evanesce.io.casefile.model.MapsSpec;
import org.evanesce.io.casefile.model.SourceSpec;
import org.evanesce.io.casefile.text.Value;

import java.util.List;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.dispersion.WavelengthBand;

/**
 * The run's band of vacuum wavelengths, over which a metal's model is checked (a library fit's validity, a
 * single-wavelength model's values at its ends) and an n, k table is fitted: from the shortest to the longest
 * of the design wavelength, each source's centre wavelength, and the wavelengths of the flux spectra and the
 * maps.
 */
final class RunBand {

    private RunBand() {
    }

    /** The band, or null when no wavelength is known yet (a problem already reported). */
    static WavelengthBand of(Value designWavelength, List<SourceSpec> sources, FluxSpec flux, MapsSpec maps) {
        double lo = Double.POSITIVE_INFINITY;
        double hi = 0;
        double[] all = wavelengths(designWavelength, sources, flux, maps);
        for (double wl : all) {
            if (wl > 0 && Double.isFinite(wl)) {
                lo = Math.min(lo, wl);
                hi = Math.max(hi, wl);
            }
        }
        return hi > 0 ? new WavelengthBand(lo, hi) : null;
    }

    private static double[] wavelengths(Value designWavelength, List<SourceSpec> sources, FluxSpec flux, MapsSpec maps) {
        java.util.List<Double> out = new java.util.ArrayList<>();
        if (designWavelength != null) {
            out.add(designWavelength.si());
        }
        for (SourceSpec s : sources) {
            out.add(s.signal().wavelength());
        }
        if (flux != null) {
            flux.frequencies().forEach(f -> out.add(PhysicalConstants.C0 / f.si()));
        }
        if (maps != null) {
            maps.frequencies().forEach(f -> out.add(PhysicalConstants.C0 / f.si()));
        }
        return out.stream().mapToDouble(Double::doubleValue).toArray();
    }
}

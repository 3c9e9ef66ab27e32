package org.evanesce.io.plan.checks;

import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.model.MapsSpec;
import org.evanesce.io.casefile.model.MaterialSpec;
import org.evanesce.io.casefile.model.SignalSpec;
import org.evanesce.io.casefile.model.SourceSpec;
import org.evanesce.io.casefile.text.KeyPaths;
import org.evanesce.io.casefile.text.Located;
import org.evanesce.io.casefile.text.Value;

/**
 * Checks of {@code maps.normalise: incident}: the maps are divided by the incident field of a plane wave or Gaussian
 * beam, which must then be the case's only source and carry each map's frequency (a plane wave propagating at it,
 * a pulse with power there, a ramped wave at its own frequency only).
 */
final class MapNormaliseChecks {

    private final CaseSpec spec;
    private final KeyPaths paths;
    private final CaseChecks checks;

    MapNormaliseChecks(CaseSpec spec, KeyPaths paths, CaseChecks checks) {
        this.spec = spec;
        this.paths = paths;
        this.checks = checks;
    }

    /**
     * @param wave   the case's plane wave or beam, or null
     * @param medium its launching medium, or null (then an error about it has been reported)
     */
    void run(SourceSpec.Launched wave, MaterialSpec medium) {
        if (spec.maps().isEmpty() || spec.maps().get().normalise().value() != MapsSpec.Normalise.INCIDENT) {
            return;
        }
        MapsSpec maps = spec.maps().get();
        Located<MapsSpec.Normalise> key = maps.normalise();
        if (wave == null) {
            if (spec.sources().stream().anyMatch(s -> s instanceof SourceSpec.PlaneWaveBox)) {
                box(maps, key);
                return;
            }
            checks.error(key.at(), "maps.normalise", "'incident' divides the maps by the incident field of a plane_wave, "
                    + "gaussian_beam or plane_wave_box, and this case has none; expected normalise: absolute (the default) "
                    + "or such a source");
            return;
        }
        for (int k = 0; k < spec.sources().size(); k++) {
            if (!(spec.sources().get(k) instanceof SourceSpec.Launched)) {
                checks.error(key.at(), "maps.normalise", "'incident' needs the plane wave or beam as the only source (the "
                        + "incident field is its alone), but " + paths.sources().get(k) + " is a " + spec.sources().get(k).kind()
                        + " source; expected normalise: absolute (the default) or no other source");
                return;
            }
        }
        if (medium == null) {
            return;
        }
        double centre = wave.signal().frequency().si();
        double sin = Math.sin(wave.angle().si());
        for (Value f : maps.frequencies()) {
            String what = String.format("%s (%s)", Units.format(PhysicalConstants.C0 / f.si(), Dimension.LENGTH),
                    Units.format(f.si(), Dimension.FREQUENCY));
            if (wave instanceof SourceSpec.PlaneWave && Math.abs(sin * centre / f.si()) >= 1) {
                double fMin = Math.abs(sin) * centre;
                checks.error(f.at(), "maps", String.format("with normalise: incident, at %s the plane wave's in-plane "
                        + "wavenumber exceeds the wavenumber in %s (n = %s): no incident wave propagates there to divide by; "
                        + "expected map wavelengths below %s", what, medium.name(), Units.number(medium.index()),
                        Units.format(PhysicalConstants.C0 / fMin, Dimension.LENGTH)));
            } else if (wave.signal() instanceof SignalSpec.Pulse pulse) {
                double x = (f.si() - centre) / pulse.spectrumSigma();
                if (Math.exp(-x * x) < PlaneWaveChecks.MIN_SPECTRAL_POWER) {
                    checks.warn(f.at(), "maps", String.format("at %s the pulse carries %.1e of its peak power; the map "
                            + "relative to the incident field there is mostly round-off (widen the bandwidth or move the "
                            + "wavelength towards %s)", what, Math.exp(-x * x), Units.format(PhysicalConstants.C0 / centre,
                            Dimension.LENGTH)));
                }
            } else if (wave.signal() instanceof SignalSpec.RampedWave) {
                ownFrequency(f, what, centre);
            }
        }
    }

    /** A plane-wave box lights its inside with its wave: the only source, and each map at a ramped wave's frequency. */
    private void box(MapsSpec maps, Located<MapsSpec.Normalise> key) {
        for (int k = 0; k < spec.sources().size(); k++) {
            if (!(spec.sources().get(k) instanceof SourceSpec.PlaneWaveBox)) {
                checks.error(key.at(), "maps.normalise", "'incident' needs the plane_wave_box as the only source (the "
                        + "incident field is its alone), but " + paths.sources().get(k) + " is a " + spec.sources().get(k).kind()
                        + " source; expected normalise: absolute (the default) or no other source");
                return;
            }
        }
        if (spec.sources().size() > 1) {
            checks.error(key.at(), "maps.normalise", "'incident' divides by the incident field of one plane_wave_box, and "
                    + "this case has " + spec.sources().size() + "; expected normalise: absolute (the default) or one box");
            return;
        }
        SignalSpec signal = spec.sources().get(0).signal();
        if (!(signal instanceof SignalSpec.RampedWave)) {
            return; // a box takes only a ramped wave; its own check says so
        }
        double centre = signal.frequency().si();
        for (Value f : maps.frequencies()) {
            ownFrequency(f, String.format("%s (%s)", Units.format(PhysicalConstants.C0 / f.si(), Dimension.LENGTH),
                    Units.format(f.si(), Dimension.FREQUENCY)), centre);
        }
    }

    private void ownFrequency(Value f, String what, double centre) {
        if (Math.abs(f.si() / centre - 1) > 1e-9) {
            checks.error(f.at(), "maps", String.format("with normalise: incident, at %s: a ramped wave carries only its "
                    + "own frequency (%s), so its incident field is nearly zero at any other; expected the wave's own "
                    + "wavelength %s", what, Units.format(centre, Dimension.FREQUENCY),
                    Units.format(PhysicalConstants.C0 / centre, Dimension.LENGTH)));
        }
    }
}

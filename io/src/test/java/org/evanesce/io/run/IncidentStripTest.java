package org.evanesce.io.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.evanesce.io.plan.CaseLoader;
import org.evanesce.io.casefile.ReadOptions;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.io.plan.CasePlanner;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * A Bloch-periodic plane wave's incident power computed on a strip three cells wide against the full-width
 * incident-power run ({@code incident_run: full}): in one homogeneous medium the wave's fields differ from cell to
 * cell only by the phase e^{i kx Δx} (Floquet–Bloch: a field with in-plane wavenumber kx in a medium that does not
 * change with x; common practice), so the strip's run is the full width's one-dimensional problem and the
 * normalised results (T, R, A, where R subtracts the incident field) agree to round-off, and the incident value to
 * the same. Both ways are checked in s and p, with a pulse and a continuous wave, through a layered scene whose
 * reflectance is not small (the subtraction matters).
 */
class IncidentStripTest {

    /**
     * T, R and A of the strip against the full width, absolute: round-off of float fields (the issue asks for 1e-4).
     * Measured: at most 6.7e-8 over these four cases (s pulse; p pulse 1.0e-8, s and p continuous 1.3e-8 and
     * 4.9e-9), 4.7e-8 in the shipped plane-wave example.
     */
    static final double NORMALISED_TOLERANCE = 1e-6;
    /** The incident value (power or energy per hertz), relative: round-off. Measured: at most 5.6e-8. */
    static final double INCIDENT_TOLERANCE = 1e-6;

    private static final String CASE = """
            title: film between glass blocks, lit at an angle
            design_wavelength: 633 nm
            polarization: POL
            domain: {width: 0.3 um, height: 3.2 um, background: glass}
            grid: {cells_per_wavelength: 16}
            materials:
              glass: {index: 1.5}
              film: {index: 2.1}
            shapes:
              - layer_stack:
                  start: [0, -0.1 um]
                  layers: [{material: film, thickness: 0.2 um}]
            boundaries: {left: periodic, right: periodic, bottom: pml 0.5 um, top: pml 0.5 um}
            sources:
              - plane_wave:
                  y: -0.7 um
                  angle: 30 deg
                  signal: SIGNAL
            flux:
              wavelengths: WAVELENGTHS
              lines:
                - {name: front, y: -0.95 um, measures: reflected}
                - {name: back, y: 0.7 um, measures: transmitted}
              incident_run: RUN
            until: STOP
            """;

    private static CasePlan plan(String pol, boolean pulse, String run) throws Exception {
        String text = CASE.replace("POL", pol)
                .replace("SIGNAL", pulse ? "{pulse: {wavelength: 633 nm, bandwidth: 40 nm}}" : "{ramped_wave: {wavelength: 633 nm}}")
                .replace("WAVELENGTHS", pulse ? "{from: 610 nm, to: 660 nm, count: 6}" : "633 nm")
                .replace("STOP", pulse ? "{energy_below: 1e-7, latest: 400 fs}" : "{time: 250 fs}")
                .replace("RUN", run);
        return CasePlanner.plan(CaseLoader.parse(text, "film.yaml", Map.of(), ReadOptions.defaults()).spec(), 1);
    }

    @ParameterizedTest(name = "{0} polarization, pulse {1}")
    @CsvSource({"s, true", "p, true", "s, false", "p, false"})
    void stripAgreesWithTheFullWidth(String pol, boolean pulse) throws Exception {
        CasePlan strip = plan(pol, pulse, "strip");
        CasePlan full = plan(pol, pulse, "full");
        assertTrue(strip.flux().orElseThrow().strip().isPresent(), "a periodic plane wave gets the strip");
        assertFalse(full.flux().orElseThrow().strip().isPresent(), "incident_run: full steps the whole grid");
        assertNotEquals(strip.flux().orElseThrow().setupKey(), full.flux().orElseThrow().setupKey(),
                "the two ways have keys of their own");
        CaseRunner.Result a = CaseRunner.run(strip, null, 1, null, null, IncidentPowerCache.none());
        CaseRunner.Result b = CaseRunner.run(full, null, 1, null, null, IncidentPowerCache.none());
        assertTrue(a.incidentPower().strip() && !b.incidentPower().strip());
        assertEquals(b.steps(), a.steps());
        var p = strip.spec().polarization().value();
        FluxResults x = FluxResults.of(strip.flux().orElseThrow(), p);
        FluxResults y = FluxResults.of(full.flux().orElseThrow(), p);
        assertEquals(y.columns(), x.columns());
        String where = String.format("%s polarization, %s, %d x %d cells", pol, pulse ? "pulse" : "continuous wave",
                full.grid().nx(), full.grid().ny());
        double worst = 0;
        for (int q = 0; q < x.rows().size(); q++) {
            FluxResults.Row r = x.rows().get(q);
            FluxResults.Row s = y.rows().get(q);
            assertEquals(s.incident(), r.incident(), INCIDENT_TOLERANCE * Math.abs(s.incident()),
                    where + ": incident value at " + r.wavelength() * 1e9 + " nm");
            for (int k = 0; k < x.columns().size(); k++) {
                worst = Math.max(worst, Math.abs(r.values()[k] - s.values()[k]));
                assertEquals(s.values()[k], r.values()[k], NORMALISED_TOLERANCE,
                        where + ": " + x.columns().get(k) + " at " + r.wavelength() * 1e9 + " nm");
            }
        }
        double reflectance = y.rows().get(0).values()[0];
        assertTrue(reflectance > 0.01, where + ": the film reflects enough that the subtraction is tested: R = " + reflectance);
        assertTrue(worst > 0, where + ": two separate computations (the bound is not met by identical numbers)");

        // the settling check sees the same energy fraction (the strip's energies scale with the width)
        assertEquals(b.incidentPowerRunEnergyFraction(), a.incidentPowerRunEnergyFraction(),
                1e-3 * Math.max(1e-12, b.incidentPowerRunEnergyFraction()) + 1e-12, where + ": energy fraction");
    }
}

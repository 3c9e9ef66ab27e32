package org.evanesce.io.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.evanesce.io.casefile.ReadOptions;
import org.evanesce.io.plan.CaseLoader;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.io.plan.CasePlanner;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * A Bloch-periodic plane wave's incident power computed ({@link org.evanesce.solver.source.PlaneWaveResponse}, the
 * default {@code incident_run: auto}) against the stepped strip ({@code incident_run: strip}): the one-dimensional
 * problem of the wave's in-plane wavenumber in the frequency domain is the same linear problem the strip steps (the
 * z-transform of a time-invariant recurrence, Oppenheim &amp; Schafer, Discrete-Time Signal Processing, 3rd ed. 2010,
 * sec. 3.4; the strip stands for the full width to round-off, {@link IncidentStripTest}), so T, R (which subtracts
 * the incident field), A and the incident value agree up to what the stepped run adds: its PMLs' reflections, its
 * single-precision rounding. Checked in s and p, at
 * normal and oblique incidence, with pulses over several wavelengths (the lines reading every few steps), through an air gap in glass (frustrated total reflection beyond the critical angle, R and T both large so
 * the subtraction matters), a chromium film and a gold film under water (a surface-plasmon dip), with reflected lines
 * behind the source and between it and the structure. The sampling of the magnetic field half a step before the
 * electric one is part of the computation: leaving it out moves the incident power by about (ωΔt/2)²/2 and R by
 * more (tried: the test then fails).
 */
class PlaneWaveIncidentTest {

    /**
     * T, R and A, absolute: the bound. Measured (2026-12-04): gap s normal 5.5e-6, p 45° 3.9e-6, s 43° 4.8e-6,
     * chromium s 5.3e-7, p 2.2e-7, gold p 2.2e-6; 1.1e-5 in the shipped chromium example (whose pulse carries 6.6e-5
     * of its peak at the grazing frequency). What is left is the strip's PML reflections: the gap case with PMLs of
     * 47 cells instead of 24 came within 6.9e-7 instead of 5.5e-6.
     */
    static final double NORMALISED_TOLERANCE = 1e-4;
    /** The incident value, relative: the same reasons. Measured: at most 6.4e-6 (gap s normal). */
    static final double INCIDENT_TOLERANCE = 1e-4;

    private static final String GAP = """
            title: plane wave through an air gap in glass
            design_wavelength: 633 nm
            polarization: POL
            domain: {width: 0.1 um, height: 3.2 um, background: glass}
            grid: {cells_per_wavelength: 20}
            materials:
              glass: {index: 1.5}
              gap_air: {index: 1.0}
            shapes:
              - layer_stack:
                  start: [0, 0]
                  layers: [{material: gap_air, thickness: 0.15 um}]
            boundaries: {left: periodic, right: periodic, bottom: pml 0.5 um, top: pml 0.5 um}
            sources:
              - plane_wave: {y: -0.6 um, angle: ANGLE, signal: SIGNAL}
            flux:
              wavelengths: WAVELENGTHS
              lines:
                - {name: behind, y: -0.9 um, measures: reflected}
                - {name: before, y: -0.3 um, measures: reflected}
                - {name: out, y: 0.7 um, measures: transmitted}
              incident_run: RUN
            until: STOP
            """;

    private static final String FILM = """
            title: metal film on glass
            design_wavelength: 633 nm
            polarization: POL
            domain: {width: 40 nm, height: 1.4 um, background: INCIDENCE}
            grid: {cells_per_wavelength: CPW}
            materials:
              glass: {index: 1.515}
              metal: {library: METAL}
            shapes:
              - layer_stack:
                  start: [0, 0]
                  layers: [{material: metal, thickness: THICKNESS}]
              - half_plane: {through: [0, THICKNESS], fill: above, material: EXIT}
            boundaries: {left: periodic, right: periodic, bottom: pml 0.2 um, top: pml 0.2 um}
            sources:
              - plane_wave: {y: -0.25 um, angle: ANGLE, signal: SIGNAL}
            flux:
              wavelengths: WAVELENGTHS
              lines:
                - {name: behind, y: -0.35 um, measures: reflected}
                - {name: out, y: 0.3 um, measures: transmitted}
              incident_run: RUN
            until: STOP
            """;

    private static final String PULSE = "{pulse: {wavelength: 633 nm, bandwidth: 60 nm}}";
    private static final String PULSE_STOP = "{energy_below: 1e-7, latest: 400 fs}";
    private static final String PULSE_WAVELENGTHS = "{from: 600 nm, to: 670 nm, count: 5}";

    private static String gap(String pol, String angle, boolean pulse) {
        return GAP.replace("POL", pol).replace("ANGLE", angle)
                .replace("SIGNAL", pulse ? PULSE : "{ramped_wave: {wavelength: 633 nm, ramp: 30 fs}}")
                .replace("WAVELENGTHS", pulse ? PULSE_WAVELENGTHS : "633 nm")
                .replace("STOP", pulse ? PULSE_STOP : "{time: 200 fs}");
    }

    /**
     * A chromium film under a pulse from air (as the shipped attenuator example), or gold under water lit from glass near
     * its plasmon dip (70°, the sensor example's materials, with a pulse whose band stays above the grazing frequency).
     */
    private static String film(String pol, boolean chromium) {
        return FILM.replace("POL", pol)
                .replace("INCIDENCE", chromium ? "air" : "glass").replace("EXIT", chromium ? "glass" : "water")
                .replace("CPW", chromium ? "633 nm / 4 nm" : "633 nm / (1.515 * 8 nm)")
                .replace("METAL", chromium ? "chromium" : "gold").replace("THICKNESS", chromium ? "12 nm" : "48 nm")
                .replace("ANGLE", chromium ? "30 deg" : "70 deg")
                .replace("SIGNAL", chromium ? PULSE : "{pulse: {wavelength: 633 nm, bandwidth: 10 nm}}")
                .replace("WAVELENGTHS", chromium ? PULSE_WAVELENGTHS : "{from: 628 nm, to: 638 nm, count: 3}")
                .replace("STOP", PULSE_STOP);
    }

    private static CasePlan plan(String text, String run) throws Exception {
        return CasePlanner.plan(CaseLoader.parse(text.replace("RUN", run), "plane.yaml", Map.of(), ReadOptions.defaults())
                .spec(), 1);
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource({
            "gap s normal pulse, s, 0 deg, true",
            "gap p oblique pulse, p, 45 deg, true",
            "gap s oblique pulse beyond the critical angle, s, 43 deg, true",
    })
    void computedAgreesWithTheStrip(String what, String pol, String angle, boolean pulse) throws Exception {
        double worst = compare(what, gap(pol, angle, pulse), 0.01);
        System.out.printf("PlaneWaveIncidentTest %s: worst |T, R difference| %.3g%n", what, worst);
    }

    @ParameterizedTest(name = "{0} polarization")
    @CsvSource({"s", "p"})
    void aMetalFilmUnderAPulse(String pol) throws Exception {
        double worst = compare("chromium film, " + pol, film(pol, true), 0.01);
        System.out.printf("PlaneWaveIncidentTest chromium film %s: worst |T, R, A difference| %.3g%n", pol, worst);
    }

    @Test
    void aGoldFilmUnderAPulseNearItsPlasmonDip() throws Exception {
        // near the dip R is small, so the incident field's subtraction decides it
        double worst = compare("gold film under water, p", film("p", false), 0.01);
        System.out.printf("PlaneWaveIncidentTest gold film p: worst |T, R, A difference| %.3g%n", worst);
    }

    @Test
    void pulsesReachingTheGrazingFrequencyKeepTheStrip() throws Exception {
        // 50 deg in glass: the pulse's spectrum at the grazing frequency is 2.2e-4 of its peak (computed: T and R 1.9e-5
        // from the strip's); the gold film at its dip, 74.8 deg, with a 20 nm pulse: 0.2 (1.8 % in incident power)
        assertTrue(plan(gap("s", "50 deg", true), "auto").flux().orElseThrow().strip().isPresent(), "50 deg");
        String dip = film("p", false).replace("70 deg", "74.8 deg").replace("bandwidth: 10 nm", "bandwidth: 20 nm");
        assertTrue(plan(dip, "auto").flux().orElseThrow().strip().isPresent(), "the dip");
        assertTrue(plan(gap("s", "43 deg", true), "auto").flux().orElseThrow().computed().isPresent(), "43 deg");
    }

    @Test
    void rampedWavesKeepTheStrip() throws Exception {
        for (String pol : new String[] {"s", "p"}) {
            var flux = plan(gap(pol, "30 deg", false), "auto").flux().orElseThrow();
            assertTrue(flux.strip().isPresent() && flux.computed().isEmpty(), pol + ": a ramped wave's window holds what its "
                    + "switch-on leaves, which the strip's run holds too");
        }
    }

    /**
     * Runs the case computed and on the strip, checks every column and the incident value, and returns the largest
     * difference of T, R and A.
     *
     * @param leastReflectance the smallest R the stepped run must show (so that the subtraction is tested)
     */
    private static double compare(String what, String text, double leastReflectance) throws Exception {
        CasePlan computed = plan(text, "auto");
        CasePlan stepped = plan(text, "strip");
        assertTrue(computed.flux().orElseThrow().computed().isPresent(), what + ": a periodic plane wave gets the computation");
        assertFalse(computed.flux().orElseThrow().strip().isPresent(), what + ": and no strip");
        assertTrue(stepped.flux().orElseThrow().strip().isPresent(), what + ": incident_run: strip steps the strip");
        assertFalse(stepped.flux().orElseThrow().computed().isPresent(), what);
        assertNotEquals(computed.flux().orElseThrow().setupKey(), stepped.flux().orElseThrow().setupKey(),
                what + ": the two ways have keys of their own");
        CaseRunner.Result a = CaseRunner.run(computed, null, 1, null, null, IncidentPowerCache.none());
        CaseRunner.Result b = CaseRunner.run(stepped, null, 1, null, null, IncidentPowerCache.none());
        assertTrue(a.incidentPower().computed() && !b.incidentPower().computed() && b.incidentPower().strip(), what);
        assertEquals("computed", a.incidentPower().record().get("run"), what);
        assertTrue(a.stopReason().contains("computed from the plane wave's sheet"), what + ": " + a.stopReason());
        assertEquals(b.steps(), a.steps(), what);
        var p = computed.spec().polarization().value();
        FluxResults x = FluxResults.of(computed.flux().orElseThrow(), p);
        FluxResults y = FluxResults.of(stepped.flux().orElseThrow(), p);
        assertEquals(y.columns(), x.columns(), what);
        String where = String.format("%s, %d x %d cells, %d steps", what, stepped.grid().nx(), stepped.grid().ny(), b.steps());
        double worst = 0;
        double worstIncident = 0;
        double leastR = Double.POSITIVE_INFINITY;
        for (int q = 0; q < x.rows().size(); q++) {
            FluxResults.Row r = x.rows().get(q);
            FluxResults.Row s = y.rows().get(q);
            worstIncident = Math.max(worstIncident, Math.abs(r.incident() / s.incident() - 1));
            assertEquals(s.incident(), r.incident(), INCIDENT_TOLERANCE * Math.abs(s.incident()),
                    where + ": incident value at " + r.wavelength() * 1e9 + " nm");
            for (int k = 0; k < x.columns().size(); k++) {
                String c = x.columns().get(k);
                if (c.startsWith("angle")) {
                    continue;
                }
                worst = Math.max(worst, Math.abs(r.values()[k] - s.values()[k]));
                if (c.startsWith("R_")) {
                    leastR = Math.min(leastR, s.values()[k]);
                }
                assertEquals(s.values()[k], r.values()[k], NORMALISED_TOLERANCE, where + ": " + c + " at "
                        + r.wavelength() * 1e9 + " nm");
            }
        }
        assertTrue(leastR > leastReflectance, where + ": R is large enough that the subtraction is tested: " + leastR);
        assertTrue(worst > 0, where + ": two separate computations (the bound is not met by identical numbers)");
        System.out.printf("PlaneWaveIncidentTest %s: incident value within %.3g relative%n", where, worstIncident);
        return worst;
    }
}

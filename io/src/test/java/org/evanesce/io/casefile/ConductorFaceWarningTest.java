package org.evanesce.io.casefile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.evanesce.io.casefile.text.Diagnostic;
import org.evanesce.io.plan.CaseLoader;
import org.junit.jupiter.api.Test;

/**
 * A perfect conductor with faces off the grid's axes in p polarization is warned about (its staircase is first order
 * with a large error in p: PecCylinderTest in the solver measures +6.2 % forward scattering width at 180 cells per
 * wavelength); faces along the axes (exact: a flat mirror on a grid line reflects with r = -1 to a few parts in 1e6,
 * PerfectConductorMirrorTest) and s polarization are not.
 */
class ConductorFaceWarningTest {

    private static final ReadOptions ENOUGH_MEMORY = new ReadOptions(1L << 34);

    private static final String CASE = """
            polarization: POL
            design_wavelength: 633 nm
            materials:
              screen: {perfect_conductor: true}
            domain: {width: 2 um, height: 2 um}
            shapes:
              - rectangle: {centre: [0, -0.2 um], size: [1 um, 50 nm], rotation: ROT, material: screen}
              - SHAPE
            boundaries: {all: pml 0.3 um}
            grid: {cell: 10 nm}
            sources:
              - point: {at: [0, -0.5 um], signal: {ramped_wave: {wavelength: 633 nm}}}
            until: {time: 20 fs}
            """;

    private static List<String> warnings(String pol, String rot, String shape) throws CaseFileException {
        String text = CASE.replace("POL", pol).replace("ROT", rot).replace("SHAPE", shape);
        return CaseLoader.parse(text, "case.yaml", Map.of(), ENOUGH_MEMORY).warnings().stream().map(Diagnostic::toString)
                .filter(w -> w.contains("perfect conductor")).toList();
    }

    @Test
    void curvedOrTiltedConductorFacesInPAreWarnedAbout() throws CaseFileException {
        List<String> w = warnings("p", "0", "disk: {centre: [0, 0.5 um], radius: 100 nm, material: screen}");
        assertEquals(1, w.size(), w.toString());
        assertTrue(w.get(0).startsWith("case.yaml:8:5: warning: shapes[1].disk: the perfect conductor screen has faces off the "
                + "grid's axes and the run is in p polarization"), w.get(0));
        assertEquals(2, warnings("p", "30", "polygon: {corners: [[0, 0.3 um], [0.3 um, 0.3 um], [0.3 um, 0.6 um]], material: screen}")
                .size(), "a rotated rectangle and a polygon with a slanted edge");
    }

    @Test
    void facesAlongTheAxesAndSPolarizationAreNot() throws CaseFileException {
        assertEquals(List.of(), warnings("p", "90", "polygon: {corners: [[0, 0.3 um], [0.3 um, 0.3 um], [0.3 um, 0.6 um], "
                + "[0, 0.6 um]], material: screen}"));
        assertEquals(List.of(), warnings("s", "30", "disk: {centre: [0, 0.5 um], radius: 100 nm, material: screen}"));
        assertEquals(List.of(), warnings("p", "0", "disk: {centre: [0, 0.5 um], radius: 100 nm, material: vacuum}"));
    }
}

package org.evanesce.io.plan;

import static org.evanesce.geometry.PhysicalConstants.C0;
import static org.evanesce.geometry.PhysicalConstants.EPS0;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.evanesce.geometry.Complex;
import org.evanesce.io.casefile.CaseFileException;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.ReadOptions;
import org.evanesce.io.plan.LayeredProfile.Band;
import org.evanesce.io.plan.LayeredProfile.Direction;
import org.evanesce.io.plan.LayeredProfile.Result;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.reference.PlanarStack;
import org.junit.jupiter.api.Test;

/**
 * Layered scenes are recognised with their band edges as written in the case, other scenes are refused with
 * a true statement of where they differ, and the stack built from the bands transmits what the closed forms
 * for a gap and a slab say.
 */
class LayeredProfileTest {

    private static final ReadOptions ENOUGH_MEMORY = new ReadOptions(1L << 34);
    /** The cell of every case here, as written: the gap below is 173/30 = 5.77 cells, not a whole number. */
    private static final double CELL = 30e-9;
    /** Edges are bracketed to 1e-6 of a cell; lengths written in the case pass through one decimal rounding. */
    private static final double EDGE_TOLERANCE = 1e-6 * CELL;
    /** The gap and glass index as written in {@link #GAP_CASE}. */
    private static final double GAP = 173e-9;
    private static final double GLASS = 1.5;
    private static final double WAVELENGTH = 633e-9;
    /**
     * Transmittance against a closed form: the gap found is within 1e-6 of a cell (3e-14 m) of the written one,
     * which moves T by about 2κ·Δd ≈ 6e-7 relative beyond the critical angle (κ ≈ 1e7 /m) and less below it;
     * the transfer matrix itself is exact to rounding.
     */
    private static final double TRANSMITTANCE_REL = 2e-6;
    /** The index from the case's permittivity and conductivity: only rounding separates the two computations. */
    private static final double INDEX_REL = 1e-12;


    private static final String HEAD = """
            polarization: s
            design_wavelength: 633 nm
            domain: {width: 4 um, height: 3 um}
            grid: {cell: 30 nm}
            sources:
              - point: {at: [0, -1 um], signal: {pulse: {wavelength: 633 nm, bandwidth: 40 nm}}}
            until: {time: 100 fs}
            """;

    /** Two glass half-planes with a vacuum gap of 173 nm centred on y = 0. */
    private static final String GAP_CASE = HEAD + """
            parameters:
              gap: 173 nm
            materials:
              glass: {index: 1.5}
            shapes:
              - half_plane: {through: [0, -gap/2], fill: below, material: glass}
              - half_plane: {through: [0, gap/2], fill: above, material: glass}
            """;

    private static final String STACK_CASE = HEAD + """
            materials:
              film: {index: 1.38}
              lossy: {permittivity: 2.25, conductivity: 1e4 S/m}
            shapes:
              - layer_stack:
                  start: [0, 0.3 um]
                  layers:
                    - {material: film, thickness: 100 nm}
                    - {material: lossy, thickness: 250 nm}
            """;

    private static CaseSpec read(String text) throws CaseFileException {
        return CaseLoader.parse(text, "case.yaml", Map.of(), ENOUGH_MEMORY).spec();
    }

    /** The profile over the whole domain, the way a run would ask for it. */
    private static Result profile(CaseSpec spec) {
        return LayeredProfile.of(spec, spec.domain().xMin(), spec.domain().xMax(), spec.domain().yMin(),
                spec.domain().yMax(), CELL);
    }

    private static List<Band> bands(CaseSpec spec) {
        Result r = profile(spec);
        assertTrue(r.isLayered(), () -> "expected a layered scene, got: " + r.whyNot());
        assertEquals("", r.whyNot());
        return r.bands().orElseThrow();
    }

    private static void assertBand(String material, double yLow, double yHigh, Band band) {
        assertEquals(material, band.material(), band.toString());
        assertEquals(yLow, band.yLow(), EDGE_TOLERANCE, "lower edge of " + band);
        assertEquals(yHigh, band.yHigh(), EDGE_TOLERANCE, "upper edge of " + band);
    }

    @Test
    void gapOfAFractionalNumberOfCellsHasItsWrittenEdges() throws CaseFileException {
        List<Band> b = bands(read(GAP_CASE));
        assertEquals(3, b.size(), b.toString());
        assertBand("glass", -1.5e-6, -GAP / 2, b.get(0));
        assertBand("vacuum", -GAP / 2, GAP / 2, b.get(1));
        assertBand("glass", GAP / 2, 1.5e-6, b.get(2));
        assertEquals(GAP, b.get(1).thickness(), EDGE_TOLERANCE, "gap thickness");
    }

    @Test
    void layerStackGivesItsLayersInTheDirectionOfTravel() throws CaseFileException {
        CaseSpec spec = read(STACK_CASE);
        List<Band> b = bands(spec);
        assertEquals(4, b.size(), b.toString());
        assertBand("vacuum", -1.5e-6, 0.3e-6, b.get(0));
        assertBand("film", 0.3e-6, 0.4e-6, b.get(1));
        assertBand("lossy", 0.4e-6, 0.65e-6, b.get(2));
        assertBand("vacuum", 0.65e-6, 1.5e-6, b.get(3));

        Complex lossy = independentIndex(2.25, 1e4, WAVELENGTH);
        PlanarStack up = LayeredProfile.stack(b, spec.materials(), WAVELENGTH, Direction.UP);
        assertEquals(1.0, up.incidentIndex(), 0, "vacuum");
        assertEquals(2, up.layers().size());
        assertIndex(Complex.real(1.38), up.layers().get(0).index(), "film");
        assertEquals(100e-9, up.layers().get(0).thickness(), EDGE_TOLERANCE, "film thickness");
        assertIndex(lossy, up.layers().get(1).index(), "lossy layer");
        assertEquals(250e-9, up.layers().get(1).thickness(), EDGE_TOLERANCE, "lossy thickness");
        assertIndex(Complex.ONE, up.exitIndex(), "vacuum above");

        PlanarStack down = LayeredProfile.stack(b, spec.materials(), WAVELENGTH, Direction.DOWN);
        assertIndex(lossy, down.layers().get(0).index(), "lossy layer met first going down");
        assertEquals(250e-9, down.layers().get(0).thickness(), EDGE_TOLERANCE, "lossy thickness");
        assertIndex(Complex.real(1.38), down.layers().get(1).index(), "film met second going down");
    }

    /**
     * n + iκ from εr + iσ/(ωε0) without a complex square root: (n + iκ)² = ε' + iε'' gives n² − κ² = ε' and
     * 2nκ = ε'', so n = sqrt((|ε| + ε')/2), κ = sqrt((|ε| − ε')/2) (κ ≥ 0 for ε'' ≥ 0); exp(−iωt) convention.
     */
    private static Complex independentIndex(double permittivity, double conductivity, double wavelength) {
        double omega = 2 * Math.PI * C0 / wavelength;
        double imag = conductivity / (omega * EPS0);
        double modulus = Math.hypot(permittivity, imag);
        return Complex.of(Math.sqrt((modulus + permittivity) / 2), Math.sqrt((modulus - permittivity) / 2));
    }

    private static void assertIndex(Complex expected, Complex actual, String what) {
        double err = actual.minus(expected).abs();
        assertTrue(err <= INDEX_REL * expected.abs(), what + ": expected " + expected + ", got " + actual);
    }

    @Test
    void conductiveIndexMatchesItsDefinition() throws CaseFileException {
        CaseSpec spec = read(STACK_CASE);
        Complex n = LayeredProfile.complexIndex(spec.materials().get("lossy"), WAVELENGTH);
        assertIndex(independentIndex(2.25, 1e4, WAVELENGTH), n, "lossy at 633 nm");
        assertTrue(n.im() > 0.1, "1e4 S/m at 633 nm gives a clearly lossy index, got " + n);
        assertIndex(Complex.real(1.38), LayeredProfile.complexIndex(spec.materials().get("film"), WAVELENGTH), "film");
    }

    @Test
    void lossyIncidenceMediumIsRefused() throws CaseFileException {
        CaseSpec spec = read(STACK_CASE);
        List<Band> b = List.of(new Band("lossy", 0, 1e-6), new Band("vacuum", 1e-6, 2e-6));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> LayeredProfile.stack(b, spec.materials(), WAVELENGTH, Direction.UP));
        assertTrue(e.getMessage().contains("lossy") && e.getMessage().contains("10000 S/m"), e.getMessage());
        // the same bands crossed downwards start in vacuum: fine
        assertEquals(1.0, LayeredProfile.stack(b, spec.materials(), WAVELENGTH, Direction.DOWN).incidentIndex(), 0);
    }

    @Test
    void rotatedHalfPlaneIsNotLayered() throws CaseFileException {
        CaseSpec spec = read(HEAD + """
                materials:
                  glass: {index: 1.5}
                shapes:
                  - half_plane: {through: [0, 0], fill: above, rotation: 5 deg, material: glass}
                """);
        assertStatementIsTrue(spec, profile(spec));
    }

    @Test
    void diskIsNotLayered() throws CaseFileException {
        CaseSpec spec = read(GAP_CASE + """
                  - disk: {centre: [1.3 um, 0.6 um], radius: 0.5 um, material: vacuum}
                """);
        assertStatementIsTrue(spec, profile(spec));
    }

    @Test
    void smallDiskAmongLayersIsNoticed() throws CaseFileException {
        // 80 nm across in a 4 um wide domain: sampling a few columns spread over the width would pass it by
        CaseSpec spec = read(GAP_CASE + """
                  - disk: {centre: [1.1 um, 0.5 um], radius: 40 nm, material: vacuum}
                """);
        assertStatementIsTrue(spec, profile(spec));
    }

    private static final Pattern STATEMENT = Pattern.compile(
            "at y = (\\S+ \\w+) the material is (\\w+) at x = (\\S+ \\w+) but (\\w+) at x = (\\S+ \\w+)");

    /** The reason names a point in the case's units where the two columns really differ. */
    private static void assertStatementIsTrue(CaseSpec spec, Result r) {
        assertFalse(r.isLayered(), "expected the scene not to be layered");
        Matcher m = STATEMENT.matcher(r.whyNot());
        assertTrue(m.matches(), "reason reads: " + r.whyNot());
        double y = metres(m.group(1));
        assertEquals(m.group(2), spec.materialAt(metres(m.group(3)), y), r.whyNot());
        assertEquals(m.group(4), spec.materialAt(metres(m.group(5)), y), r.whyNot());
        assertFalse(m.group(2).equals(m.group(4)), r.whyNot());
    }

    private static double metres(String length) {
        String[] p = length.split(" ");
        double unit = switch (p[1]) {
            case "nm" -> 1e-9;
            case "um" -> 1e-6;
            case "mm" -> 1e-3;
            case "m" -> 1.0;
            default -> throw new AssertionError("unit " + p[1] + " in " + length);
        };
        return Double.parseDouble(p[0]) * unit;
    }

    /**
     * Frustrated total internal reflection across the vacuum gap (n2 = 1) between glass half-spaces (n1 = 1.5),
     * 50° beyond the critical angle of 41.8°: 1/T = 1 + α sinh²(κd) with k = n1 k0 cos θ, κ = k0 sqrt(n1² sin²θ − n2²)
     * (S. Zhu, A. W. Yu, D. Hawley, R. Roy, "Frustrated total internal reflection: a demonstration and review",
     * Am. J. Phys. 54, 601 (1986)). For s, where E and ∂E/∂z are continuous, α = ((k² + κ²)/(2kκ))², the
     * rectangular-barrier result; for p the continuous quantities are H and (1/ε)∂H/∂z, so the same algebra gives
     * α with k/n1² and κ/n2² in place of k and κ.
     */
    @Test
    void gapStackTransmitsAsFrustratedTotalReflection() throws CaseFileException {
        CaseSpec spec = read(GAP_CASE);
        double theta = Math.toRadians(50);
        double k0 = 2 * Math.PI / WAVELENGTH;
        double n2 = 1.0;
        double k = GLASS * k0 * Math.cos(theta);
        double kappa = k0 * Math.sqrt(GLASS * GLASS * Math.sin(theta) * Math.sin(theta) - n2 * n2);
        for (Polarization pol : Polarization.values()) {
            double a = pol == Polarization.S ? k : k / (GLASS * GLASS);
            double b = pol == Polarization.S ? kappa : kappa / (n2 * n2);
            double alpha = Math.pow((a * a + b * b) / (2 * a * b), 2);
            double sinh = Math.sinh(kappa * GAP);
            double expected = 1 / (1 + alpha * sinh * sinh);
            for (Direction dir : Direction.values()) {
                PlanarStack stack = LayeredProfile.stack(bands(spec), spec.materials(), WAVELENGTH, dir);
                double t = stack.atAngle(pol, WAVELENGTH, theta).transmittance();
                assertEquals(expected, t, TRANSMITTANCE_REL * expected, pol + ", " + dir + ", 50 deg, 173 nm gap");
            }
        }
    }

    /**
     * Below the critical angle the gap is a lossless slab: T = 1/(1 + F sin²(δ/2)), F = 4R/(1 − R)²,
     * δ = 4π n2 d cos θ2 / λ0 (M. Born, E. Wolf, Principles of Optics, 7th ed., sec. 7.6.1), with R the
     * single-interface reflectance from Fresnel's formulas r_s = (n1 cos θ1 − n2 cos θ2)/(n1 cos θ1 + n2 cos θ2),
     * r_p = (n2 cos θ1 − n1 cos θ2)/(n2 cos θ1 + n1 cos θ2) (Born &amp; Wolf sec. 1.5.2).
     */
    @Test
    void gapStackTransmitsAsAnAirySlabBelowTheCriticalAngle() throws CaseFileException {
        CaseSpec spec = read(GAP_CASE);
        double theta1 = Math.toRadians(20);
        double n1 = GLASS;
        double n2 = 1.0;
        double theta2 = Math.asin(n1 * Math.sin(theta1) / n2);
        double c1 = Math.cos(theta1);
        double c2 = Math.cos(theta2);
        double delta = 4 * Math.PI * n2 * GAP * c2 / WAVELENGTH;
        for (Polarization pol : Polarization.values()) {
            double r = pol == Polarization.S ? (n1 * c1 - n2 * c2) / (n1 * c1 + n2 * c2)
                    : (n2 * c1 - n1 * c2) / (n2 * c1 + n1 * c2);
            double reflectance = r * r;
            double f = 4 * reflectance / Math.pow(1 - reflectance, 2);
            double expected = 1 / (1 + f * Math.pow(Math.sin(delta / 2), 2));
            PlanarStack stack = LayeredProfile.stack(bands(spec), spec.materials(), WAVELENGTH, Direction.UP);
            double t = stack.atAngle(pol, WAVELENGTH, theta1).transmittance();
            assertEquals(expected, t, TRANSMITTANCE_REL * expected, pol + ", 20 deg, 173 nm slab of vacuum in glass");
        }
    }

    @Test
    void homogeneousSceneIsOneBand() throws CaseFileException {
        CaseSpec spec = read(HEAD);
        List<Band> b = bands(spec);
        assertEquals(List.of(new Band("vacuum", -1.5e-6, 1.5e-6)), b);
        PlanarStack stack = LayeredProfile.stack(b, spec.materials(), WAVELENGTH, Direction.UP);
        assertEquals(0, stack.layers().size());
        // a single medium reflects nothing: T = 1 exactly (Fresnel with equal indices)
        assertEquals(1.0, stack.atAngle(Polarization.S, WAVELENGTH, 0.3).transmittance(), 1e-15);
    }
}

package org.evanesce.io.casefile.sections;

import static org.evanesce.geometry.PhysicalConstants.C0;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.evanesce.io.casefile.CaseFileException;
import org.evanesce.io.plan.CaseLoader;
import org.evanesce.io.plan.grid.GridDerivation;
import org.evanesce.io.plan.grid.GridPlan;
import org.evanesce.io.casefile.LoadedCase;
import org.evanesce.io.casefile.ReadOptions;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.model.BoundarySpec;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.model.LibraryMaterial;
import org.evanesce.io.casefile.model.OutputSpec;
import org.evanesce.io.casefile.model.Parameter;
import org.evanesce.io.casefile.model.ShapeSpec;
import org.evanesce.io.casefile.model.SignalSpec;
import org.evanesce.io.casefile.model.SourceSpec;
import org.evanesce.io.casefile.model.StopSpec;
import org.evanesce.io.casefile.text.Diagnostic;
import org.evanesce.io.casefile.text.Located;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** A valid case reads into the expected SI values, with defaults and command-line overrides. */
class CaseReaderTest {

    /** Values written with units pass through one or two roundings. */
    private static final double REL = 1e-12;
    private static final ReadOptions ENOUGH_MEMORY = new ReadOptions(1L << 34);

    static final String FULL = """
            title: Two-prism gap
            parameters:
              gap: 0.2 um
              wl: 633 nm
              theta: 50 deg
              half_gap: gap/2
            design_wavelength: wl
            polarization: s
            domain:
              width: 12 um
              height: 10 um
              background: air
            grid:
              cells_per_wavelength: 20
            materials:
              glass: {library: borosilicate_crown}
              film: {index: 1.38}
              lossy: {permittivity: 2.25, conductivity: 1e4 S/m}
            shapes:
              - half_plane: {through: [0, -half_gap], fill: below, material: glass}
              - half_plane: {through: [0, half_gap], fill: above, rotation: 10, material: glass}
              - rectangle: {centre: [3 um, 0], size: [1 um, gap], rotation: 30, material: film}
              - polygon: {corners: [[-5 um, 2 um], [-4 um, 2 um], [-4.5 um, 3 um]], rotation: 90, material: lossy}
              - disk: {centre: [4 um, 3 um], radius: 0.3 um, material: water}
              - ellipse: {centre: [-4 um, -3 um], radii: [0.5 um, 0.2 um], rotation: 30, material: fused_silica}
              - layer_stack:
                  start: [0, 3.5 um]
                  layers:
                    - {material: film, thickness: 100 nm}
                    - {material: glass, thickness: 200 nm}
            boundaries:
              all: pml 1 um
              top: pml 24
              bottom: pec
              right: pml
            sources:
              - line:
                  from: [-3 um, -3 um]
                  to: [3 um, -3 um]
                  angle: theta
                  waist: 2 um
                  amplitude: 2
                  signal:
                    pulse: {wavelength: wl, bandwidth: 40 nm}
              - point:
                  at: [0, -2 um]
                  component: hy
                  signal:
                    ramped_wave: {frequency: 474 THz, ramp: 20 fs}
            probes:
              - {name: transmitted, at: [0, 2 um], component: hx}
              - at: [0, -2.5 um]
            output:
              folder: results/gap
              write: [probes, field_frames, preview]
              frame_interval: 5 fs
            until:
              energy_below: 1e-5
              latest: 2 ps
            numerics:
              precision: double
              threads: 4
              courant: 0.5
            """;

    static LoadedCase read(String text, Map<String, String> overrides) throws CaseFileException {
        return CaseLoader.parse(text, "case.yaml", overrides, ENOUGH_MEMORY);
    }

    private static void assertSi(double expected, Value actual, String what) {
        assertEquals(expected, actual.si(), Math.abs(expected) * REL, what);
    }

    private static void assertAt(int line, int column, SourcePosition at, String what) {
        assertEquals("case.yaml:" + line + ":" + column, at.toString(), what);
    }

    @Test
    void fullCaseResolvesToSiValues() throws CaseFileException {
        LoadedCase loaded = read(FULL, Map.of());
        CaseSpec c = loaded.spec();
        assertEquals(Optional.of("Two-prism gap"), c.title());
        assertEquals(Polarization.S, c.polarization().value());
        assertSi(633e-9, c.designWavelength(), "design wavelength");
        assertAt(7, 20, c.designWavelength().at(), "design wavelength");

        Parameter halfGap = c.parameters().get("half_gap");
        assertEquals(0.1e-6, halfGap.value().value(), 0.1e-6 * REL);
        assertEquals(Dimension.LENGTH, halfGap.value().dimension());
        assertEquals("gap/2", halfGap.expression());
        assertAt(6, 13, halfGap.at(), "half_gap");

        assertSi(12e-6, c.domain().width(), "width");
        assertSi(10e-6, c.domain().height(), "height");
        assertAt(10, 10, c.domain().width().at(), "width");
        assertEquals("air", c.domain().background().value());

        // the cell size picked from 20 cells per wavelength in the densest material, borosilicate crown
        double nGlass = LibraryMaterial.BOROSILICATE_CROWN.index(633e-9);
        double cell = 633e-9 / (nGlass * 20);
        assertSi(20, c.grid().cellsPerWavelength().orElseThrow(), "cells per wavelength asked for");
        GridPlan grid = GridDerivation.derive(c, new java.util.ArrayList<>());
        assertSi(cell, grid.cellSize(), "cell");
        assertEquals((int) Math.ceil(12e-6 / cell) + 1, grid.nx());
        assertEquals((int) Math.ceil(10e-6 / cell) + 1, grid.ny());
        assertSi(20, grid.cellsPerWavelength().orElseThrow(), "cells per wavelength");
        assertTrue(loaded.notes().stream().anyMatch(d -> d.toString().startsWith(
                "case.yaml:14:25: note: grid.cells_per_wavelength: cell size 20.89 nm: 20 cells per wavelength of 633 nm in glass (n = 1.51508)")),
                loaded.notes().toString());

        // materials: defined, built in and used directly, all at the design wavelength; unused ones are left out
        assertEquals(List.of("air", "glass", "film", "lossy", "water", "fused_silica"), List.copyOf(c.materials().keySet()));
        assertSi(nGlass * nGlass, c.materials().get("glass").relativePermittivity(), "glass");
        assertEquals(Optional.of(LibraryMaterial.BOROSILICATE_CROWN), c.materials().get("glass").library());
        assertSi(1.38 * 1.38, c.materials().get("film").relativePermittivity(), "film");
        assertSi(2.25, c.materials().get("lossy").relativePermittivity(), "lossy");
        assertSi(1e4, c.materials().get("lossy").conductivity(), "lossy conductivity");
        assertEquals(0.0, c.materials().get("film").conductivity().si());
        double nWater = LibraryMaterial.WATER.index(633e-9);
        assertSi(nWater * nWater, c.materials().get("water").relativePermittivity(), "water");

        // shapes, in order
        assertEquals(List.of("half_plane", "half_plane", "rectangle", "polygon", "disk", "ellipse", "layer_stack"),
                c.shapes().stream().map(ShapeSpec::kind).toList());
        ShapeSpec.HalfPlane lower = (ShapeSpec.HalfPlane) c.shapes().get(0);
        assertSi(-0.1e-6, lower.through().y(), "half-plane through");
        assertSi(-Math.PI / 2, lower.inward(), "below");
        ShapeSpec.HalfPlane upper = (ShapeSpec.HalfPlane) c.shapes().get(1);
        assertSi(Math.PI / 2 + Math.toRadians(10), upper.inward(), "above, turned by 10 deg");
        ShapeSpec.Rectangle rect = (ShapeSpec.Rectangle) c.shapes().get(2);
        assertSi(3e-6, rect.centre().x(), "rectangle x");
        assertSi(1e-6, rect.width(), "rectangle width");
        assertSi(0.2e-6, rect.height(), "rectangle height");
        assertSi(Math.toRadians(30), rect.rotation(), "rectangle rotation");
        assertEquals("film", rect.material().value());
        ShapeSpec.Polygon poly = (ShapeSpec.Polygon) c.shapes().get(3);
        assertSi(-4.5e-6, poly.pivot().x(), "pivot x, the mean of the corners");
        assertSi(7e-6 / 3, poly.pivot().y(), "pivot y");
        double[][] placed = poly.placedCorners(); // turned by 90 deg about the pivot
        assertEquals(-4.5e-6 - (2e-6 - 7e-6 / 3), placed[0][0], 1e-18);
        assertEquals(7e-6 / 3 + (-5e-6 + 4.5e-6), placed[0][1], 1e-18);
        ShapeSpec.Ellipse ell = (ShapeSpec.Ellipse) c.shapes().get(5);
        assertSi(0.5e-6, ell.radiusX(), "rx");
        assertSi(0.2e-6, ell.radiusY(), "ry");
        ShapeSpec.LayerStack stack = (ShapeSpec.LayerStack) c.shapes().get(6);
        assertEquals(0.3e-6, stack.thickness(), 1e-20);
        assertEquals("film", stack.materialAt(0, 3.55e-6));
        assertEquals("glass", stack.materialAt(1e-6, 3.65e-6));
        assertEquals(null, stack.materialAt(0, 3.85e-6));
        assertEquals("glass", c.materialAt(0, -1e-6));
        assertEquals("air", c.materialAt(0, 0));

        // boundaries: all, overridden per side; pml lengths rounded to cells
        BoundarySpec.Pml left = assertInstanceOf(BoundarySpec.Pml.class, c.boundary(Side.LEFT));
        assertSi(1e-6, left.thickness().orElseThrow(), "left PML thickness as written");
        assertEquals(Math.round(1e-6 / cell), grid.pmlCells(Side.LEFT));
        assertEquals(24, ((BoundarySpec.Pml) c.boundary(Side.TOP)).cells().getAsInt());
        assertEquals(24, grid.pmlCells(Side.TOP));
        assertEquals(CaseParser.DEFAULT_PML_CELLS, ((BoundarySpec.Pml) c.boundary(Side.RIGHT)).cells().getAsInt());
        assertEquals(CaseParser.DEFAULT_PML_CELLS, grid.pmlCells(Side.RIGHT));
        assertEquals(0, grid.pmlCells(Side.BOTTOM));
        assertInstanceOf(BoundarySpec.Pec.class, c.boundary(Side.BOTTOM));

        // sources
        SourceSpec.LineSource line = (SourceSpec.LineSource) c.sources().get(0);
        assertEquals(Component.EZ, line.component().value());
        assertSi(2, line.amplitude(), "amplitude");
        assertSi(Math.toRadians(50), line.angle(), "angle");
        assertSi(2e-6, line.waist().orElseThrow(), "waist");
        assertTrue(line.horizontal());
        SignalSpec.Pulse pulse = (SignalSpec.Pulse) line.signal();
        assertSi(C0 / 633e-9, pulse.frequency(), "pulse frequency");
        assertSi(C0 / 613e-9 - C0 / 653e-9, pulse.bandwidth(), "pulse bandwidth: the span between 613 nm and 653 nm");
        assertEquals(pulse.bandwidth().si() / (2 * Math.sqrt(Math.log(2))), pulse.spectrumSigma(), 1e-3);
        SourceSpec.PointSource point = (SourceSpec.PointSource) c.sources().get(1);
        assertEquals(Component.HY, point.component().value());
        SignalSpec.RampedWave wave = (SignalSpec.RampedWave) point.signal();
        assertSi(474e12, wave.frequency(), "wave frequency");
        assertSi(20e-15, wave.rampTime(), "ramp");

        // probes
        assertEquals(List.of("transmitted", "probe2"), c.probes().stream().map(p -> p.name().value()).toList());
        assertEquals(Component.HX, c.probes().get(0).component().value());
        assertEquals(Component.EZ, c.probes().get(1).component().value());
        assertSi(-2.5e-6, c.probes().get(1).location().y(), "probe y");

        // output, until, numerics
        assertEquals("results/gap", c.output().folder().orElseThrow().value());
        assertEquals(List.of(OutputSpec.Item.PROBES, OutputSpec.Item.FIELD_FRAMES, OutputSpec.Item.PREVIEW),
                c.output().write().stream().map(Located::value).toList());
        assertSi(5e-15, c.output().frameInterval().orElseThrow(), "frame interval");
        StopSpec.WhenEnergyBelow stop = assertInstanceOf(StopSpec.WhenEnergyBelow.class, c.stop());
        assertSi(1e-5, stop.fraction(), "energy_below");
        assertSi(2e-12, stop.latest(), "latest");
        assertEquals(Precision.DOUBLE, c.numerics().precision().value());
        assertEquals(4, c.numerics().threads().orElseThrow().value());
        assertSi(0.5, c.numerics().courant().orElseThrow(), "courant");

        // a ramped wave under decay is a warning
        assertEquals(List.of("case.yaml:58:17: warning: until: sources[1].point drives a ramped wave, whose field energy never falls; "
                + "the run will end at the latest time 2 ps"), loaded.warnings().stream().map(Diagnostic::toString).toList());
    }

    static final String MINIMAL = """
            polarization: p
            domain: {width: 4 um, height: 3 um}
            grid: {cell: 20 nm}
            sources:
              - point: {at: [0, 0], signal: {gaussian_derivative: {wavelength: 800 nm}}}
            until: {steps: 500}
            """;

    @Test
    void defaults() throws CaseFileException {
        LoadedCase loaded = read(MINIMAL, Map.of());
        CaseSpec c = loaded.spec();
        assertEquals(Optional.empty(), c.title());
        assertSi(800e-9, c.designWavelength(), "the first source's wavelength");
        assertEquals(List.of("case.yaml:5:68: note: design_wavelength: not given; materials are evaluated and cells counted at 800 nm, "
                + "the first source's wavelength"), loaded.notes().stream().map(Diagnostic::toString).toList());
        assertEquals("vacuum", c.domain().background().value());
        assertSi(1.0, c.materials().get("vacuum").relativePermittivity(), "vacuum");
        GridPlan grid = GridDerivation.derive(c, new java.util.ArrayList<>());
        assertEquals(201, grid.nx());
        assertEquals(151, grid.ny());
        assertEquals(Optional.empty(), grid.cellsPerWavelength());
        assertEquals(-2e-6, grid.x(0), 1e-20);
        assertEquals(1.5e-6, grid.y(150), 1e-20);
        for (Side side : Side.values()) {
            assertEquals(CaseParser.DEFAULT_PML_CELLS, grid.pmlCells(side), side.name());
        }
        assertEquals(Component.HZ, c.sources().get(0).component().value());
        assertSi(1, c.sources().get(0).amplitude(), "amplitude");
        SignalSpec.GaussianDerivative g = (SignalSpec.GaussianDerivative) c.sources().get(0).signal();
        assertEquals(800e-9 / (2 * Math.PI * C0), g.width(), 1e-30);
        assertEquals(List.of(), c.probes());
        assertEquals(Optional.empty(), c.output().folder());
        assertEquals(List.of(OutputSpec.Item.PROBES), c.output().write().stream().map(Located::value).toList());
        assertEquals(500L, ((StopSpec.AfterSteps) c.stop()).steps().value());
        assertEquals(Precision.FLOAT, c.numerics().precision().value());
        assertEquals(Optional.empty(), c.numerics().threads());
        assertEquals(Optional.empty(), c.numerics().courant());
        assertEquals(List.of(), loaded.warnings());
    }

    @Test
    void rampDefaultsToFivePeriodsAndAcceptsPeriods() throws CaseFileException {
        String text = MINIMAL.replace("gaussian_derivative: {wavelength: 800 nm}", "ramped_wave: {frequency: 400 THz}");
        SignalSpec.RampedWave w = (SignalSpec.RampedWave) read(text, Map.of()).spec().sources().get(0).signal();
        assertSi(SignalReader.DEFAULT_RAMP_PERIODS / 400e12, w.rampTime(), "default ramp");
        text = MINIMAL.replace("gaussian_derivative: {wavelength: 800 nm}", "ramped_wave: {wavelength: 750 nm, ramp: 8}");
        w = (SignalSpec.RampedWave) read(text, Map.of()).spec().sources().get(0).signal();
        assertSi(8 * 750e-9 / C0, w.rampTime(), "ramp of 8 periods");
    }

    @Test
    void overridesReplaceParametersBeforeEvaluation() throws CaseFileException {
        CaseSpec c = read(FULL, Map.of("gap", "0.3 um", "theta", "asin(1.2/1.51)")).spec();
        Parameter gap = c.parameters().get("gap");
        assertTrue(gap.overridden());
        assertEquals("0.3 um", gap.expression());
        assertEquals("--set gap=0.3 um", gap.at().toString());
        assertEquals(0.15e-6, c.parameters().get("half_gap").value().value(), 1e-21, "dependants see the new value");
        assertSi(-0.15e-6, ((ShapeSpec.HalfPlane) c.shapes().get(0)).through().y(), "shapes see the new value");
        assertSi(0.3e-6, ((ShapeSpec.Rectangle) c.shapes().get(2)).height(), "rectangle height is the gap");
        assertSi(Math.asin(1.2 / 1.51), ((SourceSpec.LineSource) c.sources().get(0)).angle(), "angle");
    }

    @Test
    void overrideErrors() {
        CaseFileException e = assertThrows(CaseFileException.class,
                () -> read(FULL, Map.of("gapp", "0.3 um")));
        assertEquals(List.of("--set gapp=0.3 um: parameters.gapp: the case has no parameter 'gapp' to set (did you mean 'gap'?); "
                + "it defines gap, wl, theta, half_gap"), e.errors().stream().map(Diagnostic::toString).toList());

        e = assertThrows(CaseFileException.class, () -> read(FULL, Map.of("gap", "0.3")));
        assertEquals(List.of("--set gap=0.3: parameters.gap: the new value 0.3 is a plain number but the case file defines gap "
                + "as a length (200 nm)"), e.errors().stream().map(Diagnostic::toString).toList());

        e = assertThrows(CaseFileException.class, () -> read(FULL, Map.of("gap", "0.3 umm")));
        assertTrue(e.errors().get(0).toString().startsWith("--set gap=0.3 umm: parameters.gap: unknown unit 'umm' (did you mean 'um'?)"),
                e.getMessage());

        e = assertThrows(CaseFileException.class, () -> read(MINIMAL, Map.of("gap", "1 um")));
        assertEquals(List.of("--set gap=1 um: parameters.gap: the case has no parameter 'gap' to set; it defines none"),
                e.errors().stream().map(Diagnostic::toString).toList());
    }

    @Test
    void readsFilesAndNamesThemInMessages(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("gap.yaml");
        Files.writeString(file, MINIMAL.replace("20 nm", "20 nmm"));
        CaseFileException e = assertThrows(CaseFileException.class, () -> CaseLoader.read(file, Map.of(), ENOUGH_MEMORY));
        assertTrue(e.getMessage().startsWith(file + ":3:17: grid.cell: unknown unit 'nmm'"), e.getMessage());
    }
}

package org.evanesce.io;

import static org.evanesce.geometry.PhysicalConstants.C0;
import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import io.jhdf.HdfFile;
import io.jhdf.api.Attribute;
import io.jhdf.api.Dataset;
import io.jhdf.api.Node;
import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeSet;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import javax.imageio.ImageIO;
import javax.xml.parsers.DocumentBuilderFactory;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.snakeyaml.engine.v2.api.Load;
import org.snakeyaml.engine.v2.api.LoadSettings;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.NodeList;

/**
 * {@code evanesce run} with field files, frames, the permittivity and frequency-domain maps, read back
 * with jhdf, javax.xml and (where installed) h5py; the decay fits against the closed form of the
 * evanescent field beyond total internal reflection; {@code evanesce redraw} (and the old name {@code render}
 * refused); and the bad-input checks of
 * frames and decay lines.
 *
 * <p>The complete case is the last example of docs/case-file.md ("Evanescent field beyond a totally
 * reflecting face", p, 60°, 30 cells per wavelength in the glass), which writes every kind of field
 * output. The decay fits are also checked for s and p at 45° and 60° on grids a few cells wide (periodic
 * sides), each run taking about a second.
 */
class FieldOutputRunTest {

    /** Index of the glass the plane wave comes from. */
    static final double N_GLASS = 1.5;
    /** Index of the medium beyond the face (vacuum, not the library's air). */
    static final double N_VACUUM = 1.0;
    /** Pulse centre (vacuum) wavelength, m; the case's angle holds exactly here. */
    static final double CENTRE = 633e-9;

    /** The bound on the fitted decay length against Hecht's plane-wave value. */
    static final double DECAY_TOLERANCE = 0.02;
    /** The program's plane-wave value against the formula below: the same closed form in double, so round-off only. */
    static final double PLANE_WAVE_TOLERANCE = 1e-9;
    /**
     * Largest relative standard uncertainty accepted for a fit: the fits run over two or more decay lengths of a
     * clean exponential and measure about 1e-4 of L at 45° (where the line is longest in cells), 1e-6 at 60°.
     */
    static final double UNCERTAINTY_LIMIT = 1e-3;
    /** summary.json prints doubles exactly; relative_difference is L / plane-wave − 1 computed from the same two. */
    static final double DERIVED_TOLERANCE = 1e-12;
    /**
     * |E| is computed in double from the double transforms and stored as float32, as are the parts it is
     * recomputed from here: three roundings to 24 bits (2^-24 ≈ 6e-8 each) and no cancellation (a sum of squares).
     */
    static final double MAGNITUDE_TOLERANCE = 1e-6;
    /**
     * With the dispersion correction the grid's permittivities differ from the case's by a small amount (the
     * docs give about −0.3 % for glass at 20 cells per wavelength; vacuum, whose wave is evanescent here, moves
     * by about −0.5 %); 1 % bounds both.
     */
    static final double CORRECTION_BOUND = 0.01;
    /** Times go through text (XDMF) as Java's shortest round-tripping decimal: equal after parsing, up to 1 ulp. */
    static final double TEXT_TIME_TOLERANCE = 1e-15;
    /** Attributes compared after going through JSON or XDMF text (each prints doubles to round-trip). */
    static final double TEXT_TOLERANCE = 1e-14;
    /** A node counts as lying on a region's edge if within this fraction of a cell (the edges are given in um). */
    static final double EDGE_SLACK = 1e-9;

    /** The last example of docs/case-file.md, unchanged. */
    static final String COMPLETE_CASE = """
            title: Evanescent field beyond a totally reflecting face
            design_wavelength: 633 nm
            polarization: p
            domain: {width: 0.2 um, height: 4 um, background: glass}
            grid: {cells_per_wavelength: 30}
            materials:
              glass: {index: 1.5}
              vac: {index: 1.0}
            shapes:
              - half_plane: {through: [0, 0], fill: above, material: vac}
            boundaries: {left: periodic, right: periodic, all: pml 0.6 um}
            sources:
              - plane_wave: {y: -1 um, angle: 60, signal: {pulse: {wavelength: 633 nm, bandwidth: 10 nm}}}
            maps:
              wavelengths: {from: 630 nm, to: 636 nm, count: 3}
              region: {from: [-0.1 um, -0.4 um], to: [0.1 um, 1 um]}
              log_decades: 5
              decay:
                - {name: beyond, from: [0, 0.05 um], to: [0, 0.6 um]}
            output:
              write: [fields, field_frames, permittivity]
              frame_times: [20 fs, 40 fs]
              components: [hz, ex]
              region: {from: [-0.1 um, -1 um], to: [0.1 um, 1 um]}
            until: {energy_below: 1e-6, latest: 400 fs}
            """;
    /** The complete case's angle of incidence in the glass at the centre wavelength, degrees. */
    static final double COMPLETE_ANGLE = 60;
    /** Its frame times, s. */
    static final double[] FRAME_TIMES = {20e-15, 40e-15};
    /** Its output.region {x min, y min, x max, y max}, m. */
    static final double[] OUTPUT_REGION = {-0.1e-6, -1e-6, 0.1e-6, 1e-6};
    /** Its maps.region, m. */
    static final double[] MAPS_REGION = {-0.1e-6, -0.4e-6, 0.1e-6, 1e-6};
    /** Its decay line, {x from, y from, x to, y to}, m. */
    static final double[] COMPLETE_LINE = {0, 0.05e-6, 0, 0.6e-6};

    @TempDir
    static Path shared;
    /** The complete case's results folder. */
    static Path complete;
    /** Its run.json. */
    static Map<String, Object> completeRecord;

    @TempDir
    Path tmp;



    /** Runs a case that must succeed; returns its folder. */
    private static Path runCase(Path dir, String name, String text) throws IOException {
        Path file = dir.resolve(name + ".yaml");
        Files.writeString(file, text);
        Path out = dir.resolve(name + "-out");
        Cli.Outcome o = Cli.run("run", file.toString(), "--out", out.toString());
        assertEquals(0, o.code(), () -> name + ": " + o);
        return out;
    }

    @BeforeAll
    static void runCompleteCase() throws IOException {
        complete = runCase(shared, "evanescent", COMPLETE_CASE);
        completeRecord = json(complete.resolve("run.json"));
    }

    /**
     * The 1/e decay length of the field's amplitude beyond a face that totally reflects a plane wave:
     * λ0 / (2π √(n1² sin²θ − n2²)) (E. Hecht, Optics, 4th ed., sec. 4.7, the evanescent wave).
     */
    static double hecht(double vacuumWavelength, double n1, double thetaRad, double n2) {
        double s = n1 * Math.sin(thetaRad);
        return vacuumWavelength / (2 * Math.PI * Math.sqrt(s * s - n2 * n2));
    }

    /**
     * A plane wave keeps its in-plane wavenumber kx = 2π n sin θ0 / λ0 at every frequency, so the wavelength λ
     * meets the face at sin θ = sin θ0 · λ / λ0 (docs/case-file.md, sources[].plane_wave).
     */
    static double angleAt(double wavelength, double centreAngleRad) {
        return Math.asin(Math.sin(centreAngleRad) * wavelength / CENTRE);
    }

    /** Glass below y = 0, vacuum above, a plane wave from below; maps at the centre wavelength only. */
    private static final String DECAY_CASE = """
            design_wavelength: 633 nm
            polarization: POL
            domain: {width: 0.1 um, height: 4 um, background: glass}
            grid: {cells_per_wavelength: CPW}
            materials:
              glass: {index: 1.5}
              vac: {index: 1.0}
            shapes:
              - half_plane: {through: [0, 0], fill: above, material: vac}
            boundaries: {left: periodic, right: periodic, all: pml 0.6 um}
            sources:
              - plane_wave: {y: -1 um, angle: ANGLE deg, signal: {pulse: {wavelength: 633 nm, bandwidth: 30 nm}}}
            maps:
              wavelengths: 633 nm
              region: {from: [-0.05 um, -0.3 um], to: [0.05 um, 1.3 um]}
              decay:
                - {name: beyond, from: [0, 0.05 um], to: [0, END um]}
            OUTPUT
            until: {energy_below: 1e-6, latest: 400 fs}
            numerics: {dispersion_correction: CORRECTION}
            """;

    /**
     * The fitted decay length within 2 % of Hecht's value, for both polarizations at 45° (L = 285 nm; the
     * line runs over 3.3 L) and 60° (L = 121.5 nm, 4.5 L), with and without the dispersion correction. The
     * run without it also writes the permittivity, which then holds the case's own values.
     */
    @ParameterizedTest(name = "{0} at {1} deg, {2} cells per wavelength, correction {4}")
    @CsvSource({"s, 45, 30, 1.0, true", "p, 45, 30, 1.0, true", "s, 60, 20, 0.6, false", "p, 60, 20, 0.6, true"})
    void decayLengthMatchesHecht(String pol, double angleDeg, int cpw, double endUm, boolean correction) throws Exception {
        String name = String.format(Locale.ROOT, "decay-%s-%.0f", pol, angleDeg);
        String text = DECAY_CASE.replace("POL", pol).replace("CPW", Integer.toString(cpw))
                .replace("ANGLE", Double.toString(angleDeg)).replace("END", Double.toString(endUm))
                .replace("OUTPUT", correction ? "" : "output: {write: [permittivity]}").replace("CORRECTION", Boolean.toString(correction));
        Path out = runCase(tmp, name, text);
        Map<String, Object> grid = section(json(out.resolve("run.json")), "grid");
        double cell = number(grid, "cell_size_m");
        List<Map<String, Object>> fits = decayFits(out);
        assertEquals(1, fits.size(), name + ": one line at one wavelength");
        double want = hecht(CENTRE, N_GLASS, Math.toRadians(angleDeg), N_VACUUM);
        checkFit(fits.get(0), CENTRE, want, (endUm - 0.05) * 1e-6, cell, name);
        assertMagnitudeIsTheElectricNorm(out.resolve("maps.h5"), pol, name);
        if (!correction) {
            assertPermittivity(out, pol, 2.25, 1.0, name);
        }
    }

    /** The complete case's three wavelengths, each at its own angle (the plane wave's kx is fixed). */
    @Test
    void completeCaseDecayFitsMatchHechtAtEachWavelength() throws Exception {
        double cell = number(section(completeRecord, "grid"), "cell_size_m");
        List<Map<String, Object>> fits = decayFits(complete);
        double[] wavelengths = {630e-9, 633e-9, 636e-9};
        assertEquals(wavelengths.length, fits.size(), "one fit per map wavelength");
        for (int k = 0; k < wavelengths.length; k++) {
            double theta = angleAt(wavelengths[k], Math.toRadians(COMPLETE_ANGLE));
            checkFit(fits.get(k), wavelengths[k], hecht(wavelengths[k], N_GLASS, theta, N_VACUUM),
                    COMPLETE_LINE[3] - COMPLETE_LINE[1], cell, "complete case");
        }
    }

    private static void checkFit(Map<String, Object> fit, double wavelength, double hecht, double lineLength, double cell,
                                 String context) {
        String c = String.format(Locale.ROOT, "%s, %s at %.2f nm (cell %.4g nm)", context, fit.get("name"), wavelength * 1e9,
                cell * 1e9);
        assertEquals("beyond", fit.get("name"), c);
        assertEquals(wavelength, number(fit, "wavelength_m"), wavelength * TEXT_TOLERANCE, c + ": wavelength_m");
        assertFalse(fit.containsKey("no_fit"), () -> c + ": no fit: " + fit.get("no_fit"));
        double l = number(fit, "decay_length_m");
        double pw = number(fit, "plane_wave_decay_length_m");
        assertEquals(hecht, pw, hecht * PLANE_WAVE_TOLERANCE, c + ": the program's plane-wave value against Hecht's formula");
        assertEquals(0, l / hecht - 1, DECAY_TOLERANCE, () -> String.format(Locale.ROOT,
                "%s: fitted L = %.6g nm against Hecht's %.6g nm", c, l * 1e9, hecht * 1e9));
        double u = number(fit, "decay_length_uncertainty_m");
        assertTrue(u > 0 && u < UNCERTAINTY_LIMIT * l, () -> String.format(Locale.ROOT, "%s: uncertainty %g m of L = %g m",
                c, u, l));
        assertTrue(number(fit, "points") >= Math.floor(lineLength / cell),
                c + ": |E| sampled every cell along the line: " + fit.get("points"));
        assertEquals(l / pw - 1, number(fit, "relative_difference"), DERIVED_TOLERANCE, c + ": relative_difference");
        System.out.printf(Locale.ROOT, "%s: L = %.5f nm +- %.2g nm, Hecht %.5f nm, %+.4f %%%n", c, l * 1e9, u * 1e9,
                hecht * 1e9, 100 * (l / hecht - 1));
    }

    // ---- field files ----

    /** Every HDF dataset that fields.xmf, frames.xmf, maps.xmf and permittivity.xmf name, with the stated shape. */
    @Test
    void everyXdmfReferenceNamesADatasetOfTheStatedShape() throws Exception {
        int[] out = nodeBox(OUTPUT_REGION);
        int[] maps = nodeBox(MAPS_REGION);
        // p with Bloch-periodic sides: each written component has a real and an imaginary part
        assertEquals(4, checkXdmf(complete.resolve("fields.xmf"), out), "fields.xmf: Hz, Ex and their imaginary parts");
        assertEquals(2 * 4, checkXdmf(complete.resolve("frames.xmf"), out), "frames.xmf: two frames of four datasets");
        assertEquals(3, checkXdmf(complete.resolve("permittivity.xmf"), out),
                "permittivity.xmf: relative_permittivity_x, relative_permittivity_y, material_id");
        assertEquals(3 * 9, checkXdmf(complete.resolve("maps.xmf"), maps), "maps.xmf: three wavelengths of H_z, E_x, E_y "
                + "(real, imaginary), E_magnitude (layers of the stacks) and relative_permittivity_x, relative_permittivity_y");
    }

    /**
     * Parses an .xmf file with javax.xml and opens every HDF DataItem with jhdf: the dataset exists, has the
     * Topology's shape (less the Z layer), which is also the region's node count, the stated precision, and its
     * origin and cell size attributes match the Geometry. A DataItem inside a HyperSlab (a layer of a maps.h5
     * stack) selects layer k of a stack [n][ny][nx] whose k-th wavelength_m is the grid's wavelength.
     *
     * @param box {nx, ny, i0, j0} of the region
     * @return the number of HDF DataItems
     */
    private static int checkXdmf(Path xmf, int[] box) throws Exception {
        DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
        f.setFeature("http://apache.org/xml/features/disallow-doctype-decl", true);
        Document doc = f.newDocumentBuilder().parse(xmf.toFile());
        Map<String, Object> grid = section(completeRecord, "grid");
        double cell = number(grid, "cell_size_m");
        double x0 = number(grid, "x0_m") + box[2] * cell;
        double y0 = number(grid, "y0_m") + box[3] * cell;
        Map<Path, HdfFile> open = new HashMap<>();
        int items = 0;
        try {
            NodeList grids = doc.getElementsByTagName("Grid");
            for (int g = 0; g < grids.getLength(); g++) {
                Element e = (Element) grids.item(g);
                if (!"Uniform".equals(e.getAttribute("GridType"))) {
                    continue;
                }
                String c = xmf.getFileName() + ", grid " + e.getAttribute("Name");
                int[] dims = ints(first(e, "Topology").getAttribute("Dimensions"));
                assertArrayEquals(new int[] {1, box[1], box[0]}, dims, c + ": Z Y X node counts of the region");
                List<Element> geometry = children(first(e, "Geometry"), "DataItem");
                assertArrayEquals(new double[] {0, y0, x0}, doubles(geometry.get(0).getTextContent()), cell * TEXT_TOLERANCE,
                        c + ": origin Z Y X at the region's first node");
                assertArrayEquals(new double[] {cell, cell, cell}, doubles(geometry.get(1).getTextContent()), cell * TEXT_TOLERANCE,
                        c + ": spacing");
                NodeList data = e.getElementsByTagName("DataItem");
                for (int k = 0; k < data.getLength(); k++) {
                    Element item = (Element) data.item(k);
                    if (!"HDF".equals(item.getAttribute("Format"))) {
                        continue;
                    }
                    Element parent = (Element) item.getParentNode();
                    int layer = -1;
                    if ("HyperSlab".equals(parent.getAttribute("ItemType"))) {
                        assertArrayEquals(dims, ints(parent.getAttribute("Dimensions")), c + ": the hyperslab is one Z layer");
                        int[] sel = ints(children(parent, "DataItem").get(0).getTextContent());
                        layer = sel[0];
                        assertArrayEquals(new int[] {0, 0, 1, 1, 1, 1, box[1], box[0]}, java.util.Arrays.copyOfRange(sel, 1, 9),
                                c + ": start, stride and count select one whole layer");
                    }
                    items++;
                    String ref = item.getTextContent().trim();
                    int colon = ref.lastIndexOf(":/");
                    assertTrue(colon > 0, c + ": 'file:/dataset' expected, got " + ref);
                    Path file = xmf.resolveSibling(ref.substring(0, colon));
                    assertTrue(Files.isRegularFile(file), c + ": " + file + " exists");
                    HdfFile h = open.computeIfAbsent(file, HdfFile::new);
                    Dataset d = h.getDatasetByPath(ref.substring(colon + 1));
                    String cd = c + ", " + ref;
                    if (layer < 0) {
                        assertArrayEquals(new int[] {box[1], box[0]}, d.getDimensions(), cd + ": [ny][nx]");
                        assertArrayEquals(dims, ints(item.getAttribute("Dimensions")), cd + ": DataItem dimensions");
                    } else {
                        double[] wavelengths = (double[]) h.getDatasetByPath("/wavelength_m").getData();
                        assertArrayEquals(new int[] {wavelengths.length, box[1], box[0]}, d.getDimensions(), cd + ": [n][ny][nx]");
                        assertArrayEquals(d.getDimensions(), ints(item.getAttribute("Dimensions")), cd + ": DataItem dimensions");
                        assertEquals("wavelength_m", d.getAttribute("wavelength_index").getData(), cd + ": names its index");
                        assertEquals(String.format(Locale.ROOT, "map at %.2f nm", wavelengths[layer] * 1e9), e.getAttribute("Name"),
                                cd + ": the grid of layer " + layer + " is named after its wavelength");
                    }
                    assertEquals(Integer.parseInt(item.getAttribute("Precision")), d.getDataType().getSize(), cd + ": precision");
                    assertArrayEquals(new double[] {x0, y0}, (double[]) d.getAttribute("origin_m").getData(), cell * TEXT_TOLERANCE,
                            cd + ": origin_m");
                    assertEquals(cell, number(d, "cell_size_m"), cell * TEXT_TOLERANCE, cd + ": cell_size_m");
                }
            }
        } finally {
            for (HdfFile h : open.values()) {
                h.close();
            }
        }
        return items;
    }

    /**
     * frames.xmf's times increase and equal the first dataset's time_s in each frame; the frames are taken at
     * the step nearest each requested time (E at whole steps, H half a step earlier); fields.h5 holds the last step.
     */
    @Test
    void framesAreTakenAtTheRequestedTimes() throws Exception {
        double dt = number(section(completeRecord, "grid"), "time_step_s");
        DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
        f.setFeature("http://apache.org/xml/features/disallow-doctype-decl", true);
        Document doc = f.newDocumentBuilder().parse(complete.resolve("frames.xmf").toFile());
        Element collection = (Element) doc.getElementsByTagName("Grid").item(0);
        assertEquals("Temporal", collection.getAttribute("CollectionType"));
        List<Element> frames = children(collection, "Grid");
        assertEquals(FRAME_TIMES.length, frames.size(), "one frame per requested time");
        try (Stream<Path> s = Files.list(complete.resolve("frames"))) {
            assertEquals(FRAME_TIMES.length, s.filter(p -> p.toString().endsWith(".h5")).count(), "frame files");
        }
        double last = Double.NEGATIVE_INFINITY;
        for (int n = 0; n < frames.size(); n++) {
            Element g = frames.get(n);
            double t = Double.parseDouble(first(g, "Time").getAttribute("Value"));
            assertTrue(t > last, "frames.xmf times increase, frame " + n);
            last = t;
            long step = Math.round(FRAME_TIMES[n] / dt);
            assertTrue(Math.abs(step * dt - FRAME_TIMES[n]) <= dt / 2, "nearest step");
            List<Element> attributes = children(g, "Attribute");
            for (int a = 0; a < attributes.size(); a++) {
                String ref = first(attributes.get(a), "DataItem").getTextContent().trim();
                int colon = ref.lastIndexOf(":/");
                try (HdfFile h = new HdfFile(complete.resolve(ref.substring(0, colon)))) {
                    Dataset d = h.getDatasetByPath(ref.substring(colon + 1));
                    String c = String.format(Locale.ROOT, "frame at %g fs, %s (dt %g s)", FRAME_TIMES[n] * 1e15, ref, dt);
                    double time = number(d, "time_s");
                    assertEquals(step, (long) number(d, "step"), c + ": step");
                    if (a == 0) {
                        assertEquals(time, t, time * TEXT_TIME_TOLERANCE, c + ": frames.xmf Time is the first dataset's time_s");
                    }
                    boolean electric = ((String) d.getAttribute("component").getData()).startsWith("E_");
                    double expected = electric ? step * dt : (step - 0.5) * dt;
                    assertEquals(expected, time, dt * 1e-6, c + ": time_s (E at n dt, H at (n - 1/2) dt)");
                    assertTrue(Math.abs(time - FRAME_TIMES[n]) <= dt, c + ": within a step of the requested time");
                }
            }
        }
        long steps = (long) number(section(completeRecord, "run"), "steps");
        try (HdfFile h = new HdfFile(complete.resolve("fields.h5"))) {
            Dataset ex = h.getDatasetByPath("/E_x");
            assertEquals(steps, (long) number(ex, "step"), "fields.h5 after the last step");
            assertEquals(steps * dt, number(ex, "time_s"), dt * 1e-6, "fields.h5 Ex time");
        }
    }

    /** The complete case's permittivity file: the grid's (corrected) values far from the face, averages near it. */
    @Test
    void permittivityMapHoldsTheGridsValues() throws Exception {
        @SuppressWarnings("unchecked")
        Map<String, Object> onGrid = (Map<String, Object>) section(completeRecord, "grid").get("relative_permittivity_on_grid");
        double glass = number(onGrid, "glass");
        double vac = number(onGrid, "vac");
        assertEquals(2.25, glass, 2.25 * CORRECTION_BOUND, "glass on the grid, corrected");
        assertEquals(1.0, vac, CORRECTION_BOUND, "vacuum on the grid, corrected");
        assertPermittivity(complete, "p", glass, vac, "complete case");
    }

    /**
     * Every permittivity dataset equals {@code glass} on nodes more than two cells below the face (y = 0),
     * {@code vacuum} more than two cells above it, and lies between the two everywhere; for p the normal
     * component (relative_permittivity_y) is averaged across the face, so some node near it is strictly between.
     */
    private static void assertPermittivity(Path out, String pol, double glass, double vacuum, String context) throws IOException {
        try (HdfFile h = new HdfFile(out.resolve("permittivity.h5"))) {
            List<String> names = pol.equals("s") ? List.of("relative_permittivity_z")
                    : List.of("relative_permittivity_x", "relative_permittivity_y");
            for (String name : names) {
                Dataset d = h.getDatasetByPath("/" + name);
                double cell = number(d, "cell_size_m");
                double y0 = ((double[]) d.getAttribute("origin_m").getData())[1];
                double[][] v = (double[][]) d.getData();
                boolean between = false;
                for (int j = 0; j < v.length; j++) {
                    double y = y0 + j * cell;
                    for (int i = 0; i < v[j].length; i++) {
                        String c = String.format(Locale.ROOT, "%s, %s at node (%d, %d), y = %.4g nm", context, name, i, j, y * 1e9);
                        if (y < -2 * cell) {
                            assertEquals(glass, v[j][i], 0.0, c + ": glass");
                        } else if (y > 2 * cell) {
                            assertEquals(vacuum, v[j][i], 0.0, c + ": vacuum");
                        } else {
                            assertTrue(v[j][i] >= vacuum && v[j][i] <= glass, c + ": between vacuum and glass: " + v[j][i]);
                            between |= v[j][i] > vacuum && v[j][i] < glass;
                        }
                    }
                }
                if (name.equals("relative_permittivity_y")) {
                    assertTrue(between, context + ": relative_permittivity_y averaged across the face");
                }
            }
        }
    }

    @Test
    void completeCaseMagnitudeIsTheElectricNorm() throws Exception {
        assertMagnitudeIsTheElectricNorm(complete.resolve("maps.h5"), "p", "complete case");
    }

    /**
     * At every node and wavelength, E_magnitude equals √(Σ re² + im²) over the electric components (E_z for s;
     * E_x, E_y for p), computed here from the stored parts; every stack has one layer per entry of wavelength_m.
     */
    private static void assertMagnitudeIsTheElectricNorm(Path maps, String pol, String context) throws IOException {
        List<String> electric = pol.equals("s") ? List.of("E_z") : List.of("E_x", "E_y");
        int checked = 0;
        try (HdfFile h = new HdfFile(maps)) {
            double[] wavelengths = (double[]) h.getDatasetByPath("/wavelength_m").getData();
            double[] frequencies = (double[]) h.getDatasetByPath("/frequency_hz").getData();
            assertEquals(wavelengths.length, frequencies.length, context + ": one frequency per wavelength");
            for (int q = 0; q < wavelengths.length; q++) {
                assertEquals(C0, wavelengths[q] * frequencies[q], C0 * 1e-15, context + ": wavelength_m times frequency_hz");
            }
            float[][][] mag = (float[][][]) h.getDatasetByPath("/E_magnitude").getData();
            assertEquals(wavelengths.length, mag.length, context + ": E_magnitude has a layer per wavelength");
            // a transform sum F(t) e^{i2pi f t} dt carries the field's unit times seconds (common practice):
            // V*s/m for E, and for H, which is stored as eta0*H
            assertEquals("V*s/m", h.getDatasetByPath("/E_magnitude").getAttribute("unit").getData(), context + ": |E| unit");
            String magnetic = pol.equals("s") ? "H_x" : "H_z";
            for (String comp : List.of(electric.get(0), magnetic)) {
                assertEquals(comp.startsWith("E") ? "V*s/m" : "V*s/m (eta0*H)",
                        h.getDatasetByPath("/" + comp + "_real").getAttribute("unit").getData(), context + ": " + comp + " unit");
            }
            List<float[][][]> parts = new ArrayList<>();
            for (String comp : electric) {
                for (String part : List.of("real", "imaginary")) {
                    parts.add((float[][][]) h.getDatasetByPath("/" + comp + "_" + part).getData());
                }
            }
            for (int q = 0; q < mag.length; q++) {
                double peak = 0;
                for (int j = 0; j < mag[q].length; j++) {
                    for (int i = 0; i < mag[q][j].length; i++) {
                        double sum = 0;
                        for (float[][][] p : parts) {
                            sum += (double) p[q][j][i] * p[q][j][i];
                        }
                        double want = Math.sqrt(sum);
                        peak = Math.max(peak, want);
                        assertEquals(want, mag[q][j][i], want * MAGNITUDE_TOLERANCE, String.format(Locale.ROOT,
                                "%s, E_magnitude at %.2f nm, node (%d, %d)", context, wavelengths[q] * 1e9, i, j));
                        checked++;
                    }
                }
                assertTrue(peak > 0, context + ": E_magnitude at layer " + q + " is not all zero");
            }
        }
        assertTrue(checked > 0, context + ": no E_magnitude values in " + maps);
    }

    // ---- an independent reader ----

    /** The first python3 on the PATH with h5py and numpy (null when none). */
    static final Path PYTHON = ToolPath.python3With("h5py, numpy").orElse(null);

    /** Reads one frame file and maps.h5 with h5py (Debian's python3-h5py, over the HDF5 project's C library). */
    private static final String H5PY_CHECK = """
            import sys
            import h5py
            import numpy as np
            frame, maps = sys.argv[1], sys.argv[2]
            nx, ny, mx, my = (int(a) for a in sys.argv[3:7])
            cell = float(sys.argv[7])
            fo = [float(sys.argv[8]), float(sys.argv[9])]
            mo = [float(sys.argv[10]), float(sys.argv[11])]
            pol = sys.argv[12]
            problems = []
            def check(ok, what):
                if not ok:
                    problems.append(what)
            def text(v):
                return v.decode('utf-8') if isinstance(v, bytes) else str(v)
            def close(a, b):
                return abs(a - b) <= 1e-12 * max(abs(b), cell)
            def attrs(name, d, shape, origin):
                a = d.attrs
                check(d.shape == shape, '%s shape %s, expected %s' % (name, d.shape, shape))
                check('unit' in a and text(a['unit']).startswith(('V/m', 'V*s/m')) or name.startswith(('relative_permittivity', 'material')),
                      '%s unit %r' % (name, a.get('unit')))
                check('cell_size_m' in a and close(float(a['cell_size_m']), cell), '%s cell_size_m %r' % (name, a.get('cell_size_m')))
                check('origin_m' in a and len(a['origin_m']) == 2 and all(close(float(u), v) for u, v in zip(a['origin_m'], origin)),
                      '%s origin_m %r, expected %r' % (name, a.get('origin_m'), origin))
                check('polarization' in a and text(a['polarization']) == pol, '%s polarization %r' % (name, a.get('polarization')))
            with h5py.File(frame, 'r') as f:
                names = sorted(f.keys())
                check(names == ['E_x', 'E_x_imaginary', 'H_z', 'H_z_imaginary'], 'frame datasets %s' % names)
                for name in names:
                    d = f[name]
                    check(d.dtype == np.dtype('<f4'), '%s dtype %s' % (name, d.dtype))
                    attrs(name, d, (ny, nx), fo)
                    check(text(d.attrs['component']) == name[:3], '%s component %r' % (name, d.attrs['component']))
                    check(text(d.attrs['part']) == ('imaginary' if name.endswith('_imaginary') else 'real'), name + ' part')
                    check(np.all(np.isfinite(d[...])), name + ' finite')
            with h5py.File(maps, 'r') as f:
                names = sorted(f.keys())
                stacks = ['E_magnitude'] + [c + p for c in ('E_x', 'E_y', 'H_z') for p in ('_imaginary', '_real')]
                fixed = ['material_id', 'relative_permittivity_x', 'relative_permittivity_y']
                check(names == sorted(stacks + fixed + ['frequency_hz', 'wavelength_m']), 'maps datasets %s' % names)
                w = f['wavelength_m']
                check(w.shape == (3,) and w.dtype == np.dtype('<f8') and text(w.attrs['unit']) == 'm', 'wavelength_m')
                check(np.allclose(w[...], [630e-9, 633e-9, 636e-9], rtol=1e-12, atol=0), 'wavelength_m %r' % w[...])
                check(text(f['frequency_hz'].attrs['unit']) == 'Hz', 'frequency_hz unit')
                for name in stacks:
                    d = f[name]
                    check(d.dtype == np.dtype('<f4'), '%s dtype %s' % (name, d.dtype))
                    attrs(name, d, (3, my, mx), mo)
                    check(text(d.attrs['wavelength_index']) == 'wavelength_m', name + ' wavelength_index')
                for name in fixed:
                    d = f[name]
                    check(d.dtype == np.dtype('<f8'), '%s dtype %s' % (name, d.dtype))
                    attrs(name, d, (my, mx), mo)
            print('OK' if not problems else 'FAILED: ' + '; '.join(problems))
            """;

    @Test
    void h5pyReadsAFrameAndTheMaps() throws Exception {
        assumeTrue(PYTHON != null, "no python3 on the PATH imports h5py and numpy: install Debian's python3-h5py and "
                + "python3-numpy");
        Map<String, Object> grid = section(completeRecord, "grid");
        double cell = number(grid, "cell_size_m");
        int[] out = nodeBox(OUTPUT_REGION);
        int[] maps = nodeBox(MAPS_REGION);
        Path frame;
        try (Stream<Path> s = Files.list(complete.resolve("frames"))) {
            frame = s.filter(p -> p.toString().endsWith(".h5")).sorted().findFirst().orElseThrow();
        }
        double x0 = number(grid, "x0_m");
        double y0 = number(grid, "y0_m");
        Cli.Outcome r = python(List.of("-c", H5PY_CHECK, frame.toString(), complete.resolve("maps.h5").toString(),
                "" + out[0], "" + out[1], "" + maps[0], "" + maps[1], Double.toString(cell),
                Double.toString(x0 + out[2] * cell), Double.toString(y0 + out[3] * cell),
                Double.toString(x0 + maps[2] * cell), Double.toString(y0 + maps[3] * cell), "p"));
        assertEquals("OK", r.out().strip(), "h5py check of " + frame.getFileName() + " and maps.h5 (exit " + r.code() + ")");
    }

    private static Cli.Outcome python(List<String> args) throws IOException, InterruptedException {
        Path log = Files.createTempFile("h5py-check", ".txt");
        try {
            List<String> command = new ArrayList<>();
            command.add(PYTHON.toString());
            command.addAll(args);
            ProcessBuilder pb = new ProcessBuilder(command).redirectErrorStream(true).redirectOutput(log.toFile());
            pb.environment().put("PYTHONIOENCODING", "utf-8");
            pb.environment().remove("PYTHONPATH");
            pb.environment().remove("PYTHONHOME");
            Process p = pb.start();
            if (!p.waitFor(120, TimeUnit.SECONDS)) {
                p.destroyForcibly();
                return new Cli.Outcome(-1, "timed out after 120 s", "");
            }
            return new Cli.Outcome(p.exitValue(), Files.readString(log, StandardCharsets.UTF_8), "");
        } finally {
            Files.deleteIfExists(log);
        }
    }

    // ---- redraw ----

    @Test
    void redrawRedrawsThePicturesFromTheFiles() throws Exception {
        Path dir = tmp.resolve("copy");
        copyTree(complete, dir);
        List<String> pictures = new ArrayList<>();
        try (Stream<Path> s = Files.list(dir)) {
            for (Path p : s.filter(p -> p.toString().endsWith(".png")).sorted().toList()) {
                pictures.add(p.getFileName().toString());
                Files.delete(p);
            }
        }
        // per wavelength Re Hz and log |E| (3 x 2), and per written component of fields (Hz, Ex)
        assertEquals(3 * 2 + 2, pictures.size(), "pictures of the run: " + pictures);
        Cli.Outcome o = Cli.run("redraw", dir.toString());
        assertEquals(0, o.code(), () -> "redraw: " + o);
        for (String name : pictures) {
            Path p = dir.resolve(name);
            assertTrue(Files.isRegularFile(p), name + " recreated; " + o);
            var image = ImageIO.read(new ByteArrayInputStream(Files.readAllBytes(p)));
            assertNotNull(image, name + " is a PNG");
            assertTrue(image.getWidth() > 0 && image.getHeight() > 0, name + " has pixels");
        }
        String log = "map-E-633.00nm-log.png";
        byte[] five = Files.readAllBytes(dir.resolve(log));
        Path two = tmp.resolve("two-decades");
        Cli.Outcome o2 = Cli.run("redraw", dir.toString(), "--log-decades", "2", "--out", two.toString());
        assertEquals(0, o2.code(), () -> "redraw --log-decades 2: " + o2);
        assertFalse(java.util.Arrays.equals(five, Files.readAllBytes(two.resolve(log))),
                "--log-decades 2 draws another log picture than the case's 5 decades");
        Path bare = tmp.resolve("no-outlines");
        Cli.Outcome o3 = Cli.run("redraw", dir.toString(), "--no-outlines", "--out", bare.toString());
        assertEquals(0, o3.code(), () -> "redraw --no-outlines: " + o3);
        assertFalse(java.util.Arrays.equals(five, Files.readAllBytes(bare.resolve(log))),
                "--no-outlines leaves out the glass-vacuum outline");
    }

    @Test
    void redrawRefusesAFolderWithoutHdf5() throws Exception {
        Path empty = Files.createDirectories(tmp.resolve("not-a-results-folder"));
        Cli.Outcome o = Cli.run("redraw", empty.toString());
        assertEquals(2, o.code(), () -> "redraw of a folder without maps.h5 or fields.h5: " + o);
        assertTrue(o.err().contains(empty.toString()), () -> "the message names the folder: " + o);
    }

    /** The old command name is refused with exit 2, a message naming redraw, and nothing drawn. */
    @Test
    void theOldNameRenderIsRefusedNamingRedraw() throws Exception {
        Path dir = tmp.resolve("copy");
        copyTree(complete, dir);
        Cli.Outcome o = Cli.run("render", dir.toString(), "--log-decades", "2");
        assertEquals(2, o.code(), () -> "render: " + o);
        assertTrue(o.err().contains("'redraw'") && o.err().contains("evanesce redraw " + dir + " --log-decades 2"),
                () -> "the message names the new command with the arguments given: " + o);
        assertEquals(1, o.err().strip().lines().count(), () -> "one line: " + o);
        Cli.Outcome bare = Cli.run("render");
        assertEquals(2, bare.code(), () -> "render alone: " + bare);
        assertTrue(bare.err().contains("evanesce redraw FOLDER"), () -> "render alone: " + bare);
        Cli.Outcome none = Cli.run();
        assertFalse(none.err().contains("render"), () -> "the old name is not offered: " + none);
    }

    /**
     * A maps.h5 written before the datasets said what they hold (wavelength in the name) is refused with exit 2,
     * naming the file and one of its old names.
     */
    @Test
    void redrawRefusesFilesOfTheEarlierLayout() throws Exception {
        Path dir = Files.createDirectories(tmp.resolve("earlier"));
        Map<String, Object> a = new java.util.LinkedHashMap<>();
        a.put("unit", "V/m s");
        a.put("cell_size_m", 1e-8);
        a.put("origin_m", new double[] {0, 0});
        org.evanesce.io.output.hdf5.Hdf5Writer.write(dir.resolve("maps.h5"), Map.of(), List.of(
                new org.evanesce.io.output.hdf5.FieldDataset("Ez_real_633.00nm", new double[12], 4, 3,
                        org.evanesce.solver.grid.Precision.FLOAT, a),
                new org.evanesce.io.output.hdf5.FieldDataset("material_id", new double[12], 4, 3,
                        org.evanesce.solver.grid.Precision.DOUBLE, Map.of("log_decades", 5.0))));
        Cli.Outcome o = Cli.run("redraw", dir.toString());
        assertEquals(2, o.code(), () -> "redraw of an earlier maps.h5: " + o);
        assertTrue(o.err().contains(dir.resolve("maps.h5").toString()) && o.err().contains("Ez_real_633.00nm")
                && o.err().contains("run its case again"), () -> "names the file, the old name and what to do: " + o);
    }

    // ---- bad input ----

    @Test
    void framesWithoutTimesAreRefused() throws Exception {
        String text = COMPLETE_CASE.replace("  frame_times: [20 fs, 40 fs]\n", "");
        assertFalse(text.contains("frame_times"), "the test removed frame_times");
        refused("no-times", text, "output.frame_interval");
    }

    @Test
    void aDecayLineOutsideTheMapsIsRefused() throws Exception {
        String text = COMPLETE_CASE.replace("to: [0, 0.6 um]", "to: [0, 1.2 um]");
        assertFalse(text.equals(COMPLETE_CASE), "the test moved the line's end");
        refused("long-line", text, "maps.decay[0]");
    }

    private void refused(String name, String text, String key) throws IOException {
        Path file = tmp.resolve(name + ".yaml");
        Files.writeString(file, text);
        Path out = tmp.resolve(name + "-out");
        Cli.Outcome o = Cli.run("run", file.toString(), "--out", out.toString());
        assertEquals(2, o.code(), () -> name + ": " + o);
        assertTrue(o.err().contains(key), () -> name + ": the message names " + key + ": " + o);
        assertFalse(Files.exists(out), name + ": nothing written");
    }

    // ---- helpers ----

    /**
     * The nodes x0 + iΔ, y0 + jΔ of the complete case's grid (run.json) inside a region {x min, y min, x max, y max}.
     *
     * @return {nx, ny, i0, j0}
     */
    private static int[] nodeBox(double[] region) {
        Map<String, Object> grid = section(completeRecord, "grid");
        double cell = number(grid, "cell_size_m");
        int[] x = inside(number(grid, "x0_m"), cell, (int) number(grid, "nx"), region[0], region[2]);
        int[] y = inside(number(grid, "y0_m"), cell, (int) number(grid, "ny"), region[1], region[3]);
        return new int[] {x[1], y[1], x[0], y[0]};
    }

    /** {first index, count} of the nodes origin + k·cell, 0 ≤ k < n, with lo ≤ node ≤ hi. */
    private static int[] inside(double origin, double cell, int n, double lo, double hi) {
        int first = -1;
        int count = 0;
        for (int k = 0; k < n; k++) {
            double v = origin + k * cell;
            if (v >= lo - EDGE_SLACK * cell && v <= hi + EDGE_SLACK * cell) {
                first = first < 0 ? k : first;
                count++;
            }
        }
        return new int[] {first, count};
    }

    @SuppressWarnings("unchecked")
    static Map<String, Object> json(Path file) throws IOException {
        return (Map<String, Object>) new Load(LoadSettings.builder().build()).loadFromString(Files.readString(file));
    }

    @SuppressWarnings("unchecked")
    static Map<String, Object> section(Map<String, Object> m, String key) {
        Object v = m.get(key);
        assertTrue(v instanceof Map, key + " in " + m.keySet());
        return (Map<String, Object>) v;
    }

    static double number(Map<String, Object> m, String key) {
        Object v = m.get(key);
        assertTrue(v instanceof Number, key + " is a number: " + v);
        return ((Number) v).doubleValue();
    }

    @SuppressWarnings("unchecked")
    private static List<Map<String, Object>> decayFits(Path out) throws IOException {
        Map<String, Object> summary = json(out.resolve("summary.json"));
        Object fits = summary.get("decay_fits");
        assertTrue(fits instanceof List, "summary.json has decay_fits: " + summary.keySet());
        return (List<Map<String, Object>>) fits;
    }

    /** A numeric attribute, whether jhdf returns it as a boxed scalar or a one-element array. */
    private static double number(Node n, String name) {
        Attribute a = n.getAttribute(name);
        assertNotNull(a, n.getPath() + " has attribute " + name);
        Object v = a.getData();
        if (v instanceof Number x) {
            return x.doubleValue();
        }
        if (v instanceof double[] d && d.length == 1) {
            return d[0];
        }
        if (v instanceof int[] i && i.length == 1) {
            return i[0];
        }
        if (v instanceof long[] l && l.length == 1) {
            return l[0];
        }
        throw new AssertionError(n.getPath() + ": attribute " + name + " is not a number: " + v);
    }

    private static Element first(Element parent, String tag) {
        List<Element> c = children(parent, tag);
        assertFalse(c.isEmpty(), "<" + tag + "> in <" + parent.getTagName() + " " + parent.getAttribute("Name") + ">");
        return c.get(0);
    }

    private static List<Element> children(Element parent, String tag) {
        List<Element> out = new ArrayList<>();
        for (org.w3c.dom.Node n = parent.getFirstChild(); n != null; n = n.getNextSibling()) {
            if (n instanceof Element e && e.getTagName().equals(tag)) {
                out.add(e);
            }
        }
        return out;
    }

    private static int[] ints(String s) {
        return java.util.Arrays.stream(s.trim().split("\\s+")).mapToInt(Integer::parseInt).toArray();
    }

    private static double[] doubles(String s) {
        return java.util.Arrays.stream(s.trim().split("\\s+")).mapToDouble(Double::parseDouble).toArray();
    }

    private static void copyTree(Path from, Path to) throws IOException {
        try (Stream<Path> s = Files.walk(from)) {
            for (Path p : s.toList()) {
                Path t = to.resolve(from.relativize(p).toString());
                if (Files.isDirectory(p)) {
                    Files.createDirectories(t);
                } else {
                    Files.copy(p, t);
                }
            }
        }
    }
}

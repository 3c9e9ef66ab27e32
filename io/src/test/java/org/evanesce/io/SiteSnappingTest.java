package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.evanesce.io.cli.ExitCode;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Where a source or probe placed exactly on a grid node lands: on the nearest site of its component, and
 * for a tie (a component whose sites lie half a cell off the node) on the site with the larger index, the
 * same physical site whatever the domain's size. The grids here have 20 nm cells and nodes at whole cells
 * from the centre; the points (0.1 um, −0.06 um) and (0.3 um, −0.06 um) are nodes in every domain used.
 * Before the rule, round-off in the grid coordinate decided the tie: a 3 um and a 4 um wide domain put a
 * p source at 0.1 um on different Hz sites, 8 um another one along y (common practice: compare the same
 * point in two grids).
 */
class SiteSnappingTest {

    static final double CELL = 20e-9;
    /** Site positions printed by run.json (17 significant digits) against cell multiples: round-off only. */
    static final double POSITION_TOLERANCE = 1e-15;

    @TempDir
    Path tmp;

    private static final String CASE = """
            title: sites of points on nodes
            design_wavelength: 633 nm
            polarization: POL
            domain: {width: SIZE um, height: SIZE um, background: vacuum}
            grid: {cell: 20 nm}
            boundaries: {all: pec}
            sources:
              - point: {at: [0.1 um, -0.06 um], SOURCE_COMPONENT signal: {pulse: {wavelength: 633 nm, bandwidth: 40 nm}}}
            probes:
            PROBES
            until: {steps: 4}
            """;

    /** [x, y] of every "site_m" (probes), "first_site_m" (sources) in run.json, in order. */
    private static List<double[]> sites(String json, String key) {
        Matcher m = Pattern.compile("\"" + key + "\": \\[\\s*([-0-9.eE+]+),\\s*([-0-9.eE+]+)\\s*\\]").matcher(json);
        List<double[]> out = new ArrayList<>();
        while (m.find()) {
            out.add(new double[] {Double.parseDouble(m.group(1)), Double.parseDouble(m.group(2))});
        }
        return out;
    }

    private String runJson(String pol, int size, String sourceComponent, List<String> probeComponents) throws IOException {
        StringBuilder probes = new StringBuilder();
        for (String c : probeComponents) {
            probes.append("  - {name: ").append(c).append(", at: [0.3 um, -0.06 um], component: ").append(c).append("}\n");
        }
        String text = CASE.replace("POL", pol).replace("SIZE", Integer.toString(size))
                .replace("SOURCE_COMPONENT", "component: " + sourceComponent + ",").replace("PROBES\n", probes.toString());
        Path f = tmp.resolve(pol + "-" + size + "-" + sourceComponent + ".yaml");
        Files.writeString(f, text);
        Path out = tmp.resolve(pol + "-" + size + "-" + sourceComponent);
        Cli.Outcome o = Cli.run("run", f.toString(), "--out", out.toString());
        assertEquals(ExitCode.OK, o.code(), () -> f + ": " + o);
        return Files.readString(out.resolve("run.json"));
    }

    /** The components of a polarization and their site offsets in cells (x, y). */
    private static double[] offset(String c) {
        return switch (c) {
            case "ez" -> new double[] {0, 0};
            case "hx", "ey" -> new double[] {0, 0.5};
            case "hy", "ex" -> new double[] {0.5, 0};
            case "hz" -> new double[] {0.5, 0.5};
            default -> throw new IllegalArgumentException(c);
        };
    }

    @ParameterizedTest(name = "{0} polarization")
    @ValueSource(strings = {"s", "p"})
    void pointOnANodeLandsOnTheSameSiteInEveryDomain(String pol) throws IOException {
        List<String> comps = pol.equals("s") ? List.of("ez", "hx", "hy") : List.of("hz", "ex", "ey");
        // a source whose sites are half a cell off the nodes (a tie along y, and along x too for hz)
        String source = pol.equals("s") ? "hx" : "hz";
        {
            for (int size : new int[] {3, 4, 8}) {
                String json = runJson(pol, size, source, comps);
                List<double[]> probes = sites(json, "site_m");
                List<double[]> sources = sites(json, "first_site_m");
                assertEquals(comps.size(), probes.size(), () -> "probes in run.json: " + json);
                assertEquals(1, sources.size(), () -> "source sites in run.json: " + json);
                String where = pol + ", " + size + " um domain, source " + source;
                // a tie goes up: the site lies at the node plus the component's offset
                double[] o = offset(source);
                assertEquals(0.1e-6 + o[0] * CELL, sources.get(0)[0], POSITION_TOLERANCE, () -> where + ": source x");
                assertEquals(-0.06e-6 + o[1] * CELL, sources.get(0)[1], POSITION_TOLERANCE, () -> where + ": source y");
                assertTrue(json.contains("\"component\": \"" + source + "\""), () -> where + ": run.json names the component");
                for (int k = 0; k < comps.size(); k++) {
                    double[] p = offset(comps.get(k));
                    String c = comps.get(k);
                    double[] got = probes.get(k);
                    assertEquals(0.3e-6 + p[0] * CELL, got[0], POSITION_TOLERANCE, () -> where + ": probe " + c + " x");
                    assertEquals(-0.06e-6 + p[1] * CELL, got[1], POSITION_TOLERANCE, () -> where + ": probe " + c + " y");
                }
            }
        }
    }
}

package org.evanesce.io.casefile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.io.casefile.text.Diagnostic;
import org.junit.jupiter.api.Test;
import org.evanesce.io.plan.CaseLoader;

/**
 * Each kind of problem produces its exact {@code file:line:column: key.path: message}, all problems
 * are reported at once, and warnings leave the case runnable.
 */
class CaseErrorsTest {

    private static final ReadOptions ENOUGH_MEMORY = new ReadOptions(1L << 34);

    /** A valid case to break one line at a time; lines are numbered from 1. */
    private static final String BASE = """
            polarization: s
            domain: {width: 4 um, height: 3 um}
            grid: {cell: 20 nm}
            sources:
              - point: {at: [0, 0], signal: {pulse: {wavelength: 633 nm, bandwidth: 40 nm}}}
            until: {time: 100 fs}
            """;

    private static List<String> errors(String text) {
        CaseFileException e = assertThrows(CaseFileException.class,
                () -> CaseLoader.parse(text, "case.yaml", Map.of(), ENOUGH_MEMORY), "expected errors in\n" + text);
        return e.errors().stream().map(Diagnostic::toString).toList();
    }

    private static List<String> warnings(String text) throws CaseFileException {
        return CaseLoader.parse(text, "case.yaml", Map.of(), ENOUGH_MEMORY).warnings().stream().map(Diagnostic::toString).toList();
    }

    private static String replace(String what, String with) {
        assertTrue(BASE.contains(what), what);
        return BASE.replace(what, with);
    }

    @Test
    void baseIsValid() throws CaseFileException {
        assertEquals(List.of(), warnings(BASE));
    }

    @Test
    void unknownKeysAreErrorsWithSuggestions() {
        assertEquals(List.of(
                "case.yaml:1:1: domain: missing, expected a mapping with width and height",
                "case.yaml:2:1: domian: unknown key (did you mean 'domain'?), expected one of title, parameters, design_wavelength, "
                        + "design_frequency, polarization, domain, grid, materials, shapes, boundaries, sources, probes, flux, surfaces, maps, output, "
                        + "until, numerics"),
                errors(replace("domain:", "domian:")));
        assertEquals(List.of("case.yaml:2:37: domain.centre: unknown key, expected one of width, height, background"),
                errors(replace("height: 3 um}", "height: 3 um, centre: [0, 0]}")));
        assertEquals(List.of("case.yaml:3:1: grid: needs one of cell or cells_per_wavelength",
                "case.yaml:3:8: grid.cel: unknown key (did you mean 'cell'?), expected one of cell, cells_per_wavelength"),
                errors(replace("{cell: 20 nm}", "{cel: 20 nm}")));
        assertEquals(List.of("case.yaml:5:34: sources[0].point.signal.puls: unknown kind (did you mean 'pulse'?), expected one of pulse, "
                + "ramped_wave, gaussian_derivative"), errors(replace("{pulse:", "{puls:")));
    }

    @Test
    void missingRequiredKeys() {
        assertEquals(List.of("case.yaml:2:1: domain.height: missing, expected a length such as 10 um"),
                errors(replace("{width: 4 um, height: 3 um}", "{width: 4 um}")));
        assertEquals(List.of("case.yaml:1:1: until: missing, expected a mapping with time, steps or latest (and energy_below)"),
                errors(replace("until: {time: 100 fs}\n", "")));
        assertEquals(List.of("case.yaml:5:34: sources[0].point.signal.pulse.bandwidth: missing, expected a wavelength span such as 40 nm "
                + "or a frequency span such as 30 THz"), errors(replace(", bandwidth: 40 nm", "")));
    }

    @Test
    void wrongTypesAndUnits() {
        assertEquals(List.of("case.yaml:2:17: domain.width: expected a length such as 2 um, got a list"),
                errors(replace("width: 4 um", "width: [4 um]")));
        assertEquals(List.of("case.yaml:2:17: domain.width: 4 has no unit, expected a length such as 2 um"),
                errors(replace("width: 4 um", "width: 4")));
        assertEquals(List.of("case.yaml:2:17: domain.width: got 4 fs (a time), expected a length such as 2 um"),
                errors(replace("width: 4 um", "width: 4 fs")));
        assertEquals(List.of("case.yaml:2:19: domain.width: unknown unit 'umm' (did you mean 'um'?); units: nm, um, mm, m, fs, ps, ns, s, "
                + "Hz, GHz, THz, PHz, deg, rad, S (to multiply by a parameter write '*')"), errors(replace("width: 4 um", "width: 4 umm")));
        assertEquals(List.of("case.yaml:2:22: domain.width: cannot add a length (4 um) and a plain number (1); both sides of '+' must be "
                + "of the same kind"), errors(replace("width: 4 um", "width: 4 um + 1")));
        assertEquals(List.of("case.yaml:1:15: polarization: unknown choice 'z', expected one of s, p, both"),
                errors(replace("polarization: s", "polarization: z")));
        assertEquals(List.of("case.yaml:6:8: until: expected a mapping with keys such as time, steps, energy_below, latest, got '100 fs'"),
                errors(replace("until: {time: 100 fs}", "until: 100 fs")));
        assertEquals(List.of("case.yaml:6:16: until.steps: expected a whole number, got 10.5"),
                errors(replace("until: {time: 100 fs}", "until: {steps: 10.5}")));
    }

    @Test
    void negativeAndZeroSizes() {
        assertEquals(List.of("case.yaml:2:17: domain.width: must be positive, got -4 um"), errors(replace("width: 4 um", "width: -4 um")));
        assertEquals(List.of("case.yaml:3:14: grid.cell: must be positive, got 0 um"), errors(replace("cell: 20 nm", "cell: 0")));
        String disk = BASE + "shapes:\n  - disk: {centre: [0, 0], radius: -1 um, material: water}\n";
        assertEquals(List.of("case.yaml:8:36: shapes[0].disk.radius: must be positive, got -1 um"), errors(disk));
    }

    @Test
    void parameterProblems() {
        String undefined = "parameters:\n  gap: 0.2 um\n" + replace("width: 4 um", "width: 4 um + 2*gapp");
        assertEquals(List.of("case.yaml:4:26: domain.width: undefined parameter 'gapp' (did you mean 'gap'?)"), errors(undefined));

        String circular = "parameters:\n  a: b + 1 um\n  b: 2*c\n  c: a/2\n  d: a\n" + replace("width: 4 um", "width: d");
        assertEquals(List.of("case.yaml:2:6: parameters.a: circular definition: a -> b -> c -> a"), errors(circular),
                "one report for the loop, none for its users d and domain.width");

        String self = "parameters:\n  a: a\n" + BASE;
        assertEquals(List.of("case.yaml:2:6: parameters.a: circular definition: a -> a"), errors(self));

        String reserved = "parameters:\n  um: 2\n  2x: 1\n" + BASE;
        assertEquals(List.of("case.yaml:2:3: parameters.um: 'um' is the name of a unit, a function or pi; choose another name",
                "case.yaml:3:3: parameters.2x: a parameter name is letters, digits and '_', starting with a letter or '_'"), errors(reserved));

        String duplicate = "parameters:\n  a: 1 um\n  a: 2 um\n" + BASE;
        assertEquals(List.of("case.yaml:3:3: parameters.a: duplicate parameter, first defined at line 2"), errors(duplicate));

        String broken = "parameters:\n  a: (1 um\n  b: a*2\n" + replace("width: 4 um", "width: b");
        assertEquals(List.of("case.yaml:2:11: parameters.a: missing ')' for the '(' at character 1"), errors(broken),
                "users of a broken parameter stay quiet");
    }

    @Test
    void duplicateKeys() {
        assertEquals(List.of("case.yaml:2:37: domain.width: duplicate key, first given at line 2"),
                errors(replace("height: 3 um}", "height: 3 um, width: 5 um}")));
    }

    @Test
    void referencesAndCombinations() {
        String material = BASE + "shapes:\n  - disk: {centre: [0, 0], radius: 1 um, material: watr}\n";
        assertEquals(List.of("case.yaml:8:52: shapes[0].disk.material: unknown material 'watr' (did you mean 'water'?); define it under "
                + "materials or use one of vacuum, air, water, fused_silica, borosilicate_crown"), errors(material));

        assertEquals(List.of("case.yaml:5:36: sources[0].point.component: hz belongs to p polarization but the case is s (line 1); use ez, hx, hy"),
                errors(replace("{at: [0, 0], signal", "{at: [0, 0], component: hz, signal")));

        String oblique = replace("- point: {at: [0, 0],", "- line: {from: [0, 0], to: [1 um, 1 um],");
        assertEquals(List.of("case.yaml:5:31: sources[0].line.to: a line source must be horizontal or vertical; from (0 um, 0 um) to "
                + "(1 um, 1 um) is neither"), errors(oblique));

        String both = "materials:\n  film: {index: 1.4, permittivity: 2}\n" + BASE;
        assertEquals(List.of("case.yaml:2:22: materials.film.permittivity: give only one of index and permittivity"), errors(both));

        assertEquals(List.of("case.yaml:6:23: until.energy_below: energy_below goes with latest only; with time the run length is already fixed"),
                errors(replace("{time: 100 fs}", "{time: 100 fs, energy_below: 1e-4}")));
        assertEquals(List.of("case.yaml:6:1: until.latest: missing, expected a time such as 2 ps that ends the run if the field energy never falls below energy_below"),
                errors(replace("{time: 100 fs}", "{energy_below: 1e-4}")));
        assertEquals(List.of("case.yaml:7:55: numerics.courant: must lie between 0 and the 2D stability limit 1/sqrt(2) = 0.707107 "
                + "(exclusive), got 0.75"), errors(BASE + "numerics: {precision: double, threads: auto, courant: 0.75}\n"));
        assertEquals(List.of("case.yaml:7:1: output.frame_interval: missing, expected frame_interval (a time such as 5 fs) or "
                + "frame_times (a list of times): field_frames needs to know when to take frames"),
                errors(BASE + "output: {write: [field_frames]}\n"));
    }

    @Test
    void placementInTheDomain() {
        assertEquals(List.of("case.yaml:5:18: sources[0].point.at: the source at (3 um, 0 um) lies outside the domain "
                + "(x from -2 um to 2 um, y from -1.5 um to 1.5 um)"), errors(replace("at: [0, 0]", "at: [3 um, 0]")));
        String thick = BASE + "boundaries: {all: pml 1.5 um}\n";
        assertEquals(List.of("case.yaml:7:19: boundaries.all: the bottom and top PMLs (75 + 75 cells) leave no interior in a grid "
                + "150 cells high; thin them or enlarge the domain"), errors(thick));
    }

    @Test
    void memoryIsCheckedBeforeAllocation() {
        CaseFileException e = assertThrows(CaseFileException.class,
                () -> CaseLoader.parse(BASE, "case.yaml", Map.of(), new ReadOptions(100_000)));
        assertEquals(List.of("case.yaml:3:14: grid.cell: the grid of 201 x 151 nodes needs about 0.000791464 GiB in float "
                + "(28 bytes per cell) but the JVM can use at most 9.31323e-5 GiB; use a larger cell or a smaller domain, or give the JVM more memory (-Xmx)"),
                e.errors().stream().map(Diagnostic::toString).toList());
        assertEquals(List.of("case.yaml:3:14: grid.cell: the grid would have 400001 x 300001 nodes, more than one array can hold "
                + "(2147483583 values); use a larger cell or a smaller domain"), errors(replace("cell: 20 nm", "cell: 0.01 nm")));
    }

    @Test
    void yamlProblems() {
        assertEquals(List.of("case.yaml:3:5: not valid YAML: expected ',' or '}', but got : (while parsing a flow mapping)"),
                errors(replace("height: 3 um}", "height: 3 um")));
        assertEquals(List.of("case.yaml:1:1: the file is empty; a case needs at least polarization, domain, grid, sources and until"),
                errors("# nothing here\n"));
        assertEquals(List.of("case.yaml:1:1: expected a mapping with keys such as title, parameters, design_wavelength, design_frequency, "
                + "polarization, domain, grid, materials, shapes, boundaries, sources, probes, flux, surfaces, maps, output, until, numerics, got a list"),
                errors("- polarization: s\n"));
        String flat = """
                polarization: s
                domain: {width: 4 um, height: 3 um}
                grid: {cell: 20 nm}
                sources:
                  - point:
                    at: [0, 0]
                    signal: {pulse: {wavelength: 633 nm, bandwidth: 40 nm}}
                until: {time: 100 fs}
                """;
        assertEquals(List.of("case.yaml:6:5: sources[0]: an entry has exactly one key, its kind (one of point, line, plane_wave, gaussian_beam, "
                + "plane_wave_box); found point, at, signal (indent the settings under 'point:')"), errors(flat));
    }

    @Test
    void everyErrorIsReportedAtOnceInFileOrder() {
        String text = """
                parameters:
                  gap: 0.2 umm
                  n: 1.5
                polarization: s
                domain: {width: 4 um, height: -3 um, colour: red}
                grid: {cell: 20}
                shapes:
                  - disk: {centre: [0, 0], radius: gapp, material: glas}
                  - square: {}
                sources:
                  - point: {at: [0, 0], component: hz, signal: {pulse: {wavelength: 633 nm}}}
                until: {time: n}
                numerics: {precision: quad}
                """;
        List<String> found = errors(text);
        assertEquals(List.of(
                "case.yaml:2:12: parameters.gap: unknown unit 'umm' (did you mean 'um'?); units: nm, um, mm, m, fs, ps, ns, s, Hz, GHz, THz, "
                        + "PHz, deg, rad, S (to multiply by a parameter write '*')",
                "case.yaml:5:31: domain.height: must be positive, got -3 um",
                "case.yaml:5:38: domain.colour: unknown key, expected one of width, height, background",
                "case.yaml:6:14: grid.cell: 20 has no unit, expected a length such as 2 um",
                "case.yaml:8:36: shapes[0].disk.radius: undefined parameter 'gapp' (did you mean 'gap'?)",
                "case.yaml:8:52: shapes[0].disk.material: unknown material 'glas'; define it under materials or use one of vacuum, air, water, "
                        + "fused_silica, borosilicate_crown",
                "case.yaml:9:5: shapes[1].square: unknown kind, expected one of rectangle, polygon, disk, ellipse, half_plane, layer_stack",
                "case.yaml:11:36: sources[0].point.component: hz belongs to p polarization but the case is s (line 4); use ez, hx, hy",
                "case.yaml:11:49: sources[0].point.signal.pulse.bandwidth: missing, expected a wavelength span such as 40 nm or a frequency "
                        + "span such as 30 THz",
                "case.yaml:12:15: until.time: n (1.5) has no unit, expected a time such as 100 fs",
                "case.yaml:13:23: numerics.precision: unknown choice 'quad', expected one of float, double"), found);
    }

    @Test
    void warningsLeaveTheCaseRunnable() throws CaseFileException {
        String text = """
                polarization: p
                domain: {width: 4 um, height: 3 um}
                grid: {cell: 60 nm}
                materials:
                  prism: {index: 1.9}
                shapes:
                  - half_plane: {through: [0, 0], fill: below, material: prism}
                  - disk: {centre: [10 um, 0], radius: 1 um, material: water}
                boundaries:
                  all: pml 5
                sources:
                  - line: {from: [-1 um, -1 um], to: [1 um, -1 um], angle: 70, signal: {pulse: {wavelength: 633 nm, bandwidth: 40 nm}}}
                  - point: {at: [1.9 um, 0], signal: {gaussian_derivative: {frequency: 400 THz}}}
                probes:
                  - {name: p1, at: [0, 1.45 um], component: ey}
                until: {steps: 1000}
                """;
        assertEquals(List.of(
                "case.yaml:3:14: warning: grid.cell: 4.01711 cells per wavelength in prism (n = 1.9) at 457.95 nm with a 60 nm cell, "
                        + "below 10; numerical dispersion will be visible, use a cell of at most 24.1026 nm",
                "case.yaml:8:5: warning: shapes[1].disk: lies entirely outside the domain (x from -2 um to 2 um, y from -1.5 um to 1.5 um) "
                        + "and has no effect",
                "case.yaml:10:8: warning: boundaries.all: a PML of 5 cells (300 nm) is thinner than 8 cells and reflects noticeably; use at least 8",
                "case.yaml:12:60: warning: sources[0].line.angle: at 70 deg in prism (n = 1.9) the wave is evanescent in vacuum (n = 1) with "
                        + "a 1/e decay length of 68.1128 nm at 633 nm, 1.13521 cells; fewer than 4 cells resolve it poorly, use a cell of at most 17.0282 nm",
                "case.yaml:13:18: warning: sources[1].point.at: the source at (1.9 um, 0 um) lies inside the right PML; sources and probes "
                        + "belong in the interior (x from -1.71 um to 1.71 um, y from -1.2 um to 1.2 um)",
                "case.yaml:15:21: warning: probes[0].at: the probe at (0 um, 1.45 um) lies inside the top PML; sources and probes belong in "
                        + "the interior (x from -1.71 um to 1.71 um, y from -1.2 um to 1.2 um)"),
                warnings(text));
    }

    /**
     * The decay length checked against the closed form λ0 / (2π sqrt(n1² sin²θ − n2²)) (Hecht, Optics,
     * 4th ed., sec. 4.7), computed here independently of the reader.
     */
    @Test
    void evanescentDecayLengthFollowsTheClosedForm() throws CaseFileException {
        String text = """
                polarization: s
                domain: {width: 6 um, height: 6 um}
                grid: {cell: 50 nm}
                materials: {glass: {index: 1.5}}
                shapes:
                  - half_plane: {through: [0, 0], fill: below, material: glass}
                sources:
                  - line: {from: [-1 um, -1 um], to: [1 um, -1 um], angle: 60, signal: {ramped_wave: {wavelength: 600 nm}}}
                until: {steps: 10}
                """;
        double n1 = 1.5;
        double s = n1 * Math.sin(Math.toRadians(60));
        double decay = 600e-9 / (2 * Math.PI * Math.sqrt(s * s - 1));
        List<String> evanescent = warnings(text).stream().filter(w -> w.contains(".angle:")).toList();
        assertEquals(List.of(String.format("case.yaml:8:60: warning: sources[0].line.angle: at 60 deg in glass (n = 1.5) the wave is "
                + "evanescent in vacuum (n = 1) with a 1/e decay length of %s nm at 600 nm, %s cells; fewer than 4 cells resolve it poorly, "
                + "use a cell of at most %s nm", Units.number(decay * 1e9), Units.number(decay / 50e-9), Units.number(decay / 4 * 1e9))),
                evanescent);
        double fine = decay / 4 * 0.99;
        assertEquals(List.of(), warnings(text.replace("cell: 50 nm", "cell: " + fine * 1e9 + " nm")).stream()
                .filter(w -> w.contains(".angle:")).toList(), "just over 4 cells: no warning");
        assertEquals(List.of(), warnings(text.replace("angle: 60", "angle: 41")).stream().filter(w -> w.contains(".angle:")).toList(),
                "below the critical angle asin(1/1.5) = 41.8 deg: no evanescent field");
    }

    /** Malformed input of every sort is reported, never thrown as anything but a CaseFileException. */
    @Test
    void oddInputsAreReportedNotThrown() {
        String[] odd = {
            "polarization: [s]", "polarization:", "domain: null", "domain: {width: 1e400 um, height: 3 um}",
            "domain: {width: 4 um, height: 3 um, background: {a: 1}}", "grid: {cell: [1]}",
            "grid: {cells_per_wavelength: -3}", "until: {steps: 1e30}", "until: {time: 100 fs, steps: 3}", "until: []",
            "sources: []", "sources: {point: 1}", "sources:\n  - point:\n", "sources:\n  - 3\n", "sources:\n  - {}\n",
            "? [a]\n: b", "title: {a: 1}", "parameters: [a]", "parameters: {a: }", "parameters: {a: [1]}",
            "materials: {film: null}", "materials: {film: {library: glass}}", "materials: [film]", "materials: {2x: {index: 1}}",
            "materials: {water: {index: 1.33}}", "shapes: {}", "shapes:\n  - disk: null\n", "shapes:\n  - polygon: {corners: [[0, 0], [1 um, 0], [2 um, 0]], material: air}\n",
            "shapes:\n  - polygon: {corners: [[0, 0]], material: air}\n", "shapes:\n  - layer_stack: {start: [0, 0], layers: []}\n",
            "shapes:\n  - layer_stack: {start: [0, 0], layers: [3]}\n", "boundaries: {left: [pml]}", "boundaries: {left: pml 2.5}",
            "boundaries: {left: pml 3 fs}", "boundaries: {left: pec 3}", "boundaries: {left: absorb}", "boundaries: {left: pml -1 um}",
            "boundaries: pml", "probes: [1, 2]", "probes:\n  - {name: a b, at: [0, 0]}\n", "probes:\n  - {name: a, at: [0, 0]}\n  - {name: a, at: [0, 0]}\n",
            "output: {write: probes}", "output: {write: [everything]}", "output: {folder: [a]}", "numerics: {threads: 2.5}",
            "numerics: {threads: 100000}", "a: &x {b: 1}\nc: *x", "design_wavelength: 633 nm\ndesign_frequency: 400 THz",
            "design_frequency: -4 THz", "polarization: s\npolarization: p", "\t- tab", "{", "[", "]", "''", "!!binary xyz"};
        for (String o : odd) {
            String text = replacingTopLevel(o);
            try {
                CaseLoader.parse(text, "case.yaml", Map.of(), ENOUGH_MEMORY);
            } catch (CaseFileException expected) {
                assertTrue(!expected.errors().isEmpty(), "an exception without errors for " + o);
            } catch (RuntimeException e) {
                throw new AssertionError("reading threw " + e + " for the line(s)\n" + o, e);
            }
        }
    }

    /** BASE with the top-level sections that {@code snippet} defines replaced by the snippet. */
    private static String replacingTopLevel(String snippet) {
        java.util.Set<String> keys = new java.util.HashSet<>();
        for (String line : snippet.split("\n")) {
            java.util.regex.Matcher m = java.util.regex.Pattern.compile("^([a-z_]+):").matcher(line);
            if (m.find()) {
                keys.add(m.group(1));
            }
        }
        StringBuilder out = new StringBuilder();
        boolean skipping = false;
        for (String line : BASE.split("\n")) {
            if (!line.startsWith(" ")) {
                skipping = keys.contains(line.substring(0, Math.max(0, line.indexOf(':'))));
            }
            if (!skipping) {
                out.append(line).append('\n');
            }
        }
        return out + snippet + "\n";
    }
}

package org.evanesce.io.casefile;

import org.evanesce.io.casefile.model.MaterialSpec;
import org.evanesce.io.casefile.model.MetalSpec;
import org.evanesce.io.casefile.text.Diagnostic;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.dispersion.MetalLibrary;
import org.evanesce.geometry.dispersion.Spectral;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.evanesce.io.plan.CaseLoader;

/**
 * Metals in case files: the four ways of giving one (terms, library, one measured index, an n, k table)
 * become the model the docs describe, with the warnings and notes the docs promise; bad input is refused
 * with the file, line and what was expected.
 */
class MetalCaseTest {

    private static final ReadOptions ENOUGH_MEMORY = new ReadOptions(1L << 34);
    private static final double OMEGA_633 = Spectral.omegaOfWavelength(633e-9);
    /** Round-off of a closed-form evaluation of ε (a few operations in double). */
    private static final double ROUND_OFF = 1e-12;

    /** A valid case with a gold film; MATERIAL is replaced by the metal's definition. */
    private static final String BASE = """
            polarization: p
            design_wavelength: 633 nm
            materials:
              glass: {index: 1.515}
              metal: MATERIAL
            domain: {width: 0.2 um, height: 1 um, background: glass}
            shapes:
              - layer_stack: {start: [0, 0], layers: [{material: metal, thickness: 50 nm}]}
            grid: {cell: 5 nm}
            sources:
              - point: {at: [0, -0.3 um], signal: {ramped_wave: {wavelength: 633 nm}}}
            until: {time: 20 fs}
            """;

    private static String with(String material) {
        return BASE.replace("MATERIAL", material);
    }

    private static LoadedCase read(String text) throws CaseFileException {
        return CaseLoader.parse(text, "case.yaml", Map.of(), ENOUGH_MEMORY);
    }

    private static List<String> errors(String text, String source) {
        CaseFileException e = assertThrows(CaseFileException.class, () -> CaseLoader.parse(text, source, Map.of(), ENOUGH_MEMORY),
                "expected errors in\n" + text);
        return e.errors().stream().map(Diagnostic::toString).toList();
    }

    private static Complex eps(LoadedCase c, double omega) {
        return c.spec().materials().get("metal").dispersion().orElseThrow().material().permittivity(omega);
    }

    @Test
    void libraryGoldIsRakicsModelWithItsCitationAndNoWarningInsideItsBand() throws CaseFileException {
        LoadedCase c = read(with("{library: gold}"));
        MaterialSpec m = c.spec().materials().get("metal");
        assertTrue(m.isDispersive());
        assertEquals(MetalSpec.Kind.LIBRARY, m.dispersion().get().kind());
        assertEquals(MetalLibrary.RAKIC, m.dispersion().get().model().citation());
        Complex want = MetalLibrary.get("gold").material().permittivity(OMEGA_633);
        assertEquals(0, eps(c, OMEGA_633).minus(want).abs(), ROUND_OFF * want.abs());
        assertEquals(List.of(), c.warnings());
    }

    @Test
    void aBandOutsideTheLibraryFitIsWarnedAbout() throws CaseFileException {
        // Rakić's fits cover 0.1-6 eV, i.e. up to 12.4 um (Appl. Opt. 37, 5271 (1998), as recalled)
        LoadedCase c = read(with("{library: silver}").replace("633 nm", "15 um").replace("cell: 5 nm", "cell: 50 nm")
                .replace("height: 1 um", "height: 10 um").replace("width: 0.2 um", "width: 2 um"));
        assertTrue(c.warnings().stream().anyMatch(w -> w.message().contains("leaves it")), c.warnings().toString());
    }

    @Test
    void drudeAndLorentzTermsReadInElectronVoltsRadiansPerSecondOrHertzAlike() throws CaseFileException {
        double wpEv = 8.9;
        double wp = Spectral.omegaOfElectronVolts(wpEv);
        String ev = "{permittivity: 2, drude: [{plasma_frequency: 8.9 eV, damping: 0.07 eV}],"
                + " lorentz: [{strength: 1.2, resonance: 2.9 eV, damping: 0.9 eV}]}";
        String rad = String.format(java.util.Locale.ROOT, "{permittivity: 2, drude: [{plasma_frequency: %.17g rad/s, damping: %.17g rad/s}],"
                + " lorentz: [{strength: 1.2, resonance: %.17g rad/s, damping: %.17g rad/s}]}", wp, Spectral.omegaOfElectronVolts(0.07),
                Spectral.omegaOfElectronVolts(2.9), Spectral.omegaOfElectronVolts(0.9));
        String hz = String.format(java.util.Locale.ROOT, "{permittivity: 2, drude: [{plasma_frequency: %.17g THz, damping: %.17g THz}],"
                + " lorentz: [{strength: 1.2, resonance: %.17g THz, damping: %.17g THz}]}", wp / (2 * Math.PI) / 1e12,
                Spectral.omegaOfElectronVolts(0.07) / (2 * Math.PI) / 1e12, Spectral.omegaOfElectronVolts(2.9) / (2 * Math.PI) / 1e12,
                Spectral.omegaOfElectronVolts(0.9) / (2 * Math.PI) / 1e12);
        Complex a = eps(read(with(ev)), OMEGA_633);
        Complex b = eps(read(with(rad)), OMEGA_633);
        Complex h = eps(read(with(hz)), OMEGA_633);
        // ε = ε∞ − ωp²/(ω² + iγω) + Δε ω0²/(ω0² − ω² − iγω) (Taflove & Hagness, 3rd ed., ch. 9), by hand
        double w = OMEGA_633;
        double g = Spectral.omegaOfElectronVolts(0.07);
        double w0 = Spectral.omegaOfElectronVolts(2.9);
        double g0 = Spectral.omegaOfElectronVolts(0.9);
        Complex drude = Complex.real(wp * wp).divide(new Complex(w * w, g * w));
        Complex lorentz = Complex.real(1.2 * w0 * w0).divide(new Complex(w0 * w0 - w * w, -g0 * w));
        Complex want = Complex.real(2).minus(drude).plus(lorentz);
        for (Complex got : List.of(a, b, h)) {
            assertEquals(0, got.minus(want).abs(), 1e-9 * want.abs(), got + " against " + want);
        }
    }

    @Test
    void aMeasuredIndexIsReproducedExactlyAndWarnedAboutAsSingleWavelength() throws CaseFileException {
        LoadedCase c = read(with("{index: 0.18+3.43i at 633 nm}"));
        Complex want = new Complex(0.18, 3.43).square();
        assertEquals(0, eps(c, OMEGA_633).minus(want).abs(), ROUND_OFF * want.abs());
        assertTrue(c.warnings().stream().anyMatch(w -> w.message().contains("single-wavelength model")
                && w.message().contains("the run uses 633 nm only")), c.warnings().toString());
        LoadedCase wide = read(with("{index: 0.18+3.43i at 633 nm}").replace("until:", "maps: {wavelengths: [600 nm, 700 nm]}\nuntil:")
                .replace("ramped_wave: {wavelength: 633 nm}", "pulse: {wavelength: 650 nm, bandwidth: 100 nm}"));
        assertTrue(wide.warnings().stream().anyMatch(w -> w.message().contains("at the run's band ends")), wide.warnings().toString());
    }

    @Test
    void aComplexIndexWithoutItsWavelengthAndGainAreRefused() {
        assertEquals(List.of("case.yaml:5:18: materials.metal.index: a complex index needs the wavelength it was measured at: write it "
                + "as '0.2+3.4i at 633 nm' (n+ki, k >= 0 for a lossy material), with your wavelength"),
                errors(with("{index: 0.2+3.4i}"), "case.yaml"));
        assertTrue(errors(with("{index: 0.2-3.4i at 633 nm}"), "case.yaml").get(0).contains("is gain"));
        assertEquals(List.of("case.yaml:5:25: materials.metal.permittivity: must be positive, got -11.7; a metal's negative "
                + "permittivity depends on frequency: give drude/lorentz terms, a library metal (library: gold), or its measured "
                + "index (index: 0.18+3.43i at 633 nm); docs/case-file.md, \"Metals\""),
                errors(with("{permittivity: -11.7}"), "case.yaml"));
        assertTrue(errors(with("{drude: [{plasma_frequency: 9 eV}]}"), "case.yaml").get(0)
                .contains("drude[0].damping: missing"));
        assertTrue(errors(with("{drude: [{plasma_frequency: 9 um, damping: 0.1 eV}]}"), "case.yaml").get(0)
                .contains("expected a frequency"));
        assertTrue(errors(with("{library: gold, conductivity: 1 S/m}"), "case.yaml").get(0)
                .contains("read with drude/lorentz terms only"));
    }

    /** The table: Johnson & Christy's gold rows 520.9-821.1 nm (recalled from memory, as in MetalLibrary). */
    private static final String TABLE = """
            # gold, Johnson & Christy 1972 (recalled from memory)
            wavelength_nm,n,k
            520.9,0.62,2.081
            548.6,0.43,2.455
            582.1,0.29,2.863
            616.8,0.21,3.272
            659.5,0.14,3.697
            704.5,0.13,4.103
            756.0,0.14,4.542
            821.1,0.16,5.083
            """;

    /** The note prints the worst error to 3 significant digits: up to half a unit of the last one, relative. */
    private static final double PRINTED_ROUNDING = 0.005;

    private static Path write(Path dir, String table) throws IOException {
        Files.writeString(dir.resolve("nk.csv"), table);
        Path c = dir.resolve("case.yaml");
        Files.writeString(c, with("{table: nk.csv}").replace("until:", "flux: {wavelengths: {from: 600 nm, to: 700 nm, count: 3},"
                + " lines: [{y: -0.4 um, measures: reflected}]}\nuntil:").replace("point: {at: [0, -0.3 um]",
                "plane_wave: {y: -0.3 um")
                .replace("ramped_wave: {wavelength: 633 nm}", "pulse: {wavelength: 650 nm, bandwidth: 100 nm}")
                .replace("time: 20 fs", "time: 100 fs")
                + "boundaries: {left: periodic, right: periodic, bottom: pml, top: pml}\n");
        return c;
    }

    @Test
    void aTableIsFittedOverTheRunsBandWithinItsReportedError(@TempDir Path dir) throws Exception {
        LoadedCase c = CaseLoader.read(write(dir, TABLE), Map.of(), ENOUGH_MEMORY);
        Diagnostic note = c.notes().stream().filter(n -> n.message().contains("worst relative error")).findFirst().orElseThrow();
        assertTrue(note.at().toString().startsWith(dir.resolve("case.yaml") + ":5:"), note.toString());
        double worst = Double.parseDouble(note.message().replaceAll(".*worst relative error of ε ([0-9.eE+-]+) at.*", "$1"));
        assertTrue(worst <= 0.05, note.toString());
        // the rows the run's band 600-700 nm reaches (widened to 582.1-704.5 nm): each within the reported error
        double[][] rows = {{582.1, 0.29, 2.863}, {616.8, 0.21, 3.272}, {659.5, 0.14, 3.697}, {704.5, 0.13, 4.103}};
        for (double[] r : rows) {
            Complex data = new Complex(r[1], r[2]).square();
            Complex fit = eps(c, Spectral.omegaOfWavelength(r[0] * 1e-9));
            assertTrue(fit.minus(data).abs() / data.abs() <= worst * (1 + PRINTED_ROUNDING), r[0] + " nm: " + fit + " against " + data);
        }
    }

    @Test
    void badTablesAreRefusedWithTheirFileAndLine(@TempDir Path dir) throws Exception {
        String csv = dir.resolve("nk.csv").toString();
        Map<String, String> cases = Map.of(
                TABLE.replace("616.8,0.21,3.272", "616.8,0.21,-3.272"), csv + ":6:1: materials.metal.table: nk.csv, line 6: k = -3.27200 "
                        + "must be finite and >= 0 (k < 0 is gain, not a passive material)",
                TABLE.replace("616.8,0.21,3.272", "516.8,0.21,3.272"), csv + ":6:1: materials.metal.table: nk.csv, line 6: wavelength "
                        + "5.16800e-07 m is out of order (the table's wavelengths increase before it); rows must be strictly increasing"
                        + " or strictly decreasing in wavelength",
                TABLE.replace("616.8,0.21,3.272", "616.8,O.21,3.272"), csv + ":6:7: materials.metal.table: column n: 'O.21' is not a "
                        + "finite number",
                "wavelength_nm,n,k\n600,0.2,3\n650,0.15,3.6\n700,0.13,4.1\n", csv + ":4:1: materials.metal.table: nk.csv: 3 rows, at "
                        + "least 4 are needed to fit a model",
                TABLE.replace("wavelength_nm,n,k", "lambda,n,k"), csv + ":2:1: materials.metal.table: expected the header "
                        + "'wavelength_nm,n,k' (or 'wavelength_um,n,k') as the first line that is not a comment, got 'lambda,n,k'");
        for (Map.Entry<String, String> e : cases.entrySet()) {
            Path c = write(dir, e.getKey());
            CaseFileException x = assertThrows(CaseFileException.class, () -> CaseLoader.read(c, Map.of(), ENOUGH_MEMORY));
            assertEquals(List.of(e.getValue()), x.errors().stream().map(Diagnostic::toString).toList());
        }
    }

    @Test
    void aTableOutsideTheCasesFolderOrNotCoveringTheBandIsRefused(@TempDir Path dir) throws Exception {
        Path sub = Files.createDirectories(dir.resolve("case"));
        Path c = write(sub, TABLE);
        Files.writeString(c, Files.readString(c).replace("table: nk.csv", "table: ../nk.csv"));
        Files.writeString(dir.resolve("nk.csv"), TABLE);
        CaseFileException x = assertThrows(CaseFileException.class, () -> CaseLoader.read(c, Map.of(), ENOUGH_MEMORY));
        assertTrue(x.errors().get(0).message().contains("lies outside the case file's folder"), x.errors().toString());
        Files.writeString(c, Files.readString(c).replace("table: ../nk.csv", "table: nk.csv").replace("from: 600 nm", "from: 450 nm"));
        x = assertThrows(CaseFileException.class, () -> CaseLoader.read(c, Map.of(), ENOUGH_MEMORY));
        assertTrue(x.errors().get(0).message().contains("but the run's band is"), x.errors().toString());
    }
}

package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Stream;
import org.evanesce.io.cli.ExitCode;
import org.evanesce.solver.reference.LineDipoleEmission;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Every example in {@code cases/} runs at a reduced resolution (its {@code cpw} parameter overridden, see
 * cases/README.md) and one physical number of each is compared with something outside the project: a
 * published closed form or a conservation law. Each check names its source, its tolerance is about ten
 * times the difference measured at that resolution (the measurement is in the comment), and the comment
 * says what a wrong gap or angle would give. An example without a check here fails, so a new example
 * comes with its check. Together the runs took 113 s of the test run on two cores shared with other
 * work (load 14 to 16, 2026-12-03).
 */
class ExamplePhysicsTest {

    private static final double WAVELENGTH = 633e-9;

    /** A check: the parameters overridden for each of its runs (one or two runs), and the evaluation. */
    private record Check(List<Map<String, String>> runs, Evaluation evaluation) {
    }

    @FunctionalInterface
    private interface Evaluation {
        /** Asserts the physics on the runs' results folders, in the order of {@link Check#runs}. */
        void check(String example, List<Path> outs) throws IOException;
    }

    private static final Map<String, Check> CHECKS = Map.ofEntries(
            Map.entry("gap-tunnelling-plane-wave.yaml", new Check(List.of(Map.of("cpw", "16")),
                    ExamplePhysicsTest::gapTunnelling)),
            Map.entry("film-between-glass-normal-incidence.yaml", new Check(
                    List.of(Map.of("cpw", "16"), Map.of("cpw", "16", "n_film", "1.5")), ExamplePhysicsTest::film)),
            Map.entry("point-source-below-a-gap.yaml", new Check(
                    List.of(Map.of("cpw", "12"), Map.of("cpw", "12", "gap", "0.001nm")), ExamplePhysicsTest::pointSource)),
            Map.entry("prism-evanescent-tail.yaml", new Check(List.of(Map.of("cpw", "10")),
                    ExamplePhysicsTest::evanescentTail)),
            Map.entry("cube-splitter-p.yaml", new Check(
                    List.of(Map.of("cpw", "12"), Map.of("cpw", "12", "n_gap", "1.7")), ExamplePhysicsTest::cube)),
            Map.entry("touch-plate-droplet.yaml", new Check(List.of(Map.of("cpw", "12")), ExamplePhysicsTest::touchPlate)),
            Map.entry("two-prism-attenuator-beam.yaml", new Check(List.of(Map.of("cpw", "10")),
                    ExamplePhysicsTest::twoPrism)),
            Map.entry("tilted-gap-wedge-beam.yaml", new Check(List.of(Map.of("cpw", "10")), ExamplePhysicsTest::tiltedGap)),
            Map.entry("prism-coupler-film-beam.yaml", new Check(List.of(Map.of("cpw", "6")),
                    ExamplePhysicsTest::prismCoupler)),
            Map.entry("plasmon-sensor-gold-water.yaml", new Check(List.of(Map.of("cpw", "wl/(n_glass*5nm)")),
                    ExamplePhysicsTest::plasmonSensor)),
            Map.entry("particle-in-evanescent-field.yaml", new Check(
                    List.of(Map.of("cpw", "wl/(n_glass*20nm)", "height", "60nm"),
                            Map.of("cpw", "wl/(n_glass*20nm)", "height", "180nm")), ExamplePhysicsTest::particle)),
            Map.entry("attenuator-corner-beam.yaml", new Check(List.of(Map.of("cpw", "10")),
                    ExamplePhysicsTest::attenuatorCorner)),
            Map.entry("plasmon-sensor-gold-water-beam.yaml", new Check(List.of(Map.of("cpw", "wl/(n_glass*10nm)")),
                    ExamplePhysicsTest::plasmonBeam)),
            Map.entry("metal-film-attenuator-chromium.yaml", new Check(List.of(Map.of("cpw", "wl/(n_glass*3nm)")),
                    ExamplePhysicsTest::metalFilm)));

    static List<Path> examples() throws IOException {
        return ExampleCasesTest.examples();
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("examples")
    void keepsItsPhysicsAtReducedResolution(Path example, @TempDir Path tmp) throws IOException {
        String name = example.getFileName().toString();
        Check check = CHECKS.get(name);
        assertTrue(check != null, name + " has no physics check in ExamplePhysicsTest; add one (a closed form or a "
                + "conservation law it should reproduce at a reduced resolution)");
        List<Path> outs = new ArrayList<>();
        for (Map<String, String> overrides : check.runs()) {
            Path out = tmp.resolve("run" + outs.size());
            List<String> args = new ArrayList<>(List.of("run", example.toString(), "--out", out.toString()));
            overrides.forEach((k, v) -> args.addAll(List.of("--set", k + "=" + v)));
            Cli.Outcome o = Cli.run(args.toArray(String[]::new));
            assertEquals(ExitCode.OK, o.code(), o::toString);
            ExampleCasesTest.assertWroteWhatItAsks(example, out, o, overrides.get("cpw"));
            outs.add(out);
        }
        check.evaluation().check(name, outs);
        try (Stream<Path> s = Files.list(tmp)) {
            assertEquals(outs.size(), s.count(), "leftovers beside the run folders in " + tmp);
        }
    }

    /** Prints the measured value (for the tolerances' comments) and asserts |measured − expected| ≤ tolerance. */
    private static void near(String example, String what, double expected, double measured, double tolerance) {
        String line = String.format(Locale.ROOT, "%s: %s = %.6g, expected %.6g, difference %.3g, tolerance %.3g",
                example, what, measured, expected, measured - expected, tolerance);
        System.out.println(line);
        assertTrue(Math.abs(measured - expected) <= tolerance, line);
    }

    // --- gap-tunnelling-plane-wave: T through the gap against the FTIR closed form ---------------------

    /**
     * Measured at cpw 16: T − closed form = 0.0049 at 632 nm (0.023 at cpw 8, 0.0024 at cpw 20: second order).
     * The case's 200 nm gap gives T = 0.384; a 175 nm gap (0.458) or a 230 nm gap (0.310) fail. Not fine
     * enough for 20 nm: run with --set gap=220nm, the example gives 0.337 (closed form 0.332), which passes.
     */
    private static final double GAP_T_TOLERANCE = 0.05;

    private static void gapTunnelling(String example, List<Path> outs) throws IOException {
        // Zhu, Yu, Hawley, Roy, Am. J. Phys. 54, 601 (1986): 1/T = 1 + α sinh²(κd), via PlaneWaveRunTest.tunnelling,
        // which derives α from the characteristic matrix. The pulse's in-plane wavenumber is that of 45 degrees at
        // 633 nm, so at 632 nm sin θ = sin 45° · 632/633.
        double theta = Math.asin(Math.sin(Math.toRadians(45)) * 632 / 633);
        double exact = PlaneWaveRunTest.tunnelling("s", 1.5, 1.0, 200e-9, theta, 632e-9);
        near(example, "T at 632 nm", exact, ExampleOutputs.flux(outs.get(0), 632.0, "T_transmitted"), GAP_T_TOLERANCE);
    }

    // --- film-between-glass-normal-incidence: steady transmittance against the Airy formula ----------------

    /**
     * Measured at cpw 16 (the example's own, a run of about a second): T − Airy = +0.0071 (−0.032 at cpw 8; the
     * 158 nm film is only 4 to 8 cells thick, and the error does not fall smoothly). No film (T = 1) or a
     * half-wave film (316 nm, T = 1.000) fail; a 100 nm film (T = 0.891) would pass.
     */
    private static final double FILM_T_TOLERANCE = 0.07;

    private static void film(String example, List<Path> outs) throws IOException {
        // the steady wave's amplitude at 'transmitted' (its 633 nm Fourier component over whole periods from 60 fs
        // on, where the case's wave is steady), with and without the film
        double f = ExampleClosedForms.C0 / WAVELENGTH;
        double to = 60e-15 + Math.floor((100e-15 - 60e-15) * f) / f;
        double tFilm = ExampleOutputs.probe(outs.get(0), "transmitted").spectrum(f, 60e-15, to);
        double tRef = ExampleOutputs.probe(outs.get(1), "transmitted").spectrum(f, 60e-15, to);
        double airy = ExampleClosedForms.airy(1.5, 1.0, 158e-9, WAVELENGTH);
        near(example, "T = (transmitted / reference)^2", airy, (tFilm / tRef) * (tFilm / tRef), FILM_T_TOLERANCE);
    }

    // --- point-source-below-a-gap: tunnelled share at the 'beyond_above' probe --------------------------

    /**
     * Measured at cpw 12: |E(gap)/E(no gap)|² at 633 nm − angular-spectrum value = −0.0037 (0.339 against 0.342).
     * Run with --set gap=200nm the example gives 0.185 (its own integral 0.190): it fails; a 120 nm gap gives
     * about 0.47 by the integral.
     */
    private static final double POINT_TOLERANCE = 0.04;

    private static void pointSource(String example, List<Path> outs) throws IOException {
        double f = ExampleClosedForms.C0 / WAVELENGTH;
        double sim = ExampleOutputs.probe(outs.get(0), "beyond_above").spectrum(f)
                / ExampleOutputs.probe(outs.get(1), "beyond_above").spectrum(f);
        double[] src = ExampleOutputs.site(outs.get(0), null);
        double[] at = ExampleOutputs.site(outs.get(0), "beyond_above");
        double[] withGap = ExampleClosedForms.lineSourceThroughGap(1.5, 1.0, -75e-9, 75e-9, WAVELENGTH, src[0], src[1], at[0], at[1]);
        double[] without = ExampleClosedForms.lineSourceThroughGap(1.5, 1.0, 0, 0, WAVELENGTH, src[0], src[1], at[0], at[1]);
        double expected = (withGap[0] * withGap[0] + withGap[1] * withGap[1]) / (without[0] * without[0] + without[1] * without[1]);
        near(example, "|E(gap)/E(no gap)|^2 at beyond_above, 633 nm", expected, sim * sim, POINT_TOLERANCE);
    }

    // --- prism-evanescent-tail: decay over the first 100 nm outside the face ----------------------------

    /**
     * Measured at cpw 10: 158.6 nm against the plane wave's 151.0 nm (5 %; 154.6 nm at cpw 16). Run with
     * --set n_prism=1.5 the example gives 328 nm (+117 %) and fails; so does 1.35 (below the critical angle).
     */
    private static final double TAIL_RELATIVE_TOLERANCE = 0.5;

    private static void evanescentTail(String example, List<Path> outs) throws IOException {
        double face = ExampleOutputs.probe(outs.get(0), "face").peak();
        double out = ExampleOutputs.probe(outs.get(0), "out_100nm").peak();
        double measured = 100e-9 / Math.log(face / out);
        double expected = ExampleClosedForms.decayLength(1.7, 1.0, Math.toRadians(45), WAVELENGTH);
        near(example, "relative difference of the 1/e depth over the first 100 nm", 0, measured / expected - 1,
                TAIL_RELATIVE_TOLERANCE);
    }

    // --- cube-splitter-p: the tunnelled and reflected shares add up to the whole pulse ------------------

    /**
     * Measured at cpw 12: T + R − 1 = −0.011 (+0.012 at cpw 8, −0.038 at cpw 10, +0.002 at cpw 16: the pulse
     * energy at one point stands for the beam's only as well as the beam keeps its shape). A reflected probe that
     * saw nothing, or a comparison run that did not fill the gap, fail.
     */
    private static final double CUBE_ENERGY_TOLERANCE = 0.1;
    /**
     * Measured at cpw 12: T − closed form = +0.025 (+0.030 at cpw 16, +0.032 at cpw 8): the finite beam, not the
     * grid. Four times that, not ten: ten times (0.25) would admit every gap from 50 to 160 nm. The closed form
     * gives 0.614 at 100 nm; a 70 nm gap (0.778) or a 130 nm gap (0.461) fail.
     */
    private static final double CUBE_T_TOLERANCE = 0.1;

    private static void cube(String example, List<Path> outs) throws IOException {
        // energy conservation in a lossless scene (Poynting's theorem): the pulse energies at 'transmitted' and
        // 'reflected', over that at 'transmitted' with the gap filled, add up to 1 (both probes lie the same
        // distance along the beam from the source, so they see the same spreading)
        double ref = ExampleOutputs.probe(outs.get(1), "transmitted").energy();
        double t = ExampleOutputs.probe(outs.get(0), "transmitted").energy() / ref;
        double r = ExampleOutputs.probe(outs.get(0), "reflected").energy() / ref;
        near(example, "T + R (pulse energies)", 1, t + r, CUBE_ENERGY_TOLERANCE);
        // the tunnelled share against the p-polarized FTIR closed form (Zhu et al. 1986, via PlaneWaveRunTest)
        double exact = PlaneWaveRunTest.tunnelling("p", 1.7, 1.0, 100e-9, Math.toRadians(45), WAVELENGTH);
        near(example, "T (pulse energies)", exact, t, CUBE_T_TOLERANCE);
    }

    // --- touch-plate-droplet: light travels through the plate at c/n ----------------------------------

    /**
     * Measured at cpw 12: 14.08 fs against 14.67 fs (−0.6 fs; +0.3 fs at cpw 16). A weak check: it fails for a
     * plate of index 2.2 (21.5 fs) or a time axis off by more than 40 %, not for a small error in the index.
     */
    private static final double PLATE_DELAY_TOLERANCE = 6e-15;

    private static void touchPlate(String example, List<Path> outs) throws IOException {
        // the pulse's front (5 % of each probe's peak) reaches 'guided_3' later than 'under' by the extra path in
        // glass over c/n (phase and group speed c/n in a non-dispersive medium: E. Hecht, Optics, 4th ed. (2002), sec. 3.5 and 7.6,
        // section numbers from memory)
        double[] src = ExampleOutputs.site(outs.get(0), null);
        double[] under = ExampleOutputs.site(outs.get(0), "under");
        double[] guided = ExampleOutputs.site(outs.get(0), "guided_3");
        double extra = Math.hypot(guided[0] - src[0], guided[1] - src[1]) - Math.hypot(under[0] - src[0], under[1] - src[1]);
        double measured = ExampleOutputs.probe(outs.get(0), "guided_3").onset(0.05)
                - ExampleOutputs.probe(outs.get(0), "under").onset(0.05);
        near(example, "delay under -> guided_3 (s)", 1.5 * extra / ExampleClosedForms.C0, measured, PLATE_DELAY_TOLERANCE);
    }

    // --- two-prism-attenuator-beam and tilted-gap-wedge-beam ------------------------------------------

    /**
     * Measured at cpw 10: T − closed form = +0.0085 at 633 nm (+0.0016 at cpw 16, +0.0027 at cpw 20, where the
     * angular-spectrum value of the 2 um beam is 0.0004 above the plane wave's). A 250 nm gap (0.267) or a 150 nm
     * gap (0.542) fail; a 220 nm gap (0.332) passes.
     */
    private static final double BEAM_T_TOLERANCE = 0.085;
    /**
     * Measured at cpw 10: A = 1 − R − T = 2.1e-4 at 633 nm (3.4e-4 at cpw 16). Light lost through a PML that
     * reflects, or an incident power measured wrongly by 1 %, fail.
     */
    private static final double BEAM_ENERGY_TOLERANCE = 2e-3;

    private static void twoPrism(String example, List<Path> outs) throws IOException {
        // a beam 2 um wide tunnels as the plane wave at its axis's 45 degrees to within 5e-4 (the angular-spectrum
        // column): Zhu et al. (1986), as for gap-tunnelling-plane-wave
        double exact = PlaneWaveRunTest.tunnelling("s", 1.5, 1.0, 200e-9, Math.toRadians(45), WAVELENGTH);
        near(example, "T at 633 nm", exact, ExampleOutputs.flux(outs.get(0), 633.0, "T_transmitted"), BEAM_T_TOLERANCE);
    }

    /**
     * Measured at cpw 10: up_from_below − (into_prism + into_air + right_side − left_side) = 2.7e-7 at 633 nm
     * (1.8e-7 at cpw 16), against into_air = 0.157; 10x that. A gap in the closed path (into_air starting a cell
     * right of the corner, where the corner's light passes) leaves a residue orders of magnitude larger.
     */
    private static final double CORNER_CLOSURE_TOLERANCE = 3e-6;

    private static void attenuatorCorner(String example, List<Path> outs) throws IOException {
        // energy conservation in a lossless scene (Poynting's theorem, Born & Wolf sec. 1.1.4): what crosses the line
        // under the gap upwards leaves the closed path through its other three sides
        Path o = outs.get(0);
        double in = ExampleOutputs.surfaces(o, 633.0, "up_from_below");
        double out = ExampleOutputs.surfaces(o, 633.0, "into_prism") + ExampleOutputs.surfaces(o, 633.0, "into_air")
                + ExampleOutputs.surfaces(o, 633.0, "right_side") - ExampleOutputs.surfaces(o, 633.0, "left_side");
        near(example, "power into the closed path minus power out of it at 633 nm", 0, in - out, CORNER_CLOSURE_TOLERANCE);
    }

    private static void tiltedGap(String example, List<Path> outs) throws IOException {
        // energy conservation in a lossless scene (Poynting's theorem): R + T = 1, A = 1 − R − T = 0
        near(example, "A = 1 - R - T at 633 nm", 0, ExampleOutputs.flux(outs.get(0), 633.0, "A"), BEAM_ENERGY_TOLERANCE);
    }

    // --- prism-coupler-film-beam: no light crosses into the substrate beyond its critical angle ----------

    /**
     * Measured at cpw 6: T = 1.1e-4 at 632 nm (1.0e-4 at cpw 12 and 16: light scattered at the prism's ends).
     * Below the substrate's critical angle (arcsin(1.45/1.8) = 53.7 degrees) light crosses into it: run with
     * --set theta=50deg the example gives T = 0.32 and fails.
     */
    private static final double COUPLER_T_TOLERANCE = 1e-3;

    private static void prismCoupler(String example, List<Path> outs) throws IOException {
        // total internal reflection (Hecht sec. 4.7): at 59 degrees n_prism sin θ = 1.543 exceeds the substrate's
        // 1.45 for every plane wave of the beam, so nothing propagates into the substrate: T = 0
        near(example, "T into the substrate at 632 nm", 0, ExampleOutputs.flux(outs.get(0), 632.0, "T_transmitted"),
                COUPLER_T_TOLERANCE);
    }

    // --- plasmon-sensor-gold-water: the reflectance dip against the three-layer Fresnel formula ------------

    /**
     * Measured at 5 nm cells (the example's own, faces of the film on node rows): R − formula = −2.8e-4 at 74.8°,
     * the dip (R = 0.092; the same run at 72°, on the dip's flank, gave −0.020, and −0.006 with 2.5 nm cells). A
     * wrong angle fails: R = 0.34 at 72°, 0.39 at 78°; so does a staircased film (+0.16 at 72° with 2.5 nm cells,
     * before the face average).
     */
    private static final double PLASMON_R_TOLERANCE = 3e-3;

    private static void plasmonSensor(String example, List<Path> outs) throws IOException {
        // H. Raether, Surface Plasmons on Smooth and Rough Surfaces (1988), eq. (2.13), the reflectance of the
        // prism / metal film / dielectric (Born & Wolf, Principles of Optics, sec. 1.6.4 for the p amplitudes):
        // R = |(r01 + r12 e^{2i kz1 d}) / (1 + r01 r12 e^{2i kz1 d})|², r_ik = (kz_i/ε_i − kz_k/ε_k)/(kz_i/ε_i + kz_k/ε_k)
        // for p, kz = sqrt(ε k0² − kx²) with Im kz ≥ 0; the gold's ε is the grid's (summary.json, grid_epsilon),
        // the water's the library fit's at 633 nm
        String summary = Files.readString(outs.get(0).resolve("summary.json"));
        java.util.regex.Matcher re = java.util.regex.Pattern.compile("\"grid_epsilon_real\": ([-0-9.eE+]+),\\s*"
                + "\"grid_epsilon_imaginary\": ([-0-9.eE+]+)").matcher(summary);
        assertTrue(re.find(), "no grid_epsilon in " + summary);
        org.evanesce.geometry.Complex gold = new org.evanesce.geometry.Complex(Double.parseDouble(re.group(1)),
                Double.parseDouble(re.group(2)));
        double nWater = org.evanesce.io.casefile.model.LibraryMaterial.WATER.index(WAVELENGTH);
        double k0 = 2 * Math.PI / WAVELENGTH;
        double kx = k0 * 1.515 * Math.sin(Math.toRadians(74.8));
        org.evanesce.geometry.Complex[] eps = {org.evanesce.geometry.Complex.real(1.515 * 1.515), gold,
            org.evanesce.geometry.Complex.real(nWater * nWater)};
        org.evanesce.geometry.Complex[] q = new org.evanesce.geometry.Complex[3];
        for (int k = 0; k < 3; k++) {
            q[k] = eps[k].times(k0 * k0).minus(kx * kx).sqrtUpper().divide(eps[k]);
        }
        org.evanesce.geometry.Complex r01 = q[0].minus(q[1]).divide(q[0].plus(q[1]));
        org.evanesce.geometry.Complex r12 = q[1].minus(q[2]).divide(q[1].plus(q[2]));
        org.evanesce.geometry.Complex phase = q[1].times(eps[1]).times(2 * 50e-9).timesI().exp();
        org.evanesce.geometry.Complex r = r01.plus(r12.times(phase)).divide(org.evanesce.geometry.Complex.ONE.plus(r01.times(r12)
                .times(phase)));
        near(example, "R at the plasmon dip (74.8 deg, 633 nm)", r.norm(), ExampleOutputs.flux(outs.get(0), 633.0, "R_reflected"),
                PLASMON_R_TOLERANCE);
    }

    // --- particle-in-evanescent-field: the excitation follows exp(-2z/delta), the scattering with the emission --

    /**
     * Measured with 20 nm cells (the particle, radius 16 nm, smoothed into a cell or two), 60 nm and 180 nm above
     * the face, s: absorbed ratio against exp(−2Δz/δ) +0.61 % (+0.40 % with 15 nm cells, +0.26 % with the example's
     * 10 nm). The bound is 5 %: a decay depth 5 % off (the field of a 58° or 62° incidence) moves the ratio
     * by 10 %.
     */
    private static final double PARTICLE_ABSORBED_TOLERANCE = 0.05;
    /**
     * Measured with the same runs: the scattered ratio against exp(−2Δz/δ)·F(z)/F(z0) +0.93 % (F(z)/F(z0) = 1.206);
     * against exp(−2Δz/δ) alone it is +22 %, so a check that forgot the emission near the glass would fail. The
     * issue's 5 % bound.
     */
    private static final double PARTICLE_EMISSION_TOLERANCE = 0.05;

    private static void particle(String example, List<Path> outs) throws IOException {
        // the evanescent intensity falls as exp(−2z/δ), δ = 1/κ, κ = k0 sqrt(n² sin²θ − n_air²) (M. Born & E. Wolf,
        // Principles of Optics, 7th ed., 1999, §1.5.4; the built-in air's index 1.000277): what a small absorber
        // takes (D. Axelrod et al., Annu. Rev. Biophys. Bioeng. 13, 247 (1984), from memory); what a small
        // scatterer sends out is that times the emission factor F(z) of a line dipole near the glass (W. Lukosz &
        // R. E. Kunz, J. Opt. Soc. Am. 67, 1607 (1977), from memory, in 2D: LineDipoleEmission)
        double nAir = 1.000277;
        double k0 = 2 * Math.PI / WAVELENGTH;
        double kappa = k0 * Math.sqrt(1.5 * 1.5 * 0.75 - nAir * nAir);
        double intensity = Math.exp(-2 * kappa * 120e-9);
        double absorbed = ExampleOutputs.surfaces(outs.get(1), 633.0, "round_particle_out")
                / ExampleOutputs.surfaces(outs.get(0), 633.0, "round_particle_out");
        near(example, "absorbed power at 180 nm over 60 nm, relative to exp(-2 dz/delta)", 1, absorbed / intensity,
                PARTICLE_ABSORBED_TOLERANCE);
        double emission = LineDipoleEmission.relativePower(LineDipoleEmission.Axis.Z, 180e-9, k0, nAir * nAir, 2.25)
                / LineDipoleEmission.relativePower(LineDipoleEmission.Axis.Z, 60e-9, k0, nAir * nAir, 2.25);
        double scattered = ExampleOutputs.surfaces(outs.get(1), 633.0, "scattered_out")
                / ExampleOutputs.surfaces(outs.get(0), 633.0, "scattered_out");
        near(example, "scattered power at 180 nm over 60 nm, relative to exp(-2 dz/delta) F(z)/F(z0) (F(z)/F(z0) = "
                + emission + ")", 1, scattered / (intensity * emission), PARTICLE_EMISSION_TOLERANCE);
    }

    // --- plasmon-sensor-gold-water-beam: the beam's reflectance against its angular-spectrum integral -------

    /**
     * Measured at 10 nm cells (the example's own, the film 5 cells thick): R − integral = −0.0092 (simulated 0.3062,
     * integral 0.3155; the program's own angular-spectrum column 0.3154; with 5 nm cells −0.0038, so the grid's). Set at
     * about six times that rather than ten: the plane wave's R at the same angle, 0.092, what a beam wide enough to
     * miss the dip's flanks would give, lies 0.22 below, and the tolerance keeps well clear of it. A beam at 72 degrees
     * (integral 0.41) or 80 degrees (0.45) fails; the beam's dip is so wide that 76 or 78 degrees (0.31, 0.36) pass.
     */
    private static final double PLASMON_BEAM_R_TOLERANCE = 0.06;
    /**
     * The simulated lateral shift against the angular spectrum's (both from the incident beam mirrored on the line:
     * SpecularCentroidTest), m. Measured +0.084 um at 10 nm cells, shrinking under refinement (+0.043 um at 5 nm;
     * PlasmonBeamShiftStudyTest, tag accuracy): the grid's error, about first order here. Ten times the measurement
     * would exceed the shift itself (−0.78 um); this is a check against a lost or mirrored baseline (errors of
     * 1.6 um and more), the study is the one that shows convergence.
     */
    private static final double PLASMON_BEAM_SHIFT_TOLERANCE = 0.15e-6;

    private static void plasmonBeam(String example, List<Path> outs) throws IOException {
        near(example, "lateral shift of the reflected beam on its line (m)",
                ExampleOutputs.flux(outs.get(0), 633.0, "shift_reflected_beam_um") * 1e-6,
                ExampleOutputs.flux(outs.get(0), 633.0, "shift_reflected_um") * 1e-6, PLASMON_BEAM_SHIFT_TOLERANCE);
        // a 1 um beam at 74.8 deg reaches grazing incidence: the run says that its shift depends on the line's length
        assertTrue(Files.readString(outs.get(0).resolve("summary.json")).contains("reach grazing incidence"),
                example + ": no warning that the shift depends on the line's length");
        // The angular spectrum of a 2D Gaussian beam of waist w (J. W. Goodman, Introduction to Fourier Optics, 2nd ed.
        // (1996), sec. 3.10, from memory; the Gaussian's spectrum exp(−κ²w²/4) in the field is common practice): each
        // plane wave, at θ + asin(κ/k) with κ the wavenumber across the axis, carries power ∝ exp(−κ²w²/2)·kζ/k
        // (kζ = sqrt(k² − κ²), the part along the axis) and is reflected with Raether's three-layer R (StackLibraryTest,
        // Raether 1988 eq. 2.13), with the grid's gold ε from summary.json and the water's library index. The integral
        // by the trapezoid rule over |κ| ≤ 6/w (the weight there is e^{−18}); R_beam = Σ weight·R / Σ weight.
        String summary = Files.readString(outs.get(0).resolve("summary.json"));
        java.util.regex.Matcher re = java.util.regex.Pattern.compile("\"grid_epsilon_real\": ([-0-9.eE+]+),\\s*"
                + "\"grid_epsilon_imaginary\": ([-0-9.eE+]+)").matcher(summary);
        assertTrue(re.find(), "no grid_epsilon in " + summary);
        org.evanesce.geometry.Complex gold = new org.evanesce.geometry.Complex(Double.parseDouble(re.group(1)),
                Double.parseDouble(re.group(2)));
        double nWater = org.evanesce.io.casefile.model.LibraryMaterial.WATER.index(WAVELENGTH);
        org.evanesce.geometry.Complex water = org.evanesce.geometry.Complex.real(nWater * nWater);
        double nGlass = 1.515;
        double theta = Math.toRadians(74.8);
        double waist = 1e-6;
        double k = 2 * Math.PI * nGlass / WAVELENGTH;
        int samples = 4001;
        double sum = 0;
        double weights = 0;
        for (int i = 0; i < samples; i++) {
            double kappa = (-6 + 12.0 * i / (samples - 1)) / waist;
            double w = Math.exp(-kappa * kappa * waist * waist / 2) * Math.sqrt(k * k - kappa * kappa) / k
                    * (i == 0 || i == samples - 1 ? 0.5 : 1);
            sum += w * StackLibraryTest.raether(nGlass, gold, 50e-9, water, WAVELENGTH, theta + Math.asin(kappa / k));
            weights += w;
        }
        near(example, "R of the 1 um beam at the plasmon dip (74.8 deg, 633 nm)", sum / weights,
                ExampleOutputs.flux(outs.get(0), 633.0, "R_reflected"), PLASMON_BEAM_R_TOLERANCE);
    }

    // --- metal-film-attenuator-chromium: R and T of the film, s and p, against the Airy formula ---------------

    /**
     * Measured at 3 nm cells (the example's own, the 12 nm film 4 cells thick), at 630 nm (29.84 deg): T − Airy
     * = −2.8e-4 (s), −3.7e-4 (p); R − Airy = −4.1e-4 (s), −4.9e-4 (p). A film 2 nm thinner or thicker moves T_s by
     * 0.026 to 0.035 and R_s by about 0.04, an incidence at 45 instead of 30 degrees moves R_s and R_p by 0.06 to 0.07
     * (evanesce stack): all fail.
     */
    private static final double METAL_FILM_TOLERANCE = 5e-3;

    private static void metalFilm(String example, List<Path> outs) throws IOException {
        // the chromium's ε at 630 nm as the grid realises it (summary.json, grid_epsilon; the model's own differs in
        // the fourth digit), Ciddor's standard air (the built-in air) and the glass's 1.52; the pulse's in-plane
        // wavenumber is that of 30 degrees at 633 nm, so at 630 nm sin θ = sin 30° · 630/633
        String summary = Files.readString(outs.get(0).resolve("s").resolve("summary.json"));
        java.util.regex.Matcher re = java.util.regex.Pattern.compile("\"wavelength_m\": 6\\.3[eE]-0?7,\\s*\"epsilon_real\": "
                + "[-0-9.eE+]+,\\s*\"epsilon_imaginary\": [-0-9.eE+]+,\\s*\"grid_epsilon_real\": ([-0-9.eE+]+),\\s*"
                + "\"grid_epsilon_imaginary\": ([-0-9.eE+]+)").matcher(summary);
        assertTrue(re.find(), "no grid_epsilon at 630 nm in " + summary);
        org.evanesce.geometry.Complex chromium = new org.evanesce.geometry.Complex(Double.parseDouble(re.group(1)),
                Double.parseDouble(re.group(2)));
        double nAir = org.evanesce.io.casefile.model.LibraryMaterial.AIR.index(630e-9);
        double theta = Math.asin(Math.sin(Math.toRadians(30)) * 630 / 633);
        for (String pol : List.of("s", "p")) {
            AbsorbingFilmAiry.Result airy = AbsorbingFilmAiry.of(pol.equals("p"), nAir, chromium, 12e-9, 1.52, 630e-9,
                    theta);
            near(example, "T (" + pol + ") at 630 nm", airy.transmittance(),
                    ExampleOutputs.flux(outs.get(0), 630.0, "T_transmitted_" + pol), METAL_FILM_TOLERANCE);
            near(example, "R (" + pol + ") at 630 nm", airy.reflectance(),
                    ExampleOutputs.flux(outs.get(0), 630.0, "R_reflected_" + pol), METAL_FILM_TOLERANCE);
        }
    }
}

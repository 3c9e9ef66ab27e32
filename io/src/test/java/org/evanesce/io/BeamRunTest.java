package org.evanesce.io;

import static org.evanesce.geometry.PhysicalConstants.C0;
import static org.evanesce.geometry.PhysicalConstants.EPS0;
import static org.evanesce.geometry.PhysicalConstants.ETA0;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.function.DoubleUnaryOperator;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.evanesce.geometry.Complex;
import org.evanesce.io.cli.ExitCode;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * {@code evanesce run} with a Gaussian beam and flux lines, against results computed here independently
 * of the program: Artmann's lateral (Goos–Hänchen) shift of a totally reflected beam, the tunnelling
 * formula of frustrated total internal reflection averaged over the beam's angular spectrum, and the
 * characteristic matrix of an absorbing film; and the beam's bad-input checks.
 *
 * <p>Each run is a continuous (ramped) wave at 633 nm in glass (n = 1.5) on a grid 3 um high and 44 to
 * 100 um wide (0.2 to 0.44 million cells), followed by the program's incident-power run of the same size. The
 * beams are 10 or 20 vacuum wavelengths wide at the waist; the domains hold about ±2.7 footprints
 * (waist / cos angle) either side of the axis, where the beam's power has fallen below 1e-6 of its peak.
 */
class BeamRunTest {

    static final double WAVELENGTH = 633e-9;
    static final double N_GLASS = 1.5;
    /** The index of the vacuum above the glass or in the gap (a material {index: 1.0}, not the library's air). */
    static final double N_VACUUM = 1.0;

    /** Issue #5's bound on the simulated lateral shift against Artmann's closed form, relative. */
    static final double SHIFT_TOLERANCE = 0.05;
    /**
     * |R − 1| and |T| under total reflection (issue #5's bound on R): the continuous wave's switch-on stays
     * in the running Fourier transform and fades only as 1/(run time). For the 20-wavelength beam R − 1 is
     * 7.5e-4 at 150 fs, 3.7e-4 at 200 fs (the run here) and 2.0e-4 at 250 fs.
     */
    static final double TOTAL_REFLECTION_TOLERANCE = 1e-3;
    /** Issue #5's bound on the simulated T through the gap against the finite-beam tunnelling result. */
    static final double GAP_T_TOLERANCE = 0.005;
    /**
     * The program's T_transmitted_beam against the average written here: the same integral of the same
     * closed form (the tunnelling formula or the characteristic matrix), so they differ by quadrature and
     * the 9 decimals of flux.csv (measured: 4e-10). Four to ten times smaller than the beam's own effect
     * (X_beam − X_plane_wave: 4e-5 for the gap, 1.7e-5 for the film; both checked), so the comparison
     * would notice a plane-wave value passed off as the beam's.
     */
    static final double BEAM_AVERAGE_TOLERANCE = 4e-6;
    /**
     * R + T = 1 in a lossless scene with the beam far from the sides (issue #5 asked for 1 %). Measured:
     * R + T = 1.000005 (the gap case, 20 cells per wavelength); about 10 times that.
     */
    static final double ENERGY_TOLERANCE = 5e-5;
    /** Issue #5's bound on the simulated A = 1 − R − T against the angular-spectrum A_beam. */
    static final double ABSORPTANCE_TOLERANCE = 0.01;
    /**
     * A_beam of a wide beam against the plane-wave absorptance at the beam's angle: the beam's angular
     * spread changes A by 1.7e-5 here (measured: A_beam 0.432727, plane wave 0.432710); about 10 times
     * that (issue #5 asked for 5e-3).
     */
    static final double WIDE_BEAM_TOLERANCE = 2e-4;
    /**
     * The program's A_plane_wave against the characteristic matrix written here: the same exact result,
     * so round-off plus the 9 decimals of flux.csv.
     */
    static final double EXACT_TOLERANCE = 1e-8;
    /** A = 1 − R − T from three values each printed with 9 decimals. */
    static final double DERIVED_COLUMN_TOLERANCE = 2e-9;
    /**
     * Artmann's form against a central difference of the Fresnel phase with a step of 1e-6 rad, relative:
     * truncation about 1e-12, round-off about 1e-10.
     */
    static final double FINITE_DIFFERENCE_TOLERANCE = 1e-6;
    /** Two closed forms of the same quantity evaluated in double precision, or a sum of a few thousand terms. */
    static final double ROUND_OFF = 1e-12;

    @TempDir
    Path tmp;



    private static boolean printTables() {
        return Boolean.getBoolean("evanesce.printTables");
    }

    /**
     * The lateral-shift case of the case-file documentation (a glass–vacuum interface at y = 0.5 um, the
     * beam's waist on it), with placeholders: POL, CPW (cells per wavelength in glass), WIDTH (um), WAIST
     * (in vacuum wavelengths), WAIST_X, WAIST_Y, ANGLE (degrees), STOP (fs), MATERIALS, SHAPES, BOUNDARIES.
     */
    private static final String TEMPLATE = """
            title: Goos-Haenchen shift of a totally reflected beam
            parameters:
              w: WAIST * 633 nm
              cpw: CPW
              theta: ANGLE deg
            design_wavelength: 633 nm
            polarization: POL
            domain: {width: WIDTH um, height: 3 um, background: glass}
            grid: {cells_per_wavelength: cpw}
            materials:
              glass: {index: 1.5}
            MATERIALS
            shapes:
            SHAPES
            boundaries: BOUNDARIES
            sources:
              - gaussian_beam:
                  y: -0.5 um
                  waist: w
                  waist_at: [WAIST_X, WAIST_Y]
                  angle: theta
                  signal: {ramped_wave: {wavelength: 633 nm}}
            flux:
              lines:
                - {y: -0.8 um, measures: reflected}
                - {y: 0.9 um, measures: transmitted}
              transfer_matrix: true
            until: {time: STOP fs}
            """;

    private static final String VACUUM = "  vac: {index: 1.0}";
    private static final String PML = "{all: pml 0.5 um}";

    /** A case from the template; {@code waistAt} is "x, y" with units. */
    private static String beamCase(String pol, int cpw, double widthUm, int waistWavelengths, String waistAt,
            double angleDeg, int stopFs, String materials, String shapes, String boundaries) {
        String[] xy = waistAt.split(",");
        return TEMPLATE.replace("POL", pol).replace("CPW", Integer.toString(cpw))
                .replace("WIDTH", Double.toString(widthUm)).replace("WAIST_X", xy[0].trim())
                .replace("WAIST_Y", xy[1].trim()).replace("WAIST", Integer.toString(waistWavelengths))
                .replace("ANGLE", Double.toString(angleDeg)).replace("STOP", Integer.toString(stopFs))
                .replace("MATERIALS", materials).replace("SHAPES", shapes).replace("BOUNDARIES", boundaries);
    }

    private Path write(String name, String text) throws IOException {
        Path f = tmp.resolve(name);
        Files.writeString(f, text);
        return f;
    }

    /** flux.csv of a continuous wave: its header and its one row (an empty cell is NaN). */
    private record FluxRow(List<String> header, double[] values) {
        static FluxRow read(Path f) throws IOException {
            List<String> lines = Files.readAllLines(f).stream().filter(l -> !l.isBlank()).toList();
            assertEquals(2, lines.size(), () -> "a continuous wave gives one row in " + f + ": " + lines);
            String[] cells = lines.get(1).split(",", -1);
            double[] values = new double[cells.length];
            for (int k = 0; k < cells.length; k++) {
                values[k] = cells[k].isEmpty() ? Double.NaN : Double.parseDouble(cells[k]);
            }
            return new FluxRow(List.of(lines.get(0).split(",")), values);
        }

        double get(String column) {
            int c = header.indexOf(column);
            assertTrue(c >= 0, () -> "flux.csv has no column " + column + ": " + header);
            return values[c];
        }
    }

    /** Runs a case that must succeed and returns its flux.csv. */
    private FluxRow runFlux(String name, String text) throws IOException {
        Path out = tmp.resolve(name + "-out");
        Cli.Outcome o = Cli.run("run", write(name + ".yaml", text).toString(), "--out", out.toString());
        assertEquals(ExitCode.OK, o.code(), () -> name + ": " + o);
        return FluxRow.read(out.resolve("flux.csv"));
    }

    // ---- closed forms and independent computations ----

    /**
     * Artmann's lateral shift along the interface of a totally reflected beam, s polarization:
     * D_s = λ0 tan θ / (π sqrt(n1² sin²θ − n2²)) (K. Artmann, "Berechnung der Seitenversetzung des
     * totalreflektierten Strahles", Ann. Physik 2, 87 (1948); the form as reviewed by R. H. Renard,
     * "Total reflection: a new evaluation of the Goos–Hänchen shift", J. Opt. Soc. Am. 54, 1190 (1964)).
     * Metres; θ in radians, in medium n1.
     */
    static double artmannS(double n1, double n2, double theta, double wavelength) {
        double s = Math.sin(theta);
        return wavelength * Math.tan(theta) / (Math.PI * Math.sqrt(n1 * n1 * s * s - n2 * n2));
    }

    /** Artmann's shift for p: D_p = D_s m² / ((1 + m²) sin²θ − m²), m = n2/n1 (same sources). Metres. */
    static double artmannP(double n1, double n2, double theta, double wavelength) {
        double m2 = (n2 / n1) * (n2 / n1);
        double s2 = Math.sin(theta) * Math.sin(theta);
        return artmannS(n1, n2, theta, wavelength) * m2 / ((1 + m2) * s2 - m2);
    }

    /**
     * Transmittance of a plane wave through a lossless gap of index n2 and thickness d between two media
     * of index n1, s polarization. Beyond the critical angle 1/T = 1 + α sinh²(κd), α = ((k² + κ²)/(2kκ))²,
     * k = n1 k0 cos θ, κ = k0 sqrt(n1² sin²θ − n2²) (S. Zhu, A. W. Yu, D. Hawley, R. Roy, "Frustrated total
     * internal reflection: a demonstration and review", Am. J. Phys. 54, 601 (1986)); below it the same
     * barrier with κ = i q, q = k0 sqrt(n2² − n1² sin²θ): 1/T = 1 + ((k² − q²)/(2kq))² sin²(qd).
     */
    static double tunnellingS(double n1, double n2, double d, double theta, double wavelength) {
        double k0 = 2 * Math.PI / wavelength;
        double k = n1 * k0 * Math.cos(theta);
        double beyond = n1 * n1 * Math.sin(theta) * Math.sin(theta) - n2 * n2;
        if (beyond > 0) {
            double kappa = k0 * Math.sqrt(beyond);
            double alpha = Math.pow((k * k + kappa * kappa) / (2 * k * kappa), 2);
            double s = Math.sinh(kappa * d);
            return 1 / (1 + alpha * s * s);
        }
        double q = k0 * Math.sqrt(-beyond);
        double alpha = Math.pow((k * k - q * q) / (2 * k * q), 2);
        double s = Math.sin(q * d);
        return 1 / (1 + alpha * s * s);
    }

    /**
     * The power-weighted average of a plane-wave quantity f(angle) over a 2D Gaussian beam of waist w0
     * (field exp(−t²/w0²) across its axis at the waist) whose axis makes angle θ with the normal, in
     * medium n. Its plane-wave components have transverse wavenumber k_t = n k0 sin ψ and angle θ + ψ;
     * each carries power exp(−k_t² w0²/2) cos ψ dk_t (the Gaussian's spectrum squared, times the
     * component's flux along the axis). Simpson's rule over ±10/w0 in k_t (the weight there is e^−50).
     */
    static double beamAverage(DoubleUnaryOperator f, double n, double theta, double w0, double wavelength) {
        double k = n * 2 * Math.PI / wavelength;
        double kMax = Math.min(10 / w0, k);
        int intervals = 4000;
        double h = 2 * kMax / intervals;
        double num = 0;
        double den = 0;
        for (int j = 0; j <= intervals; j++) {
            double kt = -kMax + j * h;
            double psi = Math.asin(kt / k);
            double weight = Math.exp(-kt * kt * w0 * w0 / 2) * Math.cos(psi) * (j == 0 || j == intervals ? 1 : (j % 2 == 1 ? 4 : 2));
            num += weight * f.applyAsDouble(theta + psi);
            den += weight;
        }
        return num / den;
    }

    /** A complex number for the characteristic matrix. */
    private record Complex(double re, double im) {
        Complex plus(Complex o) {
            return new Complex(re + o.re, im + o.im);
        }

        Complex minus(Complex o) {
            return new Complex(re - o.re, im - o.im);
        }

        Complex times(Complex o) {
            return new Complex(re * o.re - im * o.im, re * o.im + im * o.re);
        }

        Complex over(Complex o) {
            double m = o.re * o.re + o.im * o.im;
            return new Complex((re * o.re + im * o.im) / m, (im * o.re - re * o.im) / m);
        }

        Complex sqrt() {
            double r = Math.hypot(re, im);
            double a = Math.sqrt((r + re) / 2);
            double b = Math.copySign(Math.sqrt((r - re) / 2), im);
            return new Complex(a, b);
        }

        Complex cos() {
            return new Complex(Math.cos(re) * Math.cosh(im), -Math.sin(re) * Math.sinh(im));
        }

        Complex sin() {
            return new Complex(Math.sin(re) * Math.cosh(im), Math.cos(re) * Math.sinh(im));
        }

        double abs2() {
            return re * re + im * im;
        }
    }

    /** [R, T, A] of a plane wave, s polarization. */
    private record Rta(double r, double t, double a) {
    }

    /**
     * One film of complex permittivity ε between two half-spaces of index n1, s polarization, by the
     * characteristic matrix (M. Born, E. Wolf, Principles of Optics, sec. 1.6.2–1.6.4): with
     * p_j = sqrt(ε_j − n1² sin²θ) and β = k0 d p_film, M = [[cos β, −i sin β / p], [−i p sin β, cos β]],
     * r = ((m11 + m12 p1) p1 − (m21 + m22 p1)) / ((m11 + m12 p1) p1 + (m21 + m22 p1)), t = 2 p1 / (same),
     * R = |r|², T = |t|² (the same medium on both sides), A = 1 − R − T. Time dependence e^{−iωt}, so a
     * conductor has ε = ε' + iσ/(ωε0). The matrix depends on p_film only through cos β, sin β / p and
     * p sin β, so the branch of the square root does not matter.
     */
    static Rta film(double n1, Complex epsilon, double d, double theta, double wavelength) {
        double k0 = 2 * Math.PI / wavelength;
        double kx2 = n1 * n1 * Math.sin(theta) * Math.sin(theta);
        Complex p1 = new Complex(n1 * n1 - kx2, 0).sqrt();
        Complex p = epsilon.minus(new Complex(kx2, 0)).sqrt();
        Complex beta = p.times(new Complex(k0 * d, 0));
        Complex minusI = new Complex(0, -1);
        Complex m11 = beta.cos();
        Complex m12 = minusI.times(beta.sin()).over(p);
        Complex m21 = minusI.times(p).times(beta.sin());
        Complex m22 = m11;
        Complex left = m11.plus(m12.times(p1)).times(p1);
        Complex right = m21.plus(m22.times(p1));
        Complex r = left.minus(right).over(left.plus(right));
        Complex t = new Complex(2, 0).times(p1).over(left.plus(right));
        double rr = r.abs2();
        double tt = t.abs2();
        return new Rta(rr, tt, 1 - rr - tt);
    }

    /** ε of a conductor-loaded dielectric at vacuum wavelength λ: ε' + iσ/(ω ε0). */
    static Complex conductorPermittivity(double epsilonReal, double sigma, double wavelength) {
        double omega = 2 * Math.PI * C0 / wavelength;
        return new Complex(epsilonReal, sigma / (omega * EPS0));
    }

    @Test
    void closedFormsAgreeWithEachOtherAndWithFresnel() {
        double theta = Math.toRadians(45);
        // Artmann's shift is −d(phase of r)/dkx of the Fresnel coefficients beyond the critical angle:
        // r_s = (k − iκ)/(k + iκ), r_p = (k/n1² − iκ/n2²)/(k/n1² + iκ/n2²); central differences in θ
        double k0 = 2 * Math.PI / WAVELENGTH;
        double dTheta = 1e-6;
        for (String pol : new String[] {"s", "p"}) {
            DoubleUnaryOperator phase = a -> {
                double k = N_GLASS * k0 * Math.cos(a);
                double kappa = k0 * Math.sqrt(N_GLASS * N_GLASS * Math.sin(a) * Math.sin(a) - N_VACUUM * N_VACUUM);
                double ratio = pol.equals("s") ? kappa / k : (kappa / (N_VACUUM * N_VACUUM)) / (k / (N_GLASS * N_GLASS));
                return -2 * Math.atan(ratio);
            };
            double dkx = N_GLASS * k0 * (Math.sin(theta + dTheta) - Math.sin(theta - dTheta));
            double fromPhase = -(phase.applyAsDouble(theta + dTheta) - phase.applyAsDouble(theta - dTheta)) / dkx;
            double artmann = pol.equals("s") ? artmannS(N_GLASS, N_VACUUM, theta, WAVELENGTH)
                    : artmannP(N_GLASS, N_VACUUM, theta, WAVELENGTH);
            assertEquals(fromPhase, artmann, FINITE_DIFFERENCE_TOLERANCE * artmann, () -> pol + ": Artmann's form against the Fresnel phase");
        }
        // the characteristic matrix of a lossless gap is the tunnelling formula (beyond and below critical)
        for (double deg : new double[] {30, 45, 60}) {
            double a = Math.toRadians(deg);
            double matrix = film(N_GLASS, new Complex(N_VACUUM * N_VACUUM, 0), 200e-9, a, WAVELENGTH).t();
            assertEquals(tunnellingS(N_GLASS, N_VACUUM, 200e-9, a, WAVELENGTH), matrix, ROUND_OFF, () -> deg + " deg: gap T");
        }
        // a film matching the glass with no loss does nothing; with loss it absorbs
        Rta matched = film(N_GLASS, new Complex(N_GLASS * N_GLASS, 0), 200e-9, Math.toRadians(30), WAVELENGTH);
        assertEquals(0, matched.r(), ROUND_OFF);
        assertEquals(1, matched.t(), ROUND_OFF);
        assertTrue(film(N_GLASS, conductorPermittivity(2.25, 1e4, WAVELENGTH), 200e-9, Math.toRadians(30), WAVELENGTH).a() > 0.1);
        // the beam average of a constant is the constant, of a linear function its value on the axis
        assertEquals(0.7, beamAverage(a -> 0.7, N_GLASS, theta, 10 * WAVELENGTH, WAVELENGTH), ROUND_OFF);
        assertEquals(theta, beamAverage(a -> a, N_GLASS, theta, 10 * WAVELENGTH, WAVELENGTH), ROUND_OFF);
    }

    // ---- 1. lateral shift under total reflection ----

    /**
     * The lateral-shift case at 50°: a beam 20 vacuum wavelengths wide onto glass | vacuum (interface at
     * y = 0.5 um, the waist on it), 16 cells per wavelength in the glass (26.4 nm), 120 um × 4 um (0.69
     * million cells), 250 fs, with two reflected lines 1.3 um and 1.9 um from the interface.
     */
    static final String SHIFT_CASE = """
            title: Goos-Haenchen shift at 50 degrees
            design_wavelength: 633 nm
            polarization: POL
            domain: {width: 120 um, height: 4 um, background: glass}
            grid: {cells_per_wavelength: 16}
            materials:
              glass: {index: 1.5}
              vac: {index: 1.0}
            shapes:
              - half_plane: {through: [0, 0.5 um], fill: above, material: vac}
            boundaries: {all: pml 0.5 um}
            sources:
              - gaussian_beam:
                  y: -0.5 um
                  waist: 20 * 633 nm
                  waist_at: [1.2 um, 0.5 um]
                  angle: 50 deg
                  signal: {ramped_wave: {wavelength: 633 nm}}
            flux:
              lines:
                - {y: -0.8 um, measures: reflected, name: near}
                - {y: -1.4 um, measures: reflected, name: far}
                - {y: 0.9 um, measures: transmitted}
              transfer_matrix: true
            until: {time: 250 fs}
            """;

    /**
     * The two lines' shifts against each other, relative to Artmann's, after taking out the physical change
     * between them (the angular spectrum's shift_*_beam_um, +0.012 %). Measured: 0.013 % (s), 0.11 % (p).
     * Measured from the nominal specular position instead, the lines differ by 0.76 %: 0.6 um of vertical
     * travel times the 0.0054 by which the grid lowers tan 50°.
     */
    static final double LINE_TOLERANCE = 0.002;
    /**
     * The simulated shift against Artmann's at 16 cells per wavelength, relative. Measured: s −0.60 %, −0.61 %;
     * p −0.99 %, −1.11 % (near, far line); the angular spectrum of the same beam is +0.06 % (s), +0.11 % (p) from
     * Artmann. What remains is the grid's own error at the interface, second order in the cell size (at 24 cells
     * per wavelength s −0.41 %, −0.46 %, p −0.48 %, −0.62 %): the grid's evanescent decay rate, exact on the beam's
     * axis under the dispersion correction, changes with kx more slowly than the exact one (by
     * sin(kxΔ)/sinh(κΔ) against kx/κ), and Artmann's shift is that derivative. About 0.1 % more comes and goes
     * with the continuous wave's settling (s −0.71 % at 400 fs).
     */
    static final double SHIFT_TOLERANCE_50 = 0.015;
    /**
     * The correction the measured path makes (nominal-baseline shift − path-baseline shift) against the grid's
     * group direction on the axis, tan θ_g = sin(kxΔ)/sin(kyΔ) (differentiating the 2D Yee dispersion relation,
     * Taflove &amp; Hagness ch. 4, from memory, at fixed ω; ky exact under the dispersion correction), over the
     * reflected beam's vertical travel from the interface (the grid beam passes through its waist, on the
     * interface). Measured: 6 % (the beam's components about the axis turn by different amounts).
     */
    static final double PATH_TOLERANCE = 0.15;
    /**
     * The incident power of the continuous beam against E0² w √(π/2) / (2η) (s; E0 = 1 the field at the waist
     * centre, η = η0/n) and (η/2)(E0/η0)² w √(π/2) (p, E0 = η0 Hz): the flux of the Gaussian exp(−ξ²/w²) through
     * its waist plane (non-paraxial terms of order 1/(k w)² ≈ 1e-5). Measured −0.99 % (s), −0.47 % (p), second
     * order in the cell size (the flux line averages E over two rows: cos(kyΔ/2) ≈ 1 − 0.8 %).
     */
    static final double BEAM_POWER_TOLERANCE = 0.03;

    /**
     * Issue #13: the lateral shift measured from where the incident beam itself goes on the grid. At 50° the
     * grid turns the beam by about 0.13° (at 45° not at all), which the nominal specular position counts as
     * shift; the incident-power run's measured path takes it out, so both lines agree and the shift is the
     * interface's.
     */
    @ParameterizedTest(name = "{0} polarization")
    @ValueSource(strings = {"s", "p"})
    void lateralShiftUnderTotalReflectionIsArtmanns(String pol) throws IOException {
        double theta = Math.toRadians(50);
        Path out = tmp.resolve("shift-" + pol + "-out");
        Cli.Outcome o = Cli.run("run", write("shift-" + pol + ".yaml", SHIFT_CASE.replace("POL", pol)).toString(), "--out",
                out.toString());
        assertEquals(ExitCode.OK, o.code(), () -> pol + ": " + o);
        FluxRow f = FluxRow.read(out.resolve("flux.csv"));
        String summary = Files.readString(out.resolve("summary.json"));
        String what = pol + " polarization, glass (1.5) | vacuum at 50 deg, waist 20 wavelengths, 16 cells per wavelength";
        double artmann = pol.equals("s") ? artmannS(N_GLASS, N_VACUUM, theta, WAVELENGTH) : artmannP(N_GLASS, N_VACUUM, theta, WAVELENGTH);
        double cell = number(summary, "cell_size_m");
        double interfaceY = 0.5e-6;
        double xWaist = 1.2e-6;
        // the grid's group direction on the axis (ky exact under the dispersion correction)
        double k = N_GLASS * 2 * Math.PI / WAVELENGTH;
        double tanGrid = Math.sin(k * Math.sin(theta) * cell) / Math.sin(k * Math.cos(theta) * cell);
        double[] relative = new double[2];
        String[] names = {"near", "far"};
        for (int j = 0; j < 2; j++) {
            String n = names[j];
            double shift = f.get("shift_" + n + "_um") * 1e-6;
            double beamShift = f.get("shift_" + n + "_beam_um") * 1e-6;
            double y = lineY(summary, n);
            double nominal = f.get("centroid_" + n + "_um") * 1e-6 - (xWaist + Math.abs(interfaceY - y) * Math.tan(theta));
            double predicted = Math.abs(interfaceY - y) * (Math.tan(theta) - tanGrid);
            String line = String.format("%s, line %s at y = %.4f um: shift %.6f um (%+.3f %% from Artmann %.6f um), from the "
                    + "nominal specular position %.6f um; correction %.3f nm, grid direction predicts %.3f nm; angular "
                    + "spectrum %.6f um", what, n, y * 1e6, shift * 1e6, 100 * (shift / artmann - 1), artmann * 1e6,
                    nominal * 1e6, (shift - nominal) * 1e9, predicted * 1e9, beamShift * 1e6);
            if (printTables()) {
                System.out.println(line);
            }
            assertEquals(artmann, shift, SHIFT_TOLERANCE_50 * artmann, line);
            assertEquals(predicted, shift - nominal, PATH_TOLERANCE * predicted, line);
            relative[j] = (shift - beamShift) / artmann;
        }
        double spread = relative[1] - relative[0];
        assertEquals(0, spread, LINE_TOLERANCE, () -> String.format("%s: the two lines' shifts, less the angular spectrum's, "
                + "differ by %+.4f %% of Artmann's", what, 100 * spread));
        double r = f.get("R_near");
        assertEquals(1.0, r, TOTAL_REFLECTION_TOLERANCE, () -> what + ": R = " + r + " under total reflection");
        double eta = ETA0 / N_GLASS;
        double w = 20 * WAVELENGTH;
        double beamPower = pol.equals("s") ? w * Math.sqrt(Math.PI / 2) / (2 * eta)
                : eta / 2 * Math.pow(1 / ETA0, 2) * w * Math.sqrt(Math.PI / 2);
        double power = f.get("incident_power_w_per_m");
        assertEquals(beamPower, power, BEAM_POWER_TOLERANCE * beamPower, () -> String.format(
                "%s: incident power %g W/m, the Gaussian beam's %g W/m (%+.2f %%)", what, power, beamPower,
                100 * (power / beamPower - 1)));
    }

    /** The first number after "key": in a JSON text. */
    static double number(String json, String key) {
        Matcher m = Pattern.compile("\"" + Pattern.quote(key) + "\": ([-0-9.eE+]+)").matcher(json);
        assertTrue(m.find(), () -> "no " + key + " in " + json);
        return Double.parseDouble(m.group(1));
    }

    /** The height summary.json gives for the flux line named {@code name}, m. */
    static double lineY(String json, String name) {
        Matcher m = Pattern.compile("\"name\": \"" + Pattern.quote(name) + "\",[^}]*?\"y_m\": ([-0-9.eE+]+)").matcher(json);
        assertTrue(m.find(), () -> "no line " + name + " in " + json);
        return Double.parseDouble(m.group(1));
    }

    // ---- 2. frustrated total reflection of a finite beam ----

    /**
     * Glass | 200 nm of vacuum | glass (9.48 cells of 21.1 nm, faces mid-cell), s, 45°, a beam 10 vacuum
     * wavelengths wide with its waist in the gap, 20 cells per wavelength in the glass, 50 um × 3 um (0.34
     * million cells), 100 fs (T changes by 3e-6 from 100 to 250 fs). Measured: T − average = +0.0020 (at
     * 16 cells per wavelength +0.0045; a 150 nm gap gives +0.0053 at 16 and +0.0035 at 20, the grid's
     * second-order error).
     */
    @Test
    void beamThroughAGapTunnelsAsItsAngularSpectrumAverage() throws IOException {
        double gap = 200e-9;
        double theta = Math.toRadians(45);
        double w0 = 10 * WAVELENGTH;
        String text = beamCase("s", 20, 50, 10, "0, 0", 45, 100, VACUUM,
                "  - layer_stack:\n      start: [0, -100 nm]\n      layers: [{material: vac, thickness: 200 nm}]", PML);
        FluxRow f = runFlux("gap", text);
        String what = "s polarization, glass | 200 nm vacuum | glass at 45 deg, waist 10 wavelengths, 20 cells per wavelength";
        double average = beamAverage(a -> tunnellingS(N_GLASS, N_VACUUM, gap, a, WAVELENGTH), N_GLASS, theta, w0, WAVELENGTH);
        double planeWave = tunnellingS(N_GLASS, N_VACUUM, gap, theta, WAVELENGTH);
        double t = f.get("T_transmitted");
        double r = f.get("R_reflected");
        double column = f.get("T_transmitted_beam");
        if (printTables()) {
            System.out.printf("%s: T simulated %.6f, beam average %.6f (diff %+.6f), program's T_beam %.9f (diff %+.2e), "
                    + "plane wave %.9f; R + T = %.6f%n", what, t, average, t - average, column, column - average, planeWave, r + t);
        }
        // the average is a finite-beam result, measurably apart from the plane wave at the beam's angle
        assertTrue(Math.abs(average - planeWave) > 5 * BEAM_AVERAGE_TOLERANCE, () -> String.format(
                "the beam average %g should differ from the plane wave %g by more than the column's tolerance", average, planeWave));
        assertEquals(average, column, BEAM_AVERAGE_TOLERANCE, () -> String.format(
                "%s: T_transmitted_beam %s, angular-spectrum average of the tunnelling formula %s", what, column, average));
        assertEquals(average, t, GAP_T_TOLERANCE, () -> String.format(
                "%s: T simulated %s, finite-beam average %s (diff %+g)", what, t, average, t - average));
        assertEquals(1.0, r + t, ENERGY_TOLERANCE, () -> what + ": R + T = " + (r + t) + " in a lossless scene");
        assertEquals(1 - r - t, f.get("A"), DERIVED_COLUMN_TOLERANCE, () -> what + ": the A column is not 1 − R − T");
        // the beam plots (their curves: BeamSeriesTest) are written and are pictures
        for (String plot : List.of("beam-incident.png", "beam-reflected.png", "beam-transmitted.png")) {
            Path png = tmp.resolve("gap-out").resolve(plot);
            assertTrue(Files.isRegularFile(png), () -> what + ": " + plot + " was not written");
            assertTrue(javax.imageio.ImageIO.read(png.toFile()) != null, () -> what + ": " + plot + " is not a readable PNG");
        }
    }

    // ---- 3. energy with absorption ----

    /**
     * Glass | 200 nm of {permittivity 2.25, conductivity 1e4 S/m} (ε'' = 0.38 at 633 nm) | glass, s, 30°,
     * a beam 10 wavelengths wide, 16 cells per wavelength (the film 7.6 cells, faces mid-cell), 44 um × 3
     * um (0.19 million cells), 100 fs. Measured: A − A_beam = +0.0042 (+0.0027 at 20 cells per
     * wavelength). The example film, 50 nm at 2e5 S/m (ε'' = 7.6, under 4 cells), misses 0.01 on
     * affordable grids: +0.041, +0.016, +0.018, +0.010 at 16, 20, 24, 32 cells per wavelength, and a
     * plane wave on the same grids gives the same numbers, so that is the grid's error in a strongly
     * absorbing film of two or three cells, not the beam's.
     */
    @Test
    void absorbedPowerIsTheFilmsAbsorptance() throws IOException {
        double thickness = 200e-9;
        double sigma = 1e4;
        double theta = Math.toRadians(30);
        double w0 = 10 * WAVELENGTH;
        String text = beamCase("s", 16, 44, 10, "0, 0", 30, 100, "  lossy: {permittivity: 2.25, conductivity: 1e4 S/m}",
                "  - layer_stack:\n      start: [0, -100 nm]\n      layers: [{material: lossy, thickness: 200 nm}]", PML);
        FluxRow f = runFlux("absorbing", text);
        String what = "s polarization, glass | 200 nm lossy film (2.25, 1e4 S/m) | glass at 30 deg, waist 10 wavelengths, "
                + "16 cells per wavelength";
        Complex epsilon = conductorPermittivity(2.25, sigma, WAVELENGTH);
        Rta planeWave = film(N_GLASS, epsilon, thickness, theta, WAVELENGTH);
        double wideBeam = beamAverage(a -> film(N_GLASS, epsilon, thickness, a, WAVELENGTH).a(), N_GLASS, theta, w0, WAVELENGTH);
        double r = f.get("R_reflected");
        double t = f.get("T_transmitted");
        double a = 1 - r - t;
        double aBeam = f.get("A_beam");
        if (printTables()) {
            System.out.printf("%s: R %.6f, T %.6f, A = 1 - R - T %.6f; A_beam %.6f (diff %+.6f); plane-wave A here %.9f, "
                    + "program's %.9f; beam average here %.9f%n", what, r, t, a, aBeam, a - aBeam, planeWave.a(),
                    f.get("A_plane_wave"), wideBeam);
        }
        assertEquals(a, f.get("A"), DERIVED_COLUMN_TOLERANCE, () -> what + ": the A column is not 1 − R − T");
        assertEquals(aBeam, a, ABSORPTANCE_TOLERANCE, () -> String.format(
                "%s: simulated A = 1 − R − T = %s, angular spectrum A_beam %s (diff %+g)", what, a, aBeam, a - aBeam));
        assertTrue(Math.abs(wideBeam - planeWave.a()) > 3 * BEAM_AVERAGE_TOLERANCE, () -> String.format(
                "the beam average %g should differ from the plane wave %g by more than the column's tolerance", wideBeam,
                planeWave.a()));
        assertEquals(wideBeam, aBeam, BEAM_AVERAGE_TOLERANCE, () -> String.format(
                "%s: A_beam %s against the angular-spectrum average of the characteristic matrix %s", what, aBeam, wideBeam));
        assertEquals(planeWave.a(), aBeam, WIDE_BEAM_TOLERANCE, () -> String.format(
                "%s: A_beam %s against the plane-wave absorptance %s of the characteristic matrix", what, aBeam, planeWave.a()));
        assertEquals(planeWave.a(), f.get("A_plane_wave"), EXACT_TOLERANCE, () -> what + ": A_plane_wave against the characteristic matrix");
        assertEquals(planeWave.t(), f.get("T_transmitted_plane_wave"), EXACT_TOLERANCE, () -> what + ": T_transmitted_plane_wave");
    }

    // ---- 4. bad input ----

    /**
     * A small case that checks in a second: a beam 1 um wide, straight up, on a 20 um × 3 um grid; its
     * launching line is used over ±4 um. Placeholders: SHAPES, BOUNDARIES, WAIST_LINE.
     */
    private static final String SMALL = """
            title: beam checks
            design_wavelength: 633 nm
            polarization: s
            domain: {width: 20 um, height: 3 um, background: glass}
            grid: {cells_per_wavelength: 16}
            materials:
              glass: {index: 1.5}
              vac: {index: 1.0}
            shapes:
            SHAPES
            boundaries: BOUNDARIES
            sources:
              - gaussian_beam:
                  y: -0.5 um
            WAIST_LINE
                  waist_at: [0, 0.5 um]
                  signal: {ramped_wave: {wavelength: 633 nm}}
            until: {time: 20 fs}
            """;
    private static final String WAIST_LINE = "      waist: 1 um";
    private static final String INTERFACE = "  - half_plane: {through: [0, 0.5 um], fill: above, material: vac}";

    private static String small(String shapes, String boundaries, String waistLine) {
        return SMALL.replace("SHAPES", shapes).replace("BOUNDARIES", boundaries).replace("WAIST_LINE", waistLine);
    }

    /** 1-based number of the first line of {@code text} containing {@code needle}. */
    private static int lineOf(String text, String needle) {
        List<String> lines = text.lines().toList();
        for (int k = 0; k < lines.size(); k++) {
            if (lines.get(k).contains(needle)) {
                return k + 1;
            }
        }
        throw new AssertionError("no line with " + needle);
    }

    /** An error message at exactly {@code path}, with its line. */
    private record Message(int line, String text) {
    }

    /** The error messages (not warnings or notes) at exactly {@code path}. */
    private static List<Message> errorsAt(Cli.Outcome o, Path file, String path) {
        List<Message> found = new ArrayList<>();
        Matcher m = Pattern.compile("(?m)^" + Pattern.quote(file.toString()) + ":(\\d+):\\d+: (?:error: )?"
                + Pattern.quote(path) + ": (.*)$").matcher(o.err());
        while (m.find()) {
            found.add(new Message(Integer.parseInt(m.group(1)), m.group(2)));
        }
        return found;
    }

    /** Runs a case that must be refused with exactly one error at {@code path}, and returns it. */
    private Message refusedAt(String name, String text, String path) throws IOException {
        Path file = write(name + ".yaml", text);
        Path out = tmp.resolve(name + "-out");
        Cli.Outcome o = Cli.run("run", file.toString(), "--out", out.toString());
        assertEquals(ExitCode.USAGE, o.code(), () -> name + ": " + o);
        List<Message> found = errorsAt(o, file, path);
        assertEquals(1, found.size(), () -> name + ": expected one error at " + path + ": " + o);
        assertFalse(Files.exists(out), () -> name + ": a refused case wrote its folder");
        return found.get(0);
    }

    @Test
    void beamWithPeriodicSidesIsRefused() throws IOException {
        String text = small(INTERFACE, "{all: pml 0.5 um, left: periodic, right: periodic}", WAIST_LINE);
        Message m = refusedAt("periodic", text, "sources[0].gaussian_beam");
        assertTrue(m.text().contains("periodic"), () -> "the message should say the sides may not be periodic: " + m);
        assertEquals(lineOf(text, "gaussian_beam:"), m.line(), () -> "wrong line: " + m);
    }

    @Test
    void launchingLineAcrossTwoMaterialsIsRefused() throws IOException {
        // a vacuum block on the launching line 2 um from the axis, inside the ±4 um the beam uses
        String block = "  - rectangle: {centre: [3 um, -0.5 um], size: [0.5 um, 0.4 um], material: vac}";
        String text = small(block, PML, WAIST_LINE);
        Message m = refusedAt("two-materials", text, "sources[0].gaussian_beam.y");
        assertTrue(m.text().contains("glass") && m.text().contains("vac"), () -> "the message should name both materials: " + m);
        assertTrue(m.text().contains("one material"), () -> "the message should say the line must lie in one material: " + m);
        assertEquals(lineOf(text, "y: -0.5 um"), m.line(), () -> "wrong line: " + m);

        // the same block 7 um from the axis, beyond the part of the line the beam uses, is accepted
        String outside = small(block.replace("[3 um", "[7 um"), PML, WAIST_LINE);
        Cli.Outcome ok = Cli.run("check", write("outside.yaml", outside).toString());
        assertEquals(ExitCode.OK, ok.code(), () -> "a block beyond 4 footprints of the axis should not matter: " + ok);
    }

    @Test
    void beamWithoutAWaistIsRefused() throws IOException {
        String text = small(INTERFACE, PML, "");
        Message m = refusedAt("no-waist", text, "sources[0].gaussian_beam.waist");
        assertTrue(m.text().contains("missing"), () -> "the message should say the waist is missing: " + m);
        assertEquals(lineOf(text, "gaussian_beam:"), m.line(), () -> "a missing key is reported at its mapping: " + m);
    }
}

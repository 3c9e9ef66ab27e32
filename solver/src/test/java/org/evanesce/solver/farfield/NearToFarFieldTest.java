package org.evanesce.solver.farfield;

import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.Complex;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.solver.farfield.ContourPoints.Rule;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.reference.Bessel;
import org.evanesce.solver.reference.CylinderSeries;
import org.evanesce.solver.reference.Phasors;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * The near-to-far-field transformation (Taflove &amp; Hagness, <i>Computational Electrodynamics</i>, 3rd ed., ch. 8)
 * and the contour flux, without any FDTD: fed with exact fields (line sources, whose far field is the
 * large-argument form of the 2D Green's function, A&amp;S 9.2.3; the cylinder series of Bohren &amp; Huffman sec.
 * 8.4, itself tested in CylinderSeriesTest) sampled on rectangles, they must reproduce the exact far amplitude,
 * scattering width, total scattering and extinction, converging as the square of the spacing.
 */
class NearToFarFieldTest {

    private static final double LAMBDA = 1e-6;
    private static final double NB = 1.33;
    private static final double K = NB * 2 * Math.PI / LAMBDA;
    private static final double LB = LAMBDA / NB;
    private static final double INCIDENCE = 0.5;
    /** The cylinder's centre, away from the coordinates' origin so that the far-field phases are tested too. */
    private static final double CX = 0.3e-6;
    private static final double CY = -0.2e-6;

    /**
     * Far amplitude at 40 points per wavelength, relative to its peak: the midpoint and trapezoid rules err by
     * O(h²); measured at most 5.4e-4 (p, conductor, both trapezoid); 10 ppw: 8.8e-3.
     */
    private static final double AMPLITUDE_40 = 2e-3;
    /** Order of convergence from 20 to 40 points per wavelength: measured 2.003 to 2.008 in every case. */
    private static final double ORDER_MIN = 1.9;
    private static final double ORDER_MAX = 2.1;
    /**
     * C_sca and C_ext relative errors at 40 ppw: measured at most 3.0e-4 (staggered rules, conductor, s); C_abs
     * (= C_ext − C_sca) within 1.3e-4 of C_ext; the contour flux of the scattered and total fields 7.0e-5.
     */
    private static final double TOTALS_40 = 3e-3;
    /**
     * σ in dB wherever it is within 20 dB of its peak, at 20 ppw: the bar of 0.5 dB for the whole FDTD chain;
     * the transformation alone measured at most 0.083 dB (0.33 dB at 10 ppw, 0.021 dB at 40).
     */
    private static final double DB_20 = 0.5;
    /**
     * Line sources at 40 ppw, midpoint rule: far amplitude measured 2.3e-4 of its peak, radiated power 4.4e-5,
     * contour flux 2.2e-5 relative (9.4e-4, 1.8e-4, 8.6e-5 at 20 ppw).
     */
    private static final double LINE_SOURCE_40 = 2e-3;

    private static CylinderSeries cylinder(Polarization pol, boolean conductor) {
        CylinderSeries cyl = conductor ? CylinderSeries.conductor(pol, 2 / K, NB, LAMBDA)
                                       : CylinderSeries.dielectric(pol, 3 / K, Complex.of(1.5, 0.05), NB, LAMBDA);
        return cyl.incidentAlong(INCIDENCE);
    }

    /** The incident wave has unit amplitude and zero phase at the coordinates' origin; at the centre it is this. */
    private static Complex incidentAtCentre() {
        return Complex.polar(1, K * (CX * Math.cos(INCIDENCE) + CY * Math.sin(INCIDENCE)));
    }

    /** A rectangle round the cylinder, 2 × 2 background wavelengths, off-centre. */
    private static ContourPoints box(double spacing, Rule rule) {
        return ContourPoints.rectangle(CX - 0.9 * LB, CY - 1.1 * LB, CX + 1.1 * LB, CY + 0.9 * LB, spacing, rule);
    }

    /** The cylinder's scattered (or total) field at the points, as U and as V_t. */
    private static SurfaceSamples[] sample(CylinderSeries cyl, ContourPoints pu, ContourPoints pv, boolean total) {
        Complex amp = incidentAtCentre();
        double[] x = pu.x();
        double[] y = pu.y();
        double[] ur = new double[x.length];
        double[] ui = new double[x.length];
        for (int j = 0; j < x.length; j++) {
            Phasors f = (total ? cyl.total(x[j] - CX, y[j] - CY) : cyl.scattered(x[j] - CX, y[j] - CY)).times(amp);
            ur[j] = f.u().re();
            ui[j] = f.u().im();
        }
        x = pv.x();
        y = pv.y();
        double[][] v = new double[4][x.length];
        for (int j = 0; j < x.length; j++) {
            Phasors f = (total ? cyl.total(x[j] - CX, y[j] - CY) : cyl.scattered(x[j] - CX, y[j] - CY)).times(amp);
            v[0][j] = f.vx().re();
            v[1][j] = f.vx().im();
            v[2][j] = f.vy().re();
            v[3][j] = f.vy().im();
        }
        return new SurfaceSamples[] {pu.scalar(ur, ui), pv.tangential(v[0], v[1], v[2], v[3])};
    }

    /** The exact far amplitude about the origin: U_i(c) e^{−ik r̂·c} T(φ − φ_i) for a cylinder centred at c. */
    private static Complex exactAmplitude(CylinderSeries cyl, double phi) {
        return incidentAtCentre().times(Complex.polar(1, -K * (Math.cos(phi) * CX + Math.sin(phi) * CY)))
                .times(cyl.amplitude(phi - INCIDENCE));
    }

    private static double amplitudeError(NearToFarField ff, CylinderSeries cyl) {
        double worst = 0;
        double peak = 0;
        for (int q = 0; q < 360; q++) {
            double phi = 2 * Math.PI * q / 360;
            Complex exact = exactAmplitude(cyl, phi);
            worst = Math.max(worst, ff.amplitude(phi).minus(exact).abs());
            peak = Math.max(peak, exact.abs());
        }
        return worst / peak;
    }

    /**
     * The exact scattered field of a dielectric (N = 1.5 + 0.05i, x = 3) and a conducting cylinder (x = 2) in a
     * background of index 1.33, lit at 0.5 rad, on a 2 × 2 wavelength rectangle at 10, 20 and 40 points per
     * wavelength: U and V_t both at midpoints, both at trapezoid nodes, and staggered (U at midpoints, V_t at nodes,
     * half a spacing apart, as E and H are on a Yee grid). The far amplitude converges at second order; C_sca
     * (from the radiated power) and C_ext (optical theorem) approach the series' values; σ in dB within 20 dB of its
     * peak is within a fraction of a dB at 20 points per wavelength.
     */
    @ParameterizedTest
    @EnumSource(Polarization.class)
    void cylinderFarFieldConvergesAtSecondOrder(Polarization pol) {
        Rule[][] rules = {{Rule.MIDPOINT, Rule.MIDPOINT}, {Rule.TRAPEZOID, Rule.TRAPEZOID}, {Rule.MIDPOINT, Rule.TRAPEZOID}};
        for (boolean conductor : new boolean[] {false, true}) {
            CylinderSeries cyl = cylinder(pol, conductor);
            for (Rule[] rule : rules) {
                double[] err = new double[3];
                int[] ppw = {10, 20, 40};
                NearToFarField finest = null;
                for (int i = 0; i < 3; i++) {
                    double h = LB / ppw[i];
                    SurfaceSamples[] s = sample(cyl, box(h, rule[0]), box(h, rule[1]), false);
                    NearToFarField ff = new NearToFarField(pol, LAMBDA, NB, s[0], s[1]);
                    err[i] = amplitudeError(ff, cyl);
                    if (i == 1) {
                        double peak = 0;
                        for (int q = 0; q < 360; q++) {
                            peak = Math.max(peak, cyl.scatteringWidth(2 * Math.PI * q / 360));
                        }
                        for (int q = 0; q < 360; q++) {
                            double phi = 2 * Math.PI * q / 360;
                            double exact = cyl.scatteringWidth(phi - INCIDENCE);
                            if (exact >= peak / 100) {
                                double db = Math.abs(10 * Math.log10(ff.scatteringWidth(phi, 1) / exact));
                                assertTrue(db <= DB_20, String.format("%s %s %s/%s at 20 ppw, phi = %g: %.3g dB", pol,
                                        conductor ? "conductor" : "dielectric", rule[0], rule[1], phi, db));
                            }
                        }
                    }
                    finest = ff;
                }
                String where = String.format("%s %s, U %s, V_t %s: far-amplitude errors %.3g, %.3g, %.3g at 10, 20, 40 ppw",
                        pol, conductor ? "conductor" : "dielectric", rule[0], rule[1], err[0], err[1], err[2]);
                double order = Math.log(err[1] / err[2]) / Math.log(2);
                assertTrue(err[2] <= AMPLITUDE_40 && order >= ORDER_MIN && order <= ORDER_MAX, where + ", order " + order);
                double sca = finest.scatteringWidthTotal(1) / cyl.scatteringWidthTotal() - 1;
                double ext = finest.extinctionWidth(INCIDENCE, Complex.ONE) / cyl.extinctionWidth() - 1;
                double abs = finest.absorptionWidth(INCIDENCE, Complex.ONE) - cyl.absorptionWidth();
                assertTrue(Math.abs(sca) <= TOTALS_40 && Math.abs(ext) <= TOTALS_40
                        && Math.abs(abs) <= TOTALS_40 * cyl.extinctionWidth(), String.format(
                                "%s: C_sca %.3g, C_ext %.3g relative, C_abs %.3g m off", where, sca, ext, abs));
            }
        }
    }

    /**
     * Two line sources of complex strengths a_s at r_s, U = Σ (i/4) a_s H_0^(1)(k|r − r_s|) (the 2D Green's
     * function), whose far amplitude is exactly F(φ) = (i/4) Σ a_s e^{−ik r̂·r_s} and whose radiated power is
     * P = (2/(πk)) c ∫|F|² dφ = (c/(4k)) [Σ|a_s|² + 2 Re(a_1 a_2*) J_0(k|r_1 − r_2|)] (∫ e^{−ik r̂·d} dφ =
     * 2π J_0(k|d|), A&amp;S 9.1.21). The transformation, the radiated power and the contour flux must agree with it,
     * independently of the cylinder series.
     */
    @ParameterizedTest
    @EnumSource(Polarization.class)
    void lineSources(Polarization pol) {
        double[][] at = {{0.1e-6, 0.05e-6}, {-0.35e-6, 0.2e-6}};
        Complex[] strength = {Complex.of(1, 0.3), Complex.of(-0.4, 0.8)};
        double k0 = 2 * Math.PI / LAMBDA;
        double c = pol == Polarization.S ? NB / (2 * PhysicalConstants.ETA0) : 1 / (2 * NB * PhysicalConstants.ETA0);
        double d = Math.hypot(at[0][0] - at[1][0], at[0][1] - at[1][1]);
        double exactPower = c / (4 * K) * (strength[0].norm() + strength[1].norm()
                + 2 * strength[0].times(strength[1].conjugate()).re() * Bessel.besselJ(0, K * d)[0]);
        double[] err = new double[2];
        int[] ppw = {20, 40};
        for (int i = 0; i < 2; i++) {
            ContourPoints pts = ContourPoints.rectangle(-LB, -0.8 * LB, 0.9 * LB, LB, LB / ppw[i], Rule.MIDPOINT);
            double[] x = pts.x();
            double[] y = pts.y();
            int n = x.length;
            double[] ur = new double[n];
            double[] ui = new double[n];
            double[][] v = new double[4][n];
            for (int j = 0; j < n; j++) {
                Complex u = Complex.ZERO;
                Complex gx = Complex.ZERO;
                Complex gy = Complex.ZERO;
                for (int s = 0; s < 2; s++) {
                    double rx = x[j] - at[s][0];
                    double ry = y[j] - at[s][1];
                    double rho = Math.hypot(rx, ry);
                    double[] jn = Bessel.besselJ(1, K * rho);
                    double[] yn = Bessel.besselY(1, K * rho);
                    Complex q = strength[s].times(Complex.of(0, 0.25));
                    u = u.plus(q.times(Complex.of(jn[0], yn[0])));
                    Complex radial = q.times(Complex.of(jn[1], yn[1])).times(-K / rho); // ∇U = −k H_1 ρ̂ per unit q
                    gx = gx.plus(radial.times(rx));
                    gy = gy.plus(radial.times(ry));
                }
                // s: η0H = (i/k0) ẑ × ∇U = (i/k0)(−∂yU, ∂xU); p: E = −(i/(k0 n²)) ẑ × ∇U
                Complex f = pol == Polarization.S ? Complex.of(0, 1 / k0) : Complex.of(0, -1 / (k0 * NB * NB));
                Complex vx = f.times(gy).negate();
                Complex vy = f.times(gx);
                ur[j] = u.re();
                ui[j] = u.im();
                v[0][j] = vx.re();
                v[1][j] = vx.im();
                v[2][j] = vy.re();
                v[3][j] = vy.im();
            }
            SurfaceSamples us = pts.scalar(ur, ui);
            SurfaceSamples vs = pts.tangential(v[0], v[1], v[2], v[3]);
            NearToFarField ff = new NearToFarField(pol, LAMBDA, NB, us, vs);
            double peak = 0;
            for (int q = 0; q < 360; q++) {
                double phi = 2 * Math.PI * q / 360;
                Complex exact = Complex.ZERO;
                for (int s = 0; s < 2; s++) {
                    double ph = -K * (Math.cos(phi) * at[s][0] + Math.sin(phi) * at[s][1]);
                    exact = exact.plus(strength[s].times(Complex.of(0, 0.25)).times(Complex.polar(1, ph)));
                }
                err[i] = Math.max(err[i], ff.amplitude(phi).minus(exact).abs());
                peak = Math.max(peak, exact.abs());
            }
            err[i] /= peak;
            double power = ff.radiatedPower();
            double flux = SurfaceFlux.outwardPower(pol, us, vs);
            if (i == 1) {
                final double e = err[i];
                assertTrue(e <= LINE_SOURCE_40, () -> String.format("%s: far amplitude off by %.3g of the peak", pol, e));
                assertTrue(Math.abs(power / exactPower - 1) <= LINE_SOURCE_40, String.format(
                        "%s: radiated power %.10g W/m, exact %.10g", pol, power, exactPower));
                assertTrue(Math.abs(flux / exactPower - 1) <= LINE_SOURCE_40, String.format(
                        "%s: contour flux %.10g W/m, exact %.10g", pol, flux, exactPower));
            }
        }
        double order = Math.log(err[0] / err[1]) / Math.log(2);
        assertTrue(order >= ORDER_MIN && order <= ORDER_MAX, pol + ": order " + order);
    }

    /**
     * The contour flux of the cylinder's fields: the scattered field carries C_sca·I out, the total field −C_abs·I
     * (I the incident intensity: n_b/(2η0) for s, 1/(2 n_b η0) for p, unit U). Second order in the spacing.
     */
    @ParameterizedTest
    @EnumSource(Polarization.class)
    void surfaceFluxOfTheCylinder(Polarization pol) {
        CylinderSeries cyl = cylinder(pol, false);
        double intensity = pol == Polarization.S ? NB / (2 * PhysicalConstants.ETA0) : 1 / (2 * NB * PhysicalConstants.ETA0);
        double[] errSca = new double[2];
        double[] errAbs = new double[2];
        int[] ppw = {20, 40};
        for (int i = 0; i < 2; i++) {
            ContourPoints pts = box(LB / ppw[i], Rule.MIDPOINT);
            SurfaceSamples[] s = sample(cyl, pts, pts, false);
            SurfaceSamples[] t = sample(cyl, pts, pts, true);
            errSca[i] = Math.abs(SurfaceFlux.outwardPower(pol, s[0], s[1]) / intensity / cyl.scatteringWidthTotal() - 1);
            errAbs[i] = Math.abs(-SurfaceFlux.outwardPower(pol, t[0], t[1]) / intensity / cyl.absorptionWidth() - 1);
        }
        String msg = String.format("%s: scattered flux %.3g, %.3g; absorbed %.3g, %.3g relative at 20, 40 ppw", pol,
                errSca[0], errSca[1], errAbs[0], errAbs[1]);
        assertTrue(errSca[1] <= TOTALS_40 && errAbs[1] <= TOTALS_40 && errSca[1] < errSca[0] / 3
                && errAbs[1] < errAbs[0] / 3, msg);
    }

    @Test
    void refusesInconsistentSamples() {
        ContourPoints a = ContourPoints.rectangle(0, 0, 1e-6, 1e-6, 0.1e-6, Rule.MIDPOINT);
        ContourPoints b = ContourPoints.rectangle(0, 0, 1e-6, 1e-6, 0.1e-6, Rule.TRAPEZOID);
        double[] z = new double[a.size()];
        double[] zb = new double[b.size()];
        assertThrows(IllegalArgumentException.class, () -> a.scalar(zb, zb));
        assertThrows(IllegalArgumentException.class,
                () -> SurfaceFlux.outwardPower(Polarization.S, a.scalar(z, z), b.scalar(zb, zb)));
        assertThrows(IllegalArgumentException.class,
                () -> new NearToFarField(Polarization.P, 1e-6, -1, a.scalar(z, z), a.scalar(z, z)));
        assertThrows(IllegalArgumentException.class, () -> ContourPoints.rectangle(0, 0, 1.05e-6, 1e-6, 0.1e-6,
                Rule.MIDPOINT));
        assertThrows(IllegalArgumentException.class, () -> new ContourPoints(new double[] {0}, new double[] {0},
                new double[] {0.5}, new double[] {0.5}, new double[] {1}));
        double[] nan = z.clone();
        nan[3] = Double.NaN;
        assertThrows(IllegalArgumentException.class, () -> a.scalar(nan, z));
    }

    /** The rectangle's rules: lengths, normals pointing out, corners of the trapezoid rule sampled twice. */
    @Test
    void rectangleRules() {
        ContourPoints mid = ContourPoints.rectangle(-1e-6, 2e-6, 3e-6, 3.5e-6, 0.25e-6, Rule.MIDPOINT);
        ContourPoints trap = ContourPoints.rectangle(-1e-6, 2e-6, 3e-6, 3.5e-6, 0.25e-6, Rule.TRAPEZOID);
        assertTrue(Math.abs(mid.length() - 11e-6) <= 1e-20 && Math.abs(trap.length() - 11e-6) <= 1e-20);
        assertTrue(mid.size() == 2 * (16 + 6) && trap.size() == 2 * (17 + 7));
        double[] x = mid.x();
        double[] y = mid.y();
        double[] nx = mid.normalX();
        double[] ny = mid.normalY();
        for (int j = 0; j < mid.size(); j++) {
            // outward: the normal points away from the centre (1e-6, 2.75e-6)
            assertTrue(nx[j] * (x[j] - 1e-6) + ny[j] * (y[j] - 2.75e-6) > 0, "normal " + j);
        }
    }
}

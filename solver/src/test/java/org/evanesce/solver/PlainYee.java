package org.evanesce.solver;

import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.solver.boundary.PmlParameters;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;

/**
 * Plain two-index loops of the Yee update (Yee, IEEE TAP 14, 302 (1966)) with a convolutional PML on
 * chosen sides and, optionally, Bloch-periodic x sides: an oracle for the engines, written one field
 * at a time in double precision with none of their vectors, strips, row fusion or blocks.
 *
 * <p>CPML (J. A. Roden &amp; S. D. Gedney, "Convolution PML (CPML)", Microwave Opt. Technol. Lett.
 * 27, 334 (2000)): in a layer a difference ∂ across the cell is replaced by ∂/κ + ψ, with the
 * recursive convolution ψ ← bψ + c∂ and
 * <pre>
 *   b = exp(−(σ'/κ + α')),   c = σ'(b − 1)/(σ'κ + κ²α'),   σ' = σΔt/ε0, α' = αΔt/ε0,
 *   σ' = σ'max d^m,  κ = 1 + (κmax − 1) d^m,  α' = α'max (1 − d),  σ'max = f · 0.8(m + 1)·S
 * </pre>
 * (grading and σopt = 0.8(m + 1)/(η0Δ): Taflove &amp; Hagness, Computational Electrodynamics, 3rd ed.,
 * ch. 7; 0.8(m + 1)/(η0Δ)·Δt/ε0 = 0.8(m + 1)·S). d is the depth of a site into the layer, 0 at its
 * inner face and 1 at the PEC wall behind it; E sites sit on nodes and H sites half a cell further
 * along the axis. Each update is written as the plain one followed by the correction
 * S·((1/κ − 1)·∂ + ψ), the split the engines use, so double precision must agree bit for bit.
 * ψ below 1e-300 is set to zero, as the engines' subnormal guard does.
 *
 * <p>Bloch-periodic x (J. A. Roden et al., IEEE Trans. Microwave Theory Tech. 46, 420 (1998)):
 * complex fields, F(x + P) = F(x)·e^{iφ}, φ = kx·nx·Δ; the magnetic update of the last column reads
 * E one node east as e^{+iφ}·E(0), the electric update of column 0 reads H half a cell west as
 * e^{−iφ}·H(nx − 1). The other sides are PEC walls, backed by a PML where one is given.
 */
final class PlainYee {

    private static final double PSI_TINY = 1e-300;

    private final Polarization pol;
    private final int nx;
    private final int ny;
    private final double s;
    private final boolean bloch;
    private final double cos;
    private final double sin;
    /** ca and cb of the electric components: s: [0] Ez; p: [0] Ex, [1] Ey; indexed [i][j]. */
    private final double[][][] ca;
    private final double[][][] cb;
    /** CPML {b, c, 1/κ − 1} per index along each axis, or null where no correction applies. */
    private final double[][] eX, hX, eY, hY;
    /** [part][component in polarization order][i][j]; part 1 (imaginary) only with Bloch sides. */
    final double[][][][] f;
    /** ψ per part: s: Hy along x, Hx along y, Ez along x, Ez along y; p: Hz x, Hz y, Ex y, Ey x. */
    private final double[][][][] psi;

    /**
     * @param pml layers of the left, right, bottom and top PML (0: a plain PEC wall); left and right
     *            are ignored with Bloch sides
     * @param kx  Bloch wavenumber in rad/m, or NaN for walls on the x sides
     */
    PlainYee(MaterialGrid g, Polarization pol, double courant, double dt, int[] pml, PmlParameters grading, double kx) {
        this.pol = pol;
        nx = g.nx();
        ny = g.ny();
        s = courant;
        bloch = !Double.isNaN(kx);
        double phase = bloch ? kx * nx * g.cellSize() : 0;
        cos = Math.cos(phase);
        sin = Math.sin(phase);
        FieldSite[] sites = pol == Polarization.S ? new FieldSite[] {FieldSite.EZ} : new FieldSite[] {FieldSite.EX, FieldSite.EY};
        ca = new double[sites.length][nx][ny];
        cb = new double[sites.length][nx][ny];
        for (int q = 0; q < sites.length; q++) {
            for (int i = 0; i < nx; i++) {
                for (int j = 0; j < ny; j++) {
                    // lossy dielectric (Taflove & Hagness ch. 3): L = σΔt/(2ε0εr)
                    Material m = g.material(sites[q], i, j);
                    double l = m.conductivity() * dt / (2 * PhysicalConstants.EPS0 * m.relativePermittivity());
                    ca[q][i][j] = (1 - l) / (1 + l);
                    cb[q][i][j] = courant / (m.relativePermittivity() * (1 + l));
                }
            }
        }
        int left = bloch ? 0 : pml[0];
        int right = bloch ? 0 : pml[1];
        eX = new double[nx][];
        hX = new double[nx][];
        for (int i = 0; i < nx; i++) {
            eX[i] = profile(left > 0 && i < left ? (double) (left - i) / left
                    : right > 0 && i > nx - 1 - right ? (double) (i - (nx - 1 - right)) / right : 0, grading);
            hX[i] = profile(left > 0 && i < left ? (left - i - 0.5) / left
                    : right > 0 && i >= nx - 1 - right && i <= nx - 2 ? (i - (nx - 1 - right) + 0.5) / right : 0, grading);
        }
        eY = new double[ny][];
        hY = new double[ny][];
        for (int j = 0; j < ny; j++) {
            eY[j] = profile(pml[2] > 0 && j < pml[2] ? (double) (pml[2] - j) / pml[2]
                    : pml[3] > 0 && j > ny - 1 - pml[3] ? (double) (j - (ny - 1 - pml[3])) / pml[3] : 0, grading);
            hY[j] = profile(pml[2] > 0 && j < pml[2] ? (pml[2] - j - 0.5) / pml[2]
                    : pml[3] > 0 && j >= ny - 1 - pml[3] && j <= ny - 2 ? (j - (ny - 1 - pml[3]) + 0.5) / pml[3] : 0, grading);
        }
        int parts = bloch ? 2 : 1;
        f = new double[parts][3][nx][ny];
        psi = new double[parts][4][nx][ny];
    }

    /** {b, c, 1/κ − 1} at depth d, or null outside the layer (d = 0) and on the wall (d = 1). */
    private double[] profile(double d, PmlParameters p) {
        if (!(d > 0 && d < 1)) {
            return null;
        }
        double sigmaMax = p.sigmaFactor() * 0.8 * (p.order() + 1) * s;
        double g = Math.pow(d, p.order());
        double sigma = sigmaMax * g;
        double kappa = 1.0 + (p.kappaMax() - 1.0) * g;
        double alpha = p.alphaMax() * (1.0 - d);
        double b = Math.exp(-(sigma / kappa + alpha));
        double c = sigma * (b - 1.0) / (sigma * kappa + kappa * kappa * alpha);
        return new double[] {b, c, 1.0 / kappa - 1.0};
    }

    /** The CPML correction term (1/κ − 1)·∂ + ψ, updating ψ at (i, j) first. */
    private static double cpml(double[] p, double[][] psi, int i, int j, double d) {
        double v = p[0] * psi[i][j] + p[1] * d;
        if (Math.abs(v) < PSI_TINY) {
            v = 0;
        }
        psi[i][j] = v;
        return p[2] * d + v;
    }

    /** The value of component c (in the polarization's order) at (i, j); part 0 real, 1 imaginary. */
    double get(int part, Component c, int i, int j) {
        int q = java.util.Arrays.asList(pol.components()).indexOf(c);
        return f[part][q][i][j];
    }

    void run(int steps) {
        for (int n = 0; n < steps; n++) {
            if (pol == Polarization.S) {
                stepS();
            } else {
                stepP();
            }
        }
    }

    /** The seam values of part r of e^{±iφ}·(a + ib), a and b the real and imaginary parts. */
    private double[][] seam(double[][] re, double[][] im, int i, double sign) {
        double[][] out = new double[2][ny];
        for (int j = 0; j < ny; j++) {
            double a = re[i][j];
            double b = bloch ? im[i][j] : 0;
            out[0][j] = cos * a - sign * sin * b;
            out[1][j] = sign * sin * a + cos * b;
        }
        return out;
    }

    /** s: Ez, Hx, Hy. */
    private void stepS() {
        int parts = f.length;
        int last = bloch ? nx - 1 : nx - 2;
        double[][] east = bloch ? seam(f[0][0], f[1][0], 0, +1) : null;
        for (int r = 0; r < parts; r++) {
            double[][] ez = f[r][0], hx = f[r][1], hy = f[r][2];
            for (int i = 0; i < nx; i++) {
                for (int j = 0; j < ny - 1; j++) {
                    double d = ez[i][j + 1] - ez[i][j];
                    hx[i][j] = hx[i][j] - s * d;
                    if (hY[j] != null) {
                        hx[i][j] = hx[i][j] + (-s) * cpml(hY[j], psi[r][1], i, j, d);
                    }
                }
            }
            for (int i = 0; i <= last; i++) {
                for (int j = 0; j < ny; j++) {
                    double d = (i < nx - 1 ? ez[i + 1][j] : east[r][j]) - ez[i][j];
                    hy[i][j] = hy[i][j] + s * d;
                    if (hX[i] != null) {
                        hy[i][j] = hy[i][j] + s * cpml(hX[i], psi[r][0], i, j, d);
                    }
                }
            }
        }
        double[][] west = bloch ? seam(f[0][2], f[1][2], nx - 1, -1) : null;
        for (int r = 0; r < parts; r++) {
            double[][] ez = f[r][0], hx = f[r][1], hy = f[r][2];
            for (int i = bloch ? 0 : 1; i <= last; i++) {
                for (int j = 1; j < ny - 1; j++) {
                    double dx = hy[i][j] - (i > 0 ? hy[i - 1][j] : west[r][j]);
                    double dy = hx[i][j] - hx[i][j - 1];
                    ez[i][j] = ca[0][i][j] * ez[i][j] + cb[0][i][j] * (dx - dy);
                    if (eX[i] != null) {
                        ez[i][j] = ez[i][j] + cb[0][i][j] * cpml(eX[i], psi[r][2], i, j, dx);
                    }
                    if (eY[j] != null) {
                        ez[i][j] = ez[i][j] - cb[0][i][j] * cpml(eY[j], psi[r][3], i, j, dy);
                    }
                }
            }
        }
    }

    /** p: Hz, Ex, Ey. */
    private void stepP() {
        int parts = f.length;
        int last = bloch ? nx - 1 : nx - 2;
        double[][] east = bloch ? seam(f[0][2], f[1][2], 0, +1) : null;
        for (int r = 0; r < parts; r++) {
            double[][] hz = f[r][0], ex = f[r][1], ey = f[r][2];
            for (int i = 0; i <= last; i++) {
                for (int j = 0; j < ny - 1; j++) {
                    double dy = ex[i][j + 1] - ex[i][j];
                    double dx = (i < nx - 1 ? ey[i + 1][j] : east[r][j]) - ey[i][j];
                    hz[i][j] = hz[i][j] + s * (dy - dx);
                    if (hX[i] != null) {
                        hz[i][j] = hz[i][j] + (-s) * cpml(hX[i], psi[r][0], i, j, dx);
                    }
                    if (hY[j] != null) {
                        hz[i][j] = hz[i][j] + s * cpml(hY[j], psi[r][1], i, j, dy);
                    }
                }
            }
        }
        double[][] west = bloch ? seam(f[0][0], f[1][0], nx - 1, -1) : null;
        for (int r = 0; r < parts; r++) {
            double[][] hz = f[r][0], ex = f[r][1], ey = f[r][2];
            for (int i = 0; i <= last; i++) {
                for (int j = 1; j < ny - 1; j++) {
                    double dy = hz[i][j] - hz[i][j - 1];
                    ex[i][j] = ca[0][i][j] * ex[i][j] + cb[0][i][j] * dy;
                    if (eY[j] != null) {
                        ex[i][j] = ex[i][j] + cb[0][i][j] * cpml(eY[j], psi[r][2], i, j, dy);
                    }
                }
            }
            for (int i = bloch ? 0 : 1; i <= last; i++) {
                for (int j = 0; j < ny - 1; j++) {
                    double dx = hz[i][j] - (i > 0 ? hz[i - 1][j] : west[r][j]);
                    ey[i][j] = ca[1][i][j] * ey[i][j] - cb[1][i][j] * dx;
                    if (eX[i] != null) {
                        ey[i][j] = ey[i][j] - cb[1][i][j] * cpml(eX[i], psi[r][3], i, j, dx);
                    }
                }
            }
        }
    }
}

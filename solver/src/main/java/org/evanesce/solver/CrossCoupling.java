package org.evanesce.solver;

import java.util.Arrays;
import java.util.HashMap;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import org.evanesce.geometry.CrossTerms;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.kernel.Engine;

/**
 * The off-diagonal part of the smoothed inverse permittivity ({@link CrossTerms}) in the p update: after the kernel's
 * E half-step, which applies the diagonal, an Ex site i gets Σ_j S w_ij c_y(j) over the four Ey sites j round it, and
 * an Ey site j gets Σ_i S w_ij c_x(i) over the four Ex sites round it, with c_x = Hz(i+½, j+½) − Hz(i+½, j−½) and
 * c_y = −(Hz(i+½, j+½) − Hz(i−½, j+½)) the curls that drive Ex and Ey (ΔE = S ε⁻¹ c, S the Courant number). The
 * weights w_ij = ((ε⁻¹)_xy(i) + (ε⁻¹)_xy(j))/8 are the same for both members of a pair: a uniform (ε⁻¹)_xy gives it
 * times the four-point mean of the other component (the full tensor of A. Farjadpour et al., Opt. Lett. 31, 2972
 * (2006)), and the coupling is symmetric, as the discrete ε⁻¹ must be for the scheme to keep its energy (with
 * per-site weights the net power out of FluxBoxTest's lossless box exceeded its bound, 2e-7 of the power through the
 * sides; cf. G. R. Werner and J. R. Cary, "A stable FDTD algorithm for non-diagonal, anisotropic dielectrics",
 * J. Comput. Phys. 226, 1085 (2007), from memory). Sites next to a listed one take part even where their own
 * (ε⁻¹)_xy is zero.
 *
 * <p>It reads only Hz, which is complete after the step's two phases, and writes only the sites of the rows asked:
 * bands may apply it in any split with the same result, on any thread count.
 */
final class CrossCoupling {

    private final Engine engine;
    private final int nx;
    private final boolean complex;
    private final int[] exCells;
    private final int[] eyCells;
    /** S w per site and neighbour: Ex's Ey neighbours k, k + 1, k − nx, k − nx + 1; Ey's Ex ones k − 1, k, k + nx − 1, k + nx. */
    private final double[][] exWeights;
    private final double[][] eyWeights;

    private CrossCoupling(Engine engine, int nx, TreeMap<Integer, double[]> ex, TreeMap<Integer, double[]> ey) {
        this.engine = engine;
        this.nx = nx;
        this.complex = engine.isComplex();
        this.exCells = ex.keySet().stream().mapToInt(Integer::intValue).toArray();
        this.exWeights = ex.values().toArray(new double[0][]);
        this.eyCells = ey.keySet().stream().mapToInt(Integer::intValue).toArray();
        this.eyWeights = ey.values().toArray(new double[0][]);
    }

    /**
     * The coupling of a p run on {@code grid}, or null where there is nothing to apply (s, or no cross terms). Sites
     * of materials the engine updates its own way ({@code special}: dispersive and series ids) keep the diagonal.
     */
    static CrossCoupling of(MaterialGrid grid, Polarization pol, Engine engine, double courant, Set<Integer> special) {
        CrossTerms t = grid.crossTerms();
        if (pol != Polarization.P || t.isEmpty()) {
            return null;
        }
        int nx = grid.nx();
        Map<Integer, Double> bx = listed(grid, t, FieldSite.EX, special);
        Map<Integer, Double> by = listed(grid, t, FieldSite.EY, special);
        TreeMap<Integer, double[]> ex = new TreeMap<>();
        TreeMap<Integer, double[]> ey = new TreeMap<>();
        // Ex at k and its Ey neighbours (slot m of Ex; the same pair is slot OTHER[m] of the Ey site)
        int[] toEy = {0, 1, -nx, -nx + 1};
        int[] other = {1, 0, 3, 2};
        java.util.Set<Integer> exSites = new java.util.TreeSet<>(bx.keySet());
        for (int e : by.keySet()) {
            exSites.add(e - 1);
            exSites.add(e);
            exSites.add(e + nx - 1);
            exSites.add(e + nx);
        }
        for (int k : exSites) {
            double bi = bx.getOrDefault(k, 0.0);
            for (int m = 0; m < 4; m++) {
                int e = k + toEy[m];
                double bj = by.getOrDefault(e, 0.0);
                if (bi == 0 && bj == 0) {
                    continue;
                }
                double w = courant * ((bi + bj) * 0.125);
                ex.computeIfAbsent(k, x -> new double[4])[m] = w;
                ey.computeIfAbsent(e, x -> new double[4])[other[m]] = w;
            }
        }
        return ex.isEmpty() ? null : new CrossCoupling(engine, nx, ex, ey);
    }

    /** The listed (ε⁻¹)_xy of a site by cell, leaving out the {@code special} materials' sites. */
    private static Map<Integer, Double> listed(MaterialGrid grid, CrossTerms t, FieldSite site, Set<Integer> special) {
        int[] c = t.cells(site);
        double[] v = t.values(site);
        int[] ids = special.isEmpty() ? null : grid.ids(site);
        Map<Integer, Double> out = new HashMap<>();
        for (int a = 0; a < c.length; a++) {
            if (ids == null || !special.contains(ids[c[a]])) {
                out.put(c[a], v[a]);
            }
        }
        return out;
    }

    /** Adds the cross terms to the sites in rows [j0, j1). */
    void apply(int j0, int j1) {
        int lo = j0 * nx;
        int hi = j1 * nx;
        for (int t = first(exCells, lo); t < exCells.length && exCells[t] < hi; t++) {
            int k = exCells[t];
            double[] w = exWeights[t];
            double c = w[0] * cy(k, false) + w[1] * cy(k + 1, false) + w[2] * cy(k - nx, false)
                    + w[3] * cy(k - nx + 1, false);
            engine.set(Component.EX, k, engine.get(Component.EX, k) + c);
            if (complex) {
                double ci = w[0] * cy(k, true) + w[1] * cy(k + 1, true) + w[2] * cy(k - nx, true)
                        + w[3] * cy(k - nx + 1, true);
                engine.setImag(Component.EX, k, engine.getImag(Component.EX, k) + ci);
            }
        }
        for (int t = first(eyCells, lo); t < eyCells.length && eyCells[t] < hi; t++) {
            int k = eyCells[t];
            double[] w = eyWeights[t];
            double c = w[0] * cx(k - 1, false) + w[1] * cx(k, false) + w[2] * cx(k + nx - 1, false)
                    + w[3] * cx(k + nx, false);
            engine.set(Component.EY, k, engine.get(Component.EY, k) + c);
            if (complex) {
                double ci = w[0] * cx(k - 1, true) + w[1] * cx(k, true) + w[2] * cx(k + nx - 1, true)
                        + w[3] * cx(k + nx, true);
                engine.setImag(Component.EY, k, engine.getImag(Component.EY, k) + ci);
            }
        }
    }

    /** The curl that drives Ex at flat index k: Hz(k) − Hz(k − nx). */
    private double cx(int k, boolean imag) {
        return hz(k, imag) - hz(k - nx, imag);
    }

    /** The curl that drives Ey at flat index k: −(Hz(k) − Hz(k − 1)). */
    private double cy(int k, boolean imag) {
        return hz(k - 1, imag) - hz(k, imag);
    }

    private double hz(int k, boolean imag) {
        return imag ? engine.getImag(Component.HZ, k) : engine.get(Component.HZ, k);
    }

    /** The first position in the ascending {@code cells} at or after {@code from}. */
    private static int first(int[] cells, int from) {
        int q = Arrays.binarySearch(cells, from);
        return q >= 0 ? q : -q - 1;
    }
}

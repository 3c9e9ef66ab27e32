package org.evanesce.solver.source;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.solver.grid.Courant;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.kernel.Engine;
import org.jtransforms.fft.DoubleFFT_1D;

/**
 * A 2D Gaussian beam injected one way through a horizontal total-field/scattered-field line (the
 * method of Taflove &amp; Hagness, ch. 5, on one line of the grid) in a homogeneous, lossless medium.
 *
 * <p>The beam: waist radius w0 (the field falls to 1/e at w0 from the axis at the waist), waist
 * centre (xw, yw), travelling up (+y) or down (−y) at angle θ from that direction towards +x. Its
 * angular spectrum in the beam's own frame is a(k_s) = exp(−k_s² w0²/4) (the Fourier pair of
 * exp(−s²/w0²)); a component at angle ψ from the axis has in-plane wavenumber kx = k sin(θ + ψ),
 * k = n k0, so in kx the spectrum is A(kx) = a(k sin ψ)·k cos ψ / k_y (the Jacobian of k_s → kx).
 * The line's incident fields are sums of these plane waves, taken by FFT.
 *
 * <p>To inject one way the two rows' fields must be a solution of the grid itself: each
 * component propagates from the waist with the grid's normal wavenumber k̃y, sin²(k̃yΔ/2) =
 * ε sin²(ωΔt/2)/S² − sin²(kxΔ/2) (the 2D Yee dispersion relation, Taflove &amp; Hagness ch. 4), and
 * its magnetic and electric parts are related by the discrete form of the curl equation between
 * the rows, η0H = S sin(k̃yΔ/2)/sin(ωΔt/2)·E (s: from the Hx update; p: E = −S sin(k̃yΔ/2)/(ε
 * sin(ωΔt/2))·η0Hz from the Ex update), which tends to k_y/k0 as Δ → 0. At the carrier frequency
 * the scattered-field side then receives nothing; a pulse is the carrier times an envelope that
 * crosses each cell at the wave's arrival time (narrow-band approximation), so what leaks is of
 * the order of the envelope's relative bandwidth times the dispersion over it. A continuous
 * (ramped) wave ramps up along the whole line at once instead: its steady state is the same, and
 * a wide tilted beam settles without waiting for the ramp to sweep across it (what leaks is
 * transient).
 *
 * <p>Which side is total field: for an upward beam the rows from {@code row} up; for a downward
 * beam the rows from {@code row} down. The corrections: the magnetic row just outside the total
 * field receives the incident E of {@code row}, the electric row {@code row} the incident H of
 * that magnetic row.
 */
public final class GaussianBeam {

    /** Components outside exp(−(k_s w0)²/4) &lt; this carry nothing worth injecting. */
    static final double NEGLIGIBLE = 1e-16;

    private GaussianBeam() {
    }

    /**
     * The beam and its medium.
     *
     * @param epsilon     the medium's relative permittivity: sets k = √ε k0, so the beam's angles and waist
     * @param gridEpsilon the permittivity the grid has there (differs from {@code epsilon} under a dispersion
     *                    correction): sets the grid's normal wavenumbers and wave impedance
     */
    public record Spec(Polarization polarization, double waist, double waistX, double waistY, double angle, boolean up,
                       double epsilon, double gridEpsilon, double amplitude, CarrierSignal signal) {
        public Spec {
            if (!(waist > 0) || !(epsilon > 0) || !(gridEpsilon > 0) || !(Math.abs(angle) < Math.PI / 2)
                    || !Double.isFinite(amplitude)) {
                throw new IllegalArgumentException(String.format("Gaussian beam: waist %g m, ε %g and grid ε %g must be "
                        + "positive, the angle %g° within ±90°, the amplitude finite", waist, epsilon, gridEpsilon,
                        Math.toDegrees(angle)));
            }
        }

        /** A beam in a medium the grid holds as it is. */
        public Spec(Polarization polarization, double waist, double waistX, double waistY, double angle, boolean up,
                    double epsilon, double amplitude, CarrierSignal signal) {
            this(polarization, waist, waistX, waistY, angle, up, epsilon, epsilon, amplitude, signal);
        }
    }

    /**
     * The two sheets that inject the beam on the line at {@code row}, across the whole grid.
     *
     * @param x0 x of node column 0, m
     * @param y0 y of node row 0, m
     */
    public static List<IncidentSheet> sheets(Spec b, Map<Side, Boundary> sides, int nx, int ny, double x0, double y0,
                                             double dx, double dt, int row) {
        return sheets(b, sides, nx, ny, x0, y0, dx, dt, row, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY);
    }

    /**
     * The same on the part of the line from x = {@code xFrom} to {@code xTo} (m): the medium need be
     * homogeneous only there, and the beam's field beyond should be negligible (at four footprints
     * w0/cos θ from the axis it is e^−16 of its peak).
     */
    public static List<IncidentSheet> sheets(Spec b, Map<Side, Boundary> sides, int nx, int ny, double x0, double y0,
                                             double dx, double dt, int row, double xFrom, double xTo) {
        boolean s = b.polarization() == Polarization.S;
        Component eComp = s ? Component.EZ : Component.EX;
        Component hComp = s ? Component.HX : Component.HZ;
        int hRow = b.up() ? row - 1 : row;
        double yE = y0 + row * dx;
        double yH = y0 + (hRow + 0.5) * dx;
        double offset = eComp.dx; // Ez and Hx at x = iΔ; Ex and Hz at (i + ½)Δ
        double[][] uE = profile(b, nx, x0 + offset * dx, dx, dt, yE, Field.ELECTRIC);
        double[][] uH = profile(b, nx, x0 + offset * dx, dx, dt, yH, Field.MAGNETIC);
        // signs of the corrections (derivation in the class comment): s up −, s down +, p up +, p down −
        double sign = (s == b.up()) ? -1 : 1;
        double n = Math.sqrt(b.epsilon());
        double sin = Math.sin(b.angle());
        double cos = Math.cos(b.angle()) * (b.up() ? 1 : -1);
        List<Integer> cells = new ArrayList<>();
        for (int i = 0; i < nx; i++) {
            double x = x0 + (i + offset) * dx;
            if (x >= xFrom && x <= xTo && Engine.wouldUpdate(sides, nx, ny, eComp, i, row)
                    && Engine.wouldUpdate(sides, nx, ny, hComp, i, hRow)) {
                cells.add(i);
            }
        }
        if (cells.isEmpty() || hRow < 0 || row >= ny) {
            throw new IllegalArgumentException("the beam's line at row " + row + " has no sites inside the grid's walls");
        }
        int m = cells.size();
        double[] dE = new double[m];
        double[] dH = new double[m];
        double earliest = Double.POSITIVE_INFINITY;
        for (int t = 0; t < m; t++) {
            double x = x0 + (cells.get(t) + offset) * dx - b.waistX();
            dE[t] = n / PhysicalConstants.C0 * (x * sin + (yE - b.waistY()) * cos);
            dH[t] = n / PhysicalConstants.C0 * (x * sin + (yH - b.waistY()) * cos);
            earliest = Math.min(earliest, Math.min(dE[t], dH[t]));
        }
        int[] eCells = new int[m];
        int[] hCells = new int[m];
        double[] eRe = new double[m];
        double[] eIm = new double[m];
        double[] hRe = new double[m];
        double[] hIm = new double[m];
        // a continuous wave ramps up along the whole line at once: its steady state is the same, and the
        // fields settle without waiting for the ramp to sweep across a wide, tilted beam
        boolean continuous = !(b.signal() instanceof GaussianPulse);
        for (int t = 0; t < m; t++) {
            int i = cells.get(t);
            dE[t] = continuous ? 0 : dE[t] - earliest;
            dH[t] = continuous ? 0 : dH[t] - earliest;
            // the magnetic row receives the incident E of the electric row, and the reverse
            hCells[t] = hRow * nx + i;
            hRe[t] = sign * uE[0][i];
            hIm[t] = sign * uE[1][i];
            eCells[t] = row * nx + i;
            eRe[t] = sign * uH[0][i];
            eIm[t] = sign * uH[1][i];
        }
        return List.of(new IncidentSheet(eComp, eCells, eRe, eIm, dH, b.signal()),
                new IncidentSheet(hComp, hCells, hRe, hIm, dE, b.signal()));
    }

    private enum Field { ELECTRIC, MAGNETIC }

    /**
     * The incident field's phasor (s: Ez or η0Hx; p: Ex or η0Hz) at x = xStart + iΔ, i &lt; nx, on the
     * line y, as {re[], im[]}, scaled so that the z component (Ez for s, η0Hz for p) is
     * {@code amplitude} at the waist centre.
     */
    static double[][] profile(Spec b, int nx, double xStart, double dx, double dt, double y, Field f) {
        int size = Integer.highestOneBit(Math.max(4 * nx, 64) - 1) << 1;
        double k = Math.sqrt(b.epsilon()) * 2 * Math.PI * b.signal().carrierFrequency() / PhysicalConstants.C0;
        double courant = Courant.of(dt, dx);
        double sinW = Math.sin(Math.PI * b.signal().carrierFrequency() * dt);
        double dispersion = b.gridEpsilon() * sinW * sinW / (courant * courant);
        boolean zComponent = (f == Field.ELECTRIC) == (b.polarization() == Polarization.S);
        double[] spectrum = new double[2 * size];
        double total = 0;
        for (int q = 0; q < size; q++) {
            int mIndex = q < size / 2 ? q : q - size;
            double kx = 2 * Math.PI * mIndex / (size * dx);
            double a = weight(b, k, kx);
            if (a == 0) {
                continue;
            }
            double sx = Math.sin(kx * dx / 2);
            double sq = dispersion - sx * sx;
            if (!(sq > 0 && sq < 1)) {
                continue; // the grid carries no propagating wave with this kx
            }
            double ky = (b.up() ? 2 : -2) / dx * Math.asin(Math.sqrt(sq));
            total += a;
            double factor = 1;
            if (!zComponent) {
                double h = courant * Math.sin(ky * dx / 2) / sinW;
                factor = b.polarization() == Polarization.S ? h : -h / b.gridEpsilon();
            }
            // propagate from the waist and move the origin from the waist to xStart
            double phase = ky * (y - b.waistY()) + kx * (xStart - b.waistX());
            spectrum[2 * q] = a * factor * Math.cos(phase);
            spectrum[2 * q + 1] = a * factor * Math.sin(phase);
        }
        new DoubleFFT_1D(size).complexInverse(spectrum, false);
        double scale = total > 0 ? b.amplitude() / total : 0;
        double[][] out = new double[2][nx];
        for (int i = 0; i < nx; i++) {
            out[0][i] = spectrum[2 * i] * scale;
            out[1][i] = spectrum[2 * i + 1] * scale;
        }
        return out;
    }

    /** A(kx) of the class comment; 0 for components that do not travel forward along the beam. */
    static double weight(Spec b, double k, double kx) {
        if (!(Math.abs(kx) < k)) {
            return 0;
        }
        double psi = Math.asin(kx / k) - b.angle();
        double ks = k * Math.sin(psi);
        double ku = k * Math.cos(psi);
        double ky = Math.sqrt(k * k - kx * kx);
        double g = Math.exp(-ks * ks * b.waist() * b.waist() / 4);
        if (ku <= 0 || ky < 1e-9 * k || g < NEGLIGIBLE) {
            return 0;
        }
        return g * ku / ky;
    }
}

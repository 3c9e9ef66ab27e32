package org.evanesce.io.run;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.evanesce.io.casefile.model.FluxSpec;
import org.evanesce.io.output.image.LinePlot;
import org.evanesce.io.plan.FluxPlan;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.record.BeamProfile;
import org.evanesce.solver.reference.AngularSpectrum;
import org.evanesce.solver.reference.PlanarStack;

/**
 * The beam profiles of a beam case as PNG plots, one per flux line: the simulated flux density
 * across the line (the scattered part for a reflected line), each normalised to its peak, and,
 * with a reference, the angular-spectrum profile of the same beam through the stack under it,
 * carried from the interface to the line along the specular (reflected lines) or refracted
 * (transmitted lines) direction: a geometric move for the eye, without the diffraction over that
 * distance. Lines that see less than {@link FluxResults#MIN_BEAM_POWER} of the incident power are not
 * drawn. {@code beam-incident.png} shows the incident beam on the incident-power run's incident line.
 */
public final class BeamPlots {

    private BeamPlots() {
    }

    /**
     * Writes {@code beam-NAME.png} into {@code dir} for each line, at frequency number q.
     *
     * @return the number of files written
     */
    public static int write(FluxPlan plan, Polarization pol, int q, Path dir) throws IOException {
        if (plan.beam().isEmpty()) {
            return 0;
        }
        double dx = plan.cellSize();
        double wl = plan.wavelength(q);
        AngularSpectrum.Result as = null;
        if (plan.exact().isPresent()) {
            PlanarStack stack = plan.exact().get().stack().apply(wl);
            AngularSpectrum.Converged reference = BeamReference.of(plan, stack, pol, wl);
            as = reference.converged() ? reference.result() : null; // a reference that did not converge is not drawn
        }
        int written = 0;
        double incident = Math.abs(plan.incident().flux(q, dx));
        for (FluxPlan.Line l : plan.lines()) {
            boolean t = l.spec().measures().value() == FluxSpec.Measure.TRANSMITTED;
            BeamProfile p = BeamProfile.of(l.run(), t ? null : l.reference(), q, dx, plan.gridX0());
            if (!(Math.abs(p.total()) > FluxResults.MIN_BEAM_POWER * incident)) {
                continue; // next to no power crosses this line (an evanescent tail): no beam to draw
            }
            double[] x = p.x().clone();
            double[] y = normalised(p.weight());
            for (int k = 0; k < x.length; k++) {
                x[k] *= 1e6;
            }
            String name = l.spec().name().value();
            LinePlot.Builder b = LinePlot.builder()
                    .title(String.format(Locale.ROOT, "%s line '%s' at y = %.4g um, %.1f nm", t ? "transmitted" : "reflected",
                            name, l.y() * 1e6, wl * 1e9))
                    .xTitle("x (um)").yTitle("flux density (peak = 1)")
                    .series("simulated", x, y, LinePlot.Style.LINES);
            if (as != null) {
                double interfaceY = plan.exact().get().firstInterface();
                double hit = BeamReference.specular(plan, interfaceY);
                double shift;
                double[] u;
                if (t) {
                    // the transmitted profile on the last interface, carried to the line along the refracted axis
                    PlanarStack stack = plan.exact().get().stack().apply(wl);
                    double sinT = plan.mediumIndex() * Math.sin(plan.angle(q)) / stack.exitIndex().re();
                    double thickness = stack.layers().stream().mapToDouble(PlanarStack.Layer::thickness).sum();
                    double lastInterface = interfaceY + plan.direction() * thickness;
                    shift = Math.abs(sinT) < 1 ? Math.abs(l.y() - lastInterface) * sinT / Math.sqrt(1 - sinT * sinT) : Double.NaN;
                    u = as.transmitted();
                } else {
                    // the reflected profile on the interface, moved to the line along the specular direction
                    shift = BeamReference.specular(plan, l.y()) - hit;
                    u = as.reflected();
                }
                if (Double.isFinite(shift)) {
                    // only the part over the plotted line: a converged window may be millimetres wide
                    double[] all = new double[as.samples()];
                    double peak = 0;
                    for (int j = 0; j < all.length; j++) {
                        all[j] = u[2 * j] * u[2 * j] + u[2 * j + 1] * u[2 * j + 1];
                        peak = Math.max(peak, all[j]);
                    }
                    List<double[]> kept = new ArrayList<>();
                    for (int j = 0; j < all.length; j++) {
                        double xj = (hit + shift + as.x(j)) * 1e6;
                        if (xj >= x[0] && xj <= x[x.length - 1]) {
                            kept.add(new double[] {xj, peak > 0 ? all[j] / peak : 0});
                        }
                    }
                    double[] rx = kept.stream().mapToDouble(p2 -> p2[0]).toArray();
                    double[] ry = kept.stream().mapToDouble(p2 -> p2[1]).toArray();
                    if (rx.length > 1) {
                        b.series("angular spectrum (no edges)", rx, ry, LinePlot.Style.LINES);
                    }
                }
            }
            double span = x[x.length - 1] - x[0];
            b.xRange(x[0], x[0] + span);
            b.build().writePng(dir.resolve("beam-" + name + ".png"));
            written++;
        }
        BeamProfile in = BeamProfile.of(plan.incident(), q, dx, plan.gridX0());
        double[] ix = in.x().clone();
        for (int k = 0; k < ix.length; k++) {
            ix[k] *= 1e6;
        }
        LinePlot.builder().title(String.format(Locale.ROOT, "incident beam at y = %.4g um (incident-power run), %.1f nm",
                        plan.incidentY() * 1e6, wl * 1e9))
                .xTitle("x (um)").yTitle("flux density (peak = 1)")
                .series("simulated", ix, normalised(in.weight()), LinePlot.Style.LINES)
                .xRange(ix[0], ix[ix.length - 1]).build().writePng(dir.resolve("beam-incident.png"));
        return written + 1;
    }

    private static double[] normalised(double[] v) {
        double peak = 0;
        for (double a : v) {
            peak = Math.max(peak, Math.abs(a));
        }
        double[] out = new double[v.length];
        for (int k = 0; k < v.length; k++) {
            out[k] = peak > 0 ? Math.abs(v[k]) / peak : 0;
        }
        return out;
    }
}

package org.evanesce.io.run;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Locale;
import org.evanesce.geometry.Complex;
import org.evanesce.io.casefile.model.FluxSpec;
import org.evanesce.io.output.image.LinePlot;
import org.evanesce.io.plan.FluxPlan;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.record.BeamProfile;
import org.evanesce.solver.reference.AngularSpectrum;
import org.evanesce.solver.reference.PlanarStack;

/**
 * The beam profiles of a beam case as PNG plots, one per flux line: the simulated flux density across the line
 * (the scattered part for a reflected line) divided by the incident beam's peak flux density on the incident
 * line of the incident-power run, so that a loss shows. With a reference, the angular-spectrum profile of the
 * same beam through the stack under it: on a reflected line its own flux density there (each plane wave carried
 * from the interface to the line, so the beam's diffraction and a changed mean direction are included) over its
 * incident beam's peak flux density on the first interface; on a transmitted line the profile on the last
 * interface (|U|² times the exit medium's Re Q over the incidence medium's at the beam's central angle, over the
 * incident beam's peak |U|²) carried to the line along the refracted direction, a geometric move for the eye
 * without the diffraction over that distance; and their difference,
 * simulated − reference. The x range is the beam's centroid ± {@link BeamSeries#HALF_WIDTHS} of its 1/e²
 * half-widths on that line, clipped to the line ({@link BeamSeries}). Lines that see less than
 * {@link FluxResults#MIN_BEAM_POWER} of the incident power are not drawn. {@code beam-incident.png} shows the
 * incident beam on the incident-power run's incident line, on the same scale (peak 1).
 */
public final class BeamPlots {

    /** The y axis title: every curve is divided by the incident beam's peak flux density on the incident line. */
    static final String Y_TITLE = "flux density / incident beam's peak";

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
        double wl = plan.wavelength(q);
        return write(plan, pol, q, dir, plan.exact().isPresent()
                ? BeamReference.of(plan, plan.exact().get().stack().apply(wl), pol, wl) : null);
    }

    /** The same with the beam's references already computed (as for flux.csv). */
    public static int write(FluxPlan plan, Polarization pol, int q, Path dir, BeamReferences references) throws IOException {
        return write(plan, pol, q, dir, references.at(q));
    }

    /** The same with the beam's reference at frequency q, or null without an exact stack. */
    private static int write(FluxPlan plan, Polarization pol, int q, Path dir, AngularSpectrum.Converged reference)
            throws IOException {
        if (plan.beam().isEmpty()) {
            return 0;
        }
        double dx = plan.cellSize();
        double wl = plan.wavelength(q);
        AngularSpectrum.Result as = null;
        if (plan.exact().isPresent() && reference != null) {
            as = reference.converged() ? reference.result() : null; // a reference that did not converge is not drawn
        }
        int written = 0;
        double incident = Math.abs(plan.incident().flux(q, dx));
        BeamProfile in = BeamProfile.of(plan.incident(), q, dx, plan.gridX0());
        double incidentPeak = peak(in.weight());
        double refIncidentPeak = 0;
        if (as != null) {
            double[] u = as.incident();
            for (int j = 0; j < as.samples(); j++) {
                refIncidentPeak = Math.max(refIncidentPeak, u[2 * j] * u[2 * j] + u[2 * j + 1] * u[2 * j + 1]);
            }
        }
        for (FluxPlan.Line l : plan.lines()) {
            boolean t = l.spec().measures().value() == FluxSpec.Measure.TRANSMITTED;
            BeamProfile p = BeamProfile.of(l.run(), t ? null : l.reference(), q, dx, plan.gridX0());
            if (!(Math.abs(p.total()) > FluxResults.MIN_BEAM_POWER * incident) || !(incidentPeak > 0)) {
                continue; // next to no power crosses this line (an evanescent tail): no beam to draw
            }
            double[] refX = null;
            double[] refY = null;
            if (as != null && refIncidentPeak > 0) {
                double interfaceY = plan.exact().get().firstInterface();
                double hit = BeamReference.specular(plan, interfaceY);
                double shift;
                double[] u;
                double admittanceRatio = 1; // the flux density per |U|^2 on the line over that in the incidence medium
                if (t) {
                    // the transmitted profile on the last interface, carried to the line along the refracted axis
                    PlanarStack stack = plan.exact().get().stack().apply(wl);
                    double sinI = plan.mediumIndex() * Math.sin(plan.angle(q));
                    double sinT = sinI / stack.exitIndex().re();
                    double thickness = stack.layers().stream().mapToDouble(PlanarStack.Layer::thickness).sum();
                    double lastInterface = interfaceY + plan.direction() * thickness;
                    shift = Math.abs(sinT) < 1 ? Math.abs(l.y() - lastInterface) * sinT / Math.sqrt(1 - sinT * sinT) : Double.NaN;
                    u = as.transmitted();
                    admittanceRatio = admittance(pol, stack.exitIndex(), sinI).re()
                            / admittance(pol, Complex.real(plan.mediumIndex()), sinI).re();
                } else {
                    // the reflected beam's own flux density on the line (each plane wave carried there), over the
                    // incident beam's peak flux density on the interface: the profile whose centroid is the
                    // reference's shift (BeamReference.reflectedShift), diffraction over the distance included
                    PlanarStack stack = plan.exact().get().stack().apply(wl);
                    AngularSpectrum.GaussianBeam beam = BeamReference.beam(plan, wl);
                    // from the spectra the reference kept: no second pass through the stack
                    double[] line = AngularSpectrum.fluxDensity(stack, pol, beam, reference,
                            Math.abs(interfaceY - l.y()), false);
                    double incidentPeakFlux = peak(AngularSpectrum.fluxDensity(stack, pol, beam, reference, 0, true));
                    if (incidentPeakFlux > 0) {
                        refX = new double[as.samples()];
                        refY = new double[as.samples()];
                        for (int j = 0; j < refX.length; j++) {
                            refX[j] = hit + as.x(j);
                            refY[j] = line[j] / incidentPeakFlux;
                        }
                    }
                    shift = Double.NaN; // drawn above
                    u = null;
                }
                if (Double.isFinite(shift) && Double.isFinite(admittanceRatio)) {
                    refX = new double[as.samples()];
                    refY = new double[as.samples()];
                    for (int j = 0; j < refX.length; j++) {
                        refX[j] = hit + shift + as.x(j);
                        refY[j] = admittanceRatio * (u[2 * j] * u[2 * j] + u[2 * j + 1] * u[2 * j + 1]) / refIncidentPeak;
                    }
                }
            }
            BeamSeries s = BeamSeries.of(p.x(), p.weight(), incidentPeak, p.centroid(), p.width(), refX, refY);
            String name = l.spec().name().value();
            LinePlot.Builder b = LinePlot.builder()
                    .title(String.format(Locale.ROOT, "%s line '%s' at y = %.4g um, %.1f nm", t ? "transmitted" : "reflected",
                            name, l.y() * 1e6, wl * 1e9))
                    .xTitle("x (um)").yTitle(Y_TITLE)
                    .series("simulated", s.x(), s.simulated(), LinePlot.Style.LINES);
            if (s.referenceX().length > 1) {
                b.series("angular spectrum (no edges)", s.referenceX(), s.reference(), LinePlot.Style.LINES);
            }
            if (s.differenceX().length > 1) {
                b.series("simulated - angular spectrum", s.differenceX(), s.difference(), LinePlot.Style.LINES);
            }
            b.xRange(s.low(), s.high());
            b.build().writePng(dir.resolve("beam-" + name + ".png"));
            written++;
        }
        if (!(incidentPeak > 0)) {
            return written;
        }
        BeamSeries s = BeamSeries.of(in.x(), in.weight(), incidentPeak, in.centroid(), in.width(), null, null);
        LinePlot.builder().title(String.format(Locale.ROOT, "incident beam on the incident line, y = %.4g um, %.1f nm",
                        plan.incidentY() * 1e6, wl * 1e9))
                .xTitle("x (um)").yTitle(Y_TITLE)
                .series("simulated", s.x(), s.simulated(), LinePlot.Style.LINES)
                .xRange(s.low(), s.high()).build().writePng(dir.resolve("beam-incident.png"));
        return written + 1;
    }

    /** The largest |v|. */
    static double peak(double[] v) {
        double peak = 0;
        for (double a : v) {
            peak = Math.max(peak, Math.abs(a));
        }
        return peak;
    }

    /**
     * The stack's admittance Q of a plane wave with n1 sin θ = {@code sinI} in a medium of index n: kz/k0 for s,
     * kz/(k0 n²) for p (the flux density per |U|² is proportional to Re Q; see {@link AngularSpectrum}).
     */
    static Complex admittance(Polarization pol, Complex n, double sinI) {
        Complex kz = n.square().minus(sinI * sinI).sqrtUpper();
        return pol == Polarization.S ? kz : kz.divide(n.square());
    }
}

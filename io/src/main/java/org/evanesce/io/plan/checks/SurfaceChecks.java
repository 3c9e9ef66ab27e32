package org.evanesce.io.plan.checks;

import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.model.MaterialSpec;
import org.evanesce.io.casefile.model.Point;
import org.evanesce.io.casefile.model.SourceSpec;
import org.evanesce.io.casefile.model.SurfacesSpec;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;

import java.util.Locale;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Units;

/**
 * Checks of the {@code surfaces} section against the rest of the case: the normalisation matches the sources, every
 * surface lies inside the interior (outside the PMLs), a far-field contour lies in one transparent material, an exit
 * spectrum's line lies in one transparent material that it samples finely enough for every propagating plane wave.
 */
final class SurfaceChecks {

    /** Points per cell at which a contour or line is sampled when checking that it lies in one material. */
    static final int SAMPLES_PER_CELL = 2;

    private final CaseSpec spec;
    private final CaseChecks checks;

    SurfaceChecks(CaseSpec spec, CaseChecks checks) {
        this.spec = spec;
        this.checks = checks;
    }

    private static String fmt(double metres) {
        return Units.format(metres, Dimension.LENGTH);
    }

    void run() {
        SurfacesSpec s = spec.surfaces().orElse(null);
        if (s == null) {
            return;
        }
        normalisation(s);
        double[] in = checks.interior();
        double tol = 1e-6 * checks.cell();
        for (int k = 0; k < s.segments().size(); k++) {
            SurfacesSpec.Segment g = s.segments().get(k);
            inside(in, tol, "surfaces.segments[" + k + "]", g.from(), g.to());
        }
        for (int k = 0; k < s.boxes().size(); k++) {
            SurfacesSpec.Box b = s.boxes().get(k);
            inside(in, tol, "surfaces.boxes[" + k + "]", b.from(), b.to());
        }
        for (int k = 0; k < s.farFields().size(); k++) {
            SurfacesSpec.FarField f = s.farFields().get(k);
            String path = "surfaces.far_field[" + k + "]";
            if (inside(in, tol, path, f.from(), f.to())) {
                contourMedium(f, path);
            }
        }
        for (int k = 0; k < s.exitSpectra().size(); k++) {
            exitLine(s, s.exitSpectra().get(k), "surfaces.exit_spectra[" + k + "]", in, tol);
        }
    }

    private void normalisation(SurfacesSpec s) {
        boolean launched = spec.sources().stream().anyMatch(x -> x instanceof SourceSpec.Launched);
        boolean local = spec.sources().stream().anyMatch(x -> !(x instanceof SourceSpec.Launched));
        SurfacesSpec.Normalise n = s.normalise().value();
        long boxes = spec.sources().stream().filter(x -> x instanceof SourceSpec.PlaneWaveBox).count();
        if (boxes > 0) {
            if (n == SurfacesSpec.Normalise.SOURCE) {
                // the box's wave gives out no net power of its own, so a 'source' norm would divide by about zero
                checks.error(s.normalise().at(), "surfaces.normalise", "'source' divides by the power point and line "
                        + "sources radiate, and a plane_wave_box gives out none of its own; expected incident (powers over "
                        + "the incident intensity: widths in metres) or absolute");
            } else if (n == SurfacesSpec.Normalise.INCIDENT && spec.sources().size() != 1) {
                checks.error(s.normalise().at(), "surfaces.normalise", "'incident' with a plane_wave_box divides by the "
                        + "intensity of its wave, which must then be the case's only source; expected absolute");
            }
            return;
        }
        if (n == SurfacesSpec.Normalise.INCIDENT && (!launched || local)) {
            checks.error(s.normalise().at(), "surfaces.normalise", "'incident' divides by the incident power of a plane wave or "
                    + "Gaussian beam that is the case's only source; " + (launched ? "this case also has point or line "
                    + "sources" : "this case has none") + "; expected source or absolute");
        }
        if (n == SurfacesSpec.Normalise.SOURCE && launched) {
            checks.error(s.normalise().at(), "surfaces.normalise", "'source' divides by the power point and line sources "
                    + "radiate; a plane wave or Gaussian beam is measured by its incident power; expected incident or absolute");
        }
    }

    /** Whether the rectangle (or segment) spanned by a and b lies inside the interior; an error when not. */
    private boolean inside(double[] in, double tol, String path, Point a, Point b) {
        double x0 = Math.min(a.x().si(), b.x().si());
        double x1 = Math.max(a.x().si(), b.x().si());
        double y0 = Math.min(a.y().si(), b.y().si());
        double y1 = Math.max(a.y().si(), b.y().si());
        if (x0 < in[0] - tol || x1 > in[2] + tol || y0 < in[1] - tol || y1 > in[3] + tol) {
            checks.error(a.at(), path, String.format("spans x from %s to %s and y from %s to %s, which reaches outside the "
                    + "interior between the PMLs (x from %s to %s, y from %s to %s): power measured in an absorbing layer "
                    + "means nothing; move it inside", fmt(x0), fmt(x1), fmt(y0), fmt(y1), fmt(in[0]), fmt(in[2]), fmt(in[1]),
                    fmt(in[3])));
            return false;
        }
        return true;
    }

    private String materialAt(double x, double y) {
        return spec.materialAt(x, y);
    }

    private MaterialSpec material(String name) {
        return spec.materials().get(name);
    }

    /** Every point of the contour in one material without conductivity. */
    private void contourMedium(SurfacesSpec.FarField f, String path) {
        double x0 = f.from().x().si();
        double y0 = f.from().y().si();
        double x1 = f.to().x().si();
        double y1 = f.to().y().si();
        double step = checks.cell() / SAMPLES_PER_CELL;
        String first = materialAt(x0, y0);
        int nx = (int) Math.ceil((x1 - x0) / step);
        int ny = (int) Math.ceil((y1 - y0) / step);
        for (int t = 0; t <= Math.max(nx, ny); t++) {
            double[][] pts = {{x0 + Math.min(t, nx) * (x1 - x0) / nx, y0}, {x0 + Math.min(t, nx) * (x1 - x0) / nx, y1},
                {x0, y0 + Math.min(t, ny) * (y1 - y0) / ny}, {x1, y0 + Math.min(t, ny) * (y1 - y0) / ny}};
            for (double[] q : pts) {
                String m = materialAt(q[0], q[1]);
                if (!m.equals(first)) {
                    checks.error(f.at(), path, String.format("a far-field contour lies in one homogeneous medium round "
                            + "everything that radiates; it meets %s at (%s, %s) and %s at (%s, %s); enlarge or move it",
                            first, fmt(x0), fmt(y0), m, fmt(q[0]), fmt(q[1])));
                    return;
                }
            }
        }
        transparent(first, f.at(), path, "a far-field contour");
    }

    private void transparent(String name, SourcePosition at, String path, String what) {
        MaterialSpec m = material(name);
        if (m != null && m.conductivity().si() != 0) {
            checks.error(at, path, String.format("%s needs a lossless medium, but %s %s", what, name, m.isPerfectConductor()
                    ? "is a perfect conductor" : "has a conductivity of " + Units.number(m.conductivity().si()) + " S/m"));
        }
    }

    private void exitLine(SurfacesSpec s, SurfacesSpec.ExitSpectrum e, String path, double[] in, double tol) {
        double y = e.y().si();
        if (y < in[1] - tol || y > in[3] + tol) {
            checks.error(e.y().at(), path + ".y", String.format("the line at y = %s lies outside the interior (y from %s to %s)",
                    fmt(y), fmt(in[1]), fmt(in[3])));
            return;
        }
        double step = checks.cell() / SAMPLES_PER_CELL;
        String first = materialAt(in[0], y);
        int n = (int) Math.ceil((in[2] - in[0]) / step);
        for (int t = 0; t <= n; t++) {
            double x = in[0] + t * (in[2] - in[0]) / n;
            String m = materialAt(x, y);
            if (!m.equals(first)) {
                checks.error(e.y().at(), path + ".y", String.format("an exit spectrum's line runs across the whole width in one "
                        + "medium (the exit half-space's); at y = %s it meets %s at x = %s and %s at x = %s", fmt(y), first,
                        fmt(in[0]), m, fmt(x)));
                return;
            }
        }
        transparent(first, e.y().at(), path + ".y", "an exit spectrum");
        MaterialSpec m = material(first);
        if (m == null) {
            return;
        }
        double index = m.index();
        double cell = checks.cell();
        for (Value f : s.frequencies()) {
            double wl = PhysicalConstants.C0 / f.si();
            if (cell > wl / (2 * index)) {
                checks.error(f.at(), path, String.format(Locale.ROOT, "at %s the cell (%s) is coarser than half the wavelength "
                        + "in %s (%s), so the line cannot tell every propagating direction apart; use a smaller cell or a "
                        + "longer wavelength", fmt(wl), fmt(cell), first, fmt(wl / (2 * index))));
                return;
            }
        }
        if (e.numericalAperture() != null && e.numericalAperture().si() > index) {
            checks.warn(e.numericalAperture().at(), path + ".numerical_aperture", String.format(Locale.ROOT, "a numerical "
                    + "aperture of %s exceeds the index of %s (%s): the detector collects every propagating direction",
                    Units.number(e.numericalAperture().si()), first, Units.number(index)));
        }
    }
}

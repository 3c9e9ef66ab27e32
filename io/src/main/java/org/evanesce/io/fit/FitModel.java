package org.evanesce.io.fit;

import java.io.IOException;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.evanesce.io.casefile.CaseFileException;
import org.evanesce.io.plan.CaseLoader;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.text.DiagnosticText;
import org.evanesce.io.casefile.model.Parameter;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.plan.ExactStack;
import org.evanesce.solver.reference.AngularSpectrum;
import org.evanesce.io.plan.PlanException;
import org.evanesce.solver.reference.PlanarStack;

/**
 * The forward model of a fit: the plane-wave response (transfer matrix; M. Born and E. Wolf,
 * <i>Principles of Optics</i>, 7th ed. (1999), §1.6) of the case's layered stack, read as
 * {@code flux.transfer_matrix} reads it, with the free parameters set on the case as
 * {@code --set} would set them. Along the curve the swept quantity is the angle of incidence (at
 * the source's wavelength), the vacuum wavelength (at the source's angle) or a case parameter (the
 * case read again for each point).
 */
final class FitModel {

    private final Path caseFile;
    private final Map<String, String> overrides;
    private final MeasuredCurve curve;
    private final List<FreeParameter> free;
    private final Dimension sweptDimension;
    private final ForwardModel kind;
    /** The angular-spectrum model's sampling per point, chosen at its first evaluation. */
    private final BeamModel.Sampling[] samplings;
    /** The simulation model, or null. */
    private final SimulationModel simulation;
    private int caseReads;

    /**
     * @param overrides the user's own --set values (kept under the free parameters')
     * @throws FitInputException when the curve's swept quantity or a free parameter does not fit the case
     */
    FitModel(Path caseFile, Map<String, String> overrides, MeasuredCurve curve, List<FreeParameter> free)
            throws IOException, FitInputException {
        this(caseFile, overrides, curve, free, ForwardModel.TRANSFER_MATRIX, null);
    }

    /**
     * @param kind       the forward model
     * @param simulation the simulation model's runner (with kind {@link ForwardModel#SIMULATION}), else null
     */
    FitModel(Path caseFile, Map<String, String> overrides, MeasuredCurve curve, List<FreeParameter> free, ForwardModel kind,
             SimulationModel simulation) throws IOException, FitInputException {
        this.kind = kind;
        this.samplings = new BeamModel.Sampling[curve.size()];
        this.simulation = simulation;
        this.caseFile = caseFile;
        this.overrides = Map.copyOf(overrides);
        this.curve = curve;
        this.free = List.copyOf(free);
        CaseSpec spec = read(overrides);
        Map<String, Parameter> params = spec.parameters();
        for (FreeParameter f : free) {
            if (f.own()) {
                if (params.containsKey(f.name())) {
                    throw new FitInputException(String.format(Locale.ROOT, "--free %s: the case has a parameter named %s, which "
                            + "is also the fit's own %s; rename the case's parameter", f.written(), f.name(), f.name()));
                }
                continue;
            }
            Parameter p = params.get(f.name());
            if (p == null) {
                throw new FitInputException(String.format(Locale.ROOT, "--free %s: %s has no parameter '%s'; its parameters are %s "
                        + "(or the fit's own angle_offset and scale)", f.written(), caseFile, f.name(), String.join(", ",
                        params.keySet())));
            }
            if (!p.value().dimension().equals(f.dimension())) {
                throw new FitInputException(String.format(Locale.ROOT, "--free %s: the bounds are %s but %s is %s (%s)", f.written(),
                        f.dimension().describe(), f.name(), p.value().dimension().describe(), p.at()));
            }
            if (curve.swept().equals(f.name())) {
                throw new FitInputException("--free " + f.written() + ": " + f.name() + " is the measured curve's swept quantity; "
                        + "it cannot also be free");
            }
        }
        String swept = curve.swept();
        if (swept.equals("angle")) {
            sweptDimension = Dimension.ANGLE;
        } else if (swept.equals("wavelength")) {
            sweptDimension = Dimension.LENGTH;
        } else {
            Parameter p = params.get(swept);
            if (p == null) {
                throw new FitInputException(String.format(Locale.ROOT, "%s: the header's swept quantity '%s' is neither angle, "
                        + "wavelength nor a parameter of %s (its parameters are %s)", curve.file(), swept,
                        caseFile, String.join(", ", params.keySet())));
            }
            if (!p.value().dimension().equals(curve.scale().dimension())) {
                throw new FitInputException(String.format(Locale.ROOT, "%s: the swept quantity '%s' is given in '%s' but the case's "
                        + "%s is %s", curve.file(), swept, curve.unit(), swept, p.value().dimension().describe()));
            }
            sweptDimension = p.value().dimension();
        }
        if (kind == ForwardModel.ANGULAR_SPECTRUM && !Double.isFinite(stack(overrides, new double[0]).waist())) {
            throw new FitInputException("--model angular-spectrum: " + caseFile + " has a plane_wave source; the angular "
                    + "spectrum needs a gaussian_beam (its waist and waist position make the beam); use --model transfer-matrix");
        }
    }

    /** The forward model. */
    ForwardModel kind() {
        return kind;
    }

    /** The case's values of the free parameters (0 for angle_offset, 1 for scale): where the fit starts. */
    double[] start() throws IOException, FitInputException {
        Map<String, Parameter> params = read(overrides).parameters();
        double[] p = new double[free.size()];
        for (int k = 0; k < p.length; k++) {
            FreeParameter f = free.get(k);
            p[k] = f.name().equals(FreeParameter.SCALE) ? 1 : f.own() ? 0 : params.get(f.name()).value().value();
        }
        return p;
    }

    /** The model's R or T at every point of the curve for the free parameters' values (SI). */
    double[] values(double[] p) throws IOException, FitInputException {
        Map<String, String> set = new LinkedHashMap<>(overrides);
        double offset = 0;
        double scale = 1;
        for (int k = 0; k < p.length; k++) {
            FreeParameter f = free.get(k);
            if (f.name().equals(FreeParameter.ANGLE_OFFSET)) {
                offset = p[k];
            } else if (f.name().equals(FreeParameter.SCALE)) {
                scale = p[k];
            } else {
                set.put(f.name(), f.override(p[k]));
            }
        }
        if (kind == ForwardModel.SIMULATION) {
            double[] v = simulation.values(set, curve, sweptDimension, offset);
            for (int i = 0; i < v.length; i++) {
                v[i] *= scale;
            }
            return v;
        }
        double[] out = new double[curve.size()];
        boolean perPoint = !curve.swept().equals("angle") && !curve.swept().equals("wavelength");
        ExactStack stack = perPoint ? null : stack(set, p);
        for (int i = 0; i < out.length; i++) {
            double x = curve.x()[i];
            if (perPoint) {
                set.put(curve.swept(), org.evanesce.io.casefile.expr.Units.override(x, sweptDimension));
                stack = stack(set, p);
            }
            double wavelength = curve.swept().equals("wavelength") ? x : stack.wavelength();
            double angle = (curve.swept().equals("angle") ? x : stack.angle()) + offset;
            double[] rt;
            try {
                PlanarStack st = stack.stack().apply(wavelength);
                if (kind == ForwardModel.ANGULAR_SPECTRUM) {
                    AngularSpectrum.GaussianBeam beam = new AngularSpectrum.GaussianBeam(stack.waist(), angle, wavelength,
                            stack.waistDistance());
                    if (samplings[i] == null) {
                        samplings[i] = BeamModel.sampling(st, stack.polarization(), beam);
                    }
                    rt = BeamModel.response(st, stack.polarization(), beam, samplings[i]);
                } else {
                    PlanarStack.Response r = st.atAngle(stack.polarization(), wavelength, angle);
                    rt = new double[] {r.reflectance(), r.transmittance()};
                }
            } catch (IllegalArgumentException e) {
                throw new FitInputException(String.format(Locale.ROOT, "%s:%d: the model cannot be evaluated at this point with %s: "
                        + "%s", curve.file(), curve.lines()[i], describe(p), e.getMessage()));
            }
            out[i] = scale * (curve.measured() == MeasuredCurve.Measured.R ? rt[0] : rt[1]);
        }
        return out;
    }

    /** For the simulation model: how many runs were made now and how many taken from the cache; else null. */
    String simulations() {
        return simulation == null ? null : String.format(Locale.ROOT, "%d simulation(s) run, %d taken from the cache",
                simulation.runs(), simulation.reused());
    }

    /** How often the case was read (for the report). */
    int caseReads() {
        return caseReads;
    }

    /** The free parameters' values as a reader would write them. */
    String describe(double[] p) {
        StringBuilder sb = new StringBuilder();
        for (int k = 0; k < p.length; k++) {
            sb.append(k == 0 ? "" : ", ").append(free.get(k).name()).append(" = ")
                    .append(org.evanesce.io.casefile.expr.Units.format(p[k], free.get(k).dimension()));
        }
        return sb.toString();
    }

    private ExactStack stack(Map<String, String> set, double[] p) throws IOException, FitInputException {
        try {
            return ExactStack.of(read(set));
        } catch (PlanException e) {
            throw new FitInputException(DiagnosticText.lines(e.diagnostics()) + "\n(with " + describe(p) + ")");
        }
    }

    private CaseSpec read(Map<String, String> set) throws IOException, FitInputException {
        caseReads++;
        try {
            return CaseLoader.read(caseFile, set).spec();
        } catch (CaseFileException e) {
            throw FitInputException.ofCase(e.errors(), set);
        }
    }
}

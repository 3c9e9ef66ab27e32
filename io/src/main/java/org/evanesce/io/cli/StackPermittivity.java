package org.evanesce.io.cli;

import java.util.List;
import java.util.Locale;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Quantity;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.io.casefile.model.FluxSpec.ReferencePermittivity;
import org.evanesce.solver.grid.Courant;
import picocli.CommandLine.ITypeConverter;
import picocli.CommandLine.TypeConversionException;

/**
 * Which permittivity {@code evanesce stack} gives a metal: the model's continuous ε(ω), or the discrete
 * ε_d(ω, Δt) = ε((2/Δt) tan(ωΔt/2)) a run's time stepping realises at time step Δt
 * ({@code DispersiveMaterial.discretePermittivity}), with where Δt came from. Other media are the same either way.
 *
 * @param kind     continuous or discrete
 * @param timeStep Δt, s, for the discrete permittivity (0 for the continuous one)
 * @param origin   where Δt came from, for people, e.g. {@code the case's grid: cell 5 nm, Courant number 0.5}
 */
record StackPermittivity(ReferencePermittivity kind, double timeStep, String origin) {

    /** The model's ε(ω): the default. */
    static final StackPermittivity CONTINUOUS = new StackPermittivity(ReferencePermittivity.CONTINUOUS, 0, "");

    /**
     * The choice of the options: {@code --permittivity} with, for the discrete one, {@code --time-step} or
     * {@code --cell} and {@code --courant} (default: the program's, as a case without {@code numerics.courant}).
     *
     * @param kind     {@code --permittivity}, or null (continuous)
     * @param timeStep {@code --time-step}, s, or null
     * @param cell     {@code --cell}, m, or null
     * @param courant  {@code --courant}, or null
     * @param fromCase whether {@code --case} gives the stack (and so the time step)
     * @return the choice; null for the discrete one with {@code --case}, whose grid gives the time step
     * @throws IllegalArgumentException with the message for the user when the options do not fit together
     */
    static StackPermittivity ofOptions(ReferencePermittivity kind, Double timeStep, Double cell, Double courant,
                                       boolean fromCase) {
        boolean grid = timeStep != null || cell != null || courant != null;
        if (fromCase && grid) {
            throw new IllegalArgumentException("--case gives the time step (the case's cell size and Courant number); leave "
                    + "out --time-step, --cell and --courant, or override the case's parameters with --set");
        }
        if (kind != ReferencePermittivity.DISCRETE) {
            if (grid) {
                throw new IllegalArgumentException("--time-step, --cell and --courant set the time step of the discrete "
                        + "permittivity; add --permittivity discrete (the default is the model's continuous permittivity)");
            }
            return CONTINUOUS;
        }
        if (fromCase) {
            return null;
        }
        if (timeStep != null && (cell != null || courant != null)) {
            throw new IllegalArgumentException("give either --time-step or --cell (with --courant), not both");
        }
        if (timeStep == null && cell == null) {
            throw new IllegalArgumentException("--permittivity discrete needs the run's time step: give --time-step "
                    + "(e.g. 0.00834fs), or --cell (e.g. 5nm) with --courant (default " + Units.number(Courant.DEFAULT)
                    + ", the program's), or --case FILE");
        }
        if (timeStep != null) {
            return new StackPermittivity(ReferencePermittivity.DISCRETE, timeStep, "--time-step");
        }
        if (courant == null) {
            return ofGrid(cell, Courant.DEFAULT, "--cell " + Units.format(cell, Dimension.LENGTH)
                    + ", the program's default Courant number " + Units.number(Courant.DEFAULT));
        }
        if (!(courant > 0 && courant < Courant.LIMIT_2D)) {
            throw new IllegalArgumentException(String.format(Locale.ROOT, "--courant %s: expected a Courant number c0*dt/cell "
                    + "between 0 and 1/sqrt(2) = %.6f, the 2D Yee limit", Units.number(courant), Courant.LIMIT_2D));
        }
        return ofGrid(cell, courant, "--cell " + Units.format(cell, Dimension.LENGTH) + ", --courant "
                + Units.number(courant));
    }

    /** The discrete permittivity at the time step Δt = SΔ/c0 of a grid, as the planner sets it. */
    static StackPermittivity ofGrid(double cellSize, double courant, String origin) {
        return new StackPermittivity(ReferencePermittivity.DISCRETE, Courant.timeStep(courant, cellSize), origin);
    }

    /** Δt for the metals' permittivity: the time step for the discrete one, 0 for the continuous one. */
    double metalTimeStep() {
        return kind == ReferencePermittivity.DISCRETE ? timeStep : 0;
    }

    /**
     * Refuses a time step at or beyond the grid's Nyquist limit at any of the wavelengths (ωΔt ≥ π, where the
     * discrete permittivity is not defined).
     *
     * @throws IllegalArgumentException with the message for the user
     */
    void checkNyquist(List<Double> wavelengths) {
        if (kind != ReferencePermittivity.DISCRETE) {
            return;
        }
        for (double w : wavelengths) {
            double omega = 2 * Math.PI * PhysicalConstants.C0 / w;
            if (!(omega * timeStep < Math.PI)) {
                throw new IllegalArgumentException(String.format(Locale.ROOT, "time step %s (%s) is too long for %s: the "
                        + "discrete permittivity needs omega*dt < pi (below the grid's Nyquist frequency), i.e. a time step "
                        + "below half a period, %s", Units.format(timeStep, Dimension.TIME), origin,
                        Units.format(w, Dimension.LENGTH), Units.format(w / (2 * PhysicalConstants.C0), Dimension.TIME)));
            }
        }
    }

    /** The line saying which permittivity was used; {@code hasMetal}: whether the stack has a dispersive medium. */
    String line(boolean hasMetal) {
        if (kind == ReferencePermittivity.CONTINUOUS) {
            return "permittivity: continuous, each metal's model ε(ω) (--permittivity discrete gives what a run's "
                    + "time stepping realises)";
        }
        return "permittivity: discrete, each metal's ε_d(ω, Δt) = ε((2/Δt) tan(ωΔt/2)), what a run's time "
                + "stepping realises, at Δt = " + Units.format(timeStep, Dimension.TIME) + " (" + origin + ")"
                + (hasMetal ? "" : "; the stack has no metal, so every number is the continuous one");
    }

    /** {@code --permittivity continuous|discrete}. */
    static final class KindConverter implements ITypeConverter<ReferencePermittivity> {
        @Override
        public ReferencePermittivity convert(String value) {
            for (ReferencePermittivity p : ReferencePermittivity.values()) {
                if (p.caseName().equalsIgnoreCase(value.strip())) {
                    return p;
                }
            }
            throw new TypeConversionException("'" + value + "': expected continuous (the model's permittivity) or "
                    + "discrete (what a run's time stepping realises)");
        }
    }

    /** {@code --time-step}: a time with a unit (fs, ps, ns, s), finite and &gt; 0; seconds. */
    static final class TimeConverter implements ITypeConverter<Double> {
        @Override
        public Double convert(String value) {
            Quantity q = Units.parse(value).orElse(null);
            if (q == null || !q.dimension().equals(Dimension.TIME) || !(q.value() > 0) || Double.isInfinite(q.value())) {
                throw new TypeConversionException("'" + value + "' is not a time step; expected a time > 0 with a unit "
                        + "(fs, ps, ns, s), e.g. 0.00834fs");
            }
            return q.value();
        }
    }

    /** {@code --cell}: a length with a unit, finite and &gt; 0; metres. */
    static final class CellConverter implements ITypeConverter<Double> {
        @Override
        public Double convert(String value) {
            double v = StackCommand.parseLength(value);
            if (!(v > 0)) {
                throw new TypeConversionException("'" + value + "': expected a cell size > 0 with a unit, e.g. 5nm");
            }
            return v;
        }
    }

    /** {@code --courant}: a plain number. */
    static final class NumberConverter implements ITypeConverter<Double> {
        @Override
        public Double convert(String value) {
            try {
                double v = Double.parseDouble(value.strip());
                if (Double.isFinite(v)) {
                    return v;
                }
            } catch (NumberFormatException e) {
                // the message below
            }
            throw new TypeConversionException("'" + value + "' is not a number; expected a Courant number c0*dt/cell, "
                    + "e.g. 0.5");
        }
    }
}

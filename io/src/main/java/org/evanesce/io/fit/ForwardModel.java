package org.evanesce.io.fit;

import java.util.Locale;

/** The forward models a fit may use, by the names {@code --model} takes. */
public enum ForwardModel {
    /** The plane-wave response of the case's layered stack (characteristic matrix). */
    TRANSFER_MATRIX("transfer-matrix", "transfer matrix: the plane-wave response of the case's layered stack (Born & Wolf, "
            + "Principles of Optics, 7th ed., section 1.6)", CurveFit.STEP),
    /** The case's Gaussian beam through its layered stack by its angular spectrum. */
    ANGULAR_SPECTRUM("angular-spectrum", "angular spectrum: the case's Gaussian beam (its waist and waist position) "
            + "through the case's layered stack, each plane-wave component by the transfer matrix (no edges; "
            + "the sampling fixed at the start so that the model is smooth in the parameters)", CurveFit.STEP),
    /**
     * The whole simulation of the case at each point. Its values carry the grid's round-off, so the
     * derivatives take steps of 1e-3 of the bounds' span, where the change of R or T (about 1e-3 of its
     * range) stands far above a float run's round-off (about 1e-6; common practice).
     */
    SIMULATION("simulation", "simulation: the case run in full (its flux lines' R or T at the point's wavelength) for each "
            + "point and trial parameter set, each run's flux table cached by its overrides in FOLDER.evaluations beside the "
            + "results folder (so that an interrupted fit resumes)", 1e-3);

    /** The name {@code --model} takes. */
    public final String option;
    /** In words, for fit.json and the console. */
    public final String description;
    /** The central differences' step, in units of the bounds' span. */
    final double step;

    ForwardModel(String option, String description, double step) {
        this.option = option;
        this.description = description;
        this.step = step;
    }

    /**
     * The model named {@code text}.
     *
     * @throws FitInputException naming the choices
     */
    public static ForwardModel of(String text) throws FitInputException {
        for (ForwardModel m : values()) {
            if (m.option.equals(text.strip().toLowerCase(Locale.ROOT))) {
                return m;
            }
        }
        throw new FitInputException("--model " + text + ": expected transfer-matrix, angular-spectrum or simulation");
    }
}

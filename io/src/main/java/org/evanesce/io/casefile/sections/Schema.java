package org.evanesce.io.casefile.sections;

import java.util.List;
import java.util.Map;

/**
 * The keys each section of a case file accepts. The reader refuses any other key, and
 * {@code docs/case-file.md} has one table per section with exactly these keys (a test compares
 * them), so the reference cannot drift from what the reader accepts.
 *
 * <p>Section ids are the headings of the reference: a key path with {@code []} for "each entry
 * of a list" and {@code NAME} for a name the user chooses.
 */
final class Schema {

    /**
     * One section of the file: a mapping with a fixed set of keys.
     *
     * @param renamed keys an earlier version of the program read here, each with the key that replaced it; the
     *                reader refuses them with that advice, so that no case file silently changes meaning
     */
    record Section(String id, List<String> keys, Map<String, Renamed> renamed) {

        Section(String id, List<String> keys) {
            this(id, keys, Map.of());
        }

        boolean accepts(String key) {
            return keys.contains(key);
        }
    }

    /**
     * A key of an earlier version and its replacement.
     *
     * @param now    the key to write instead (one of the section's keys)
     * @param advice how to write it, one clause (e.g. the new keys inside it)
     */
    record Renamed(String now, String advice) {
    }

    /** The most characters of a name that heads output columns (probes, flux lines, decay lines). */
    static final int NAME_LENGTH = 64;
    /** Such a name: letters, digits, '_', '-' and '.', at most {@link #NAME_LENGTH} of them. */
    static final String NAME = "[A-Za-z0-9_.-]{1," + NAME_LENGTH + "}";

    static final Section ROOT = new Section("(top level)", List.of("title", "parameters", "design_wavelength",
            "design_frequency", "polarization", "domain", "grid", "materials", "shapes", "boundaries", "sources",
            "probes", "flux", "surfaces", "maps", "output", "until", "numerics"),
            Map.of("resolution", new Renamed("grid", "grid: {cell: ...} or grid: {cells_per_wavelength: ...}, with the same keys"),
                    "stop", new Renamed("until", "until: {time: ...}, {steps: ...} or {energy_below: ..., latest: ...}; "
                            + "decay is now energy_below and limit is now latest")));
    static final Section DOMAIN = new Section("domain", List.of("width", "height", "background"));
    static final Section GRID = new Section("grid", List.of("cell", "cells_per_wavelength"));
    static final Section MATERIAL = new Section("materials.NAME", List.of("index", "permittivity", "library", "conductivity",
            "drude", "lorentz", "table", "fit_tolerance", "perfect_conductor"));
    static final Section DRUDE = new Section("materials.NAME.drude[]", List.of("plasma_frequency", "damping"));
    static final Section LORENTZ = new Section("materials.NAME.lorentz[]", List.of("strength", "resonance", "damping"));

    /** The kinds of shape: each list entry has one of these as its only key. */
    static final Section SHAPES = new Section("shapes[]", List.of("rectangle", "polygon", "disk", "ellipse",
            "half_plane", "layer_stack"));
    static final Section RECTANGLE = new Section("shapes[].rectangle", List.of("centre", "size", "rotation", "material"));
    static final Section POLYGON = new Section("shapes[].polygon", List.of("corners", "rotation", "pivot", "material"));
    static final Section DISK = new Section("shapes[].disk", List.of("centre", "radius", "material"));
    static final Section ELLIPSE = new Section("shapes[].ellipse", List.of("centre", "radii", "rotation", "material"));
    static final Section HALF_PLANE = new Section("shapes[].half_plane", List.of("through", "fill", "rotation", "material"));
    static final Section LAYER_STACK = new Section("shapes[].layer_stack", List.of("start", "rotation", "layers"));
    static final Section LAYER = new Section("shapes[].layer_stack.layers[]", List.of("material", "thickness"));

    static final Section BOUNDARIES = new Section("boundaries", List.of("all", "left", "right", "bottom", "top"));

    /** The kinds of source. */
    static final Section SOURCES = new Section("sources[]", List.of("point", "line", "plane_wave", "gaussian_beam",
            "plane_wave_box"));
    static final Section POINT_SOURCE = new Section("sources[].point", List.of("at", "component", "amplitude", "signal"));
    static final Section LINE_SOURCE = new Section("sources[].line", List.of("from", "to", "component", "amplitude",
            "angle", "waist", "signal"));
    static final Section PLANE_WAVE = new Section("sources[].plane_wave", List.of("y", "angle", "direction", "amplitude",
            "signal"));
    static final Section GAUSSIAN_BEAM = new Section("sources[].gaussian_beam", List.of("y", "waist", "waist_at", "angle",
            "direction", "amplitude", "signal"));

    static final Section PLANE_WAVE_BOX = new Section("sources[].plane_wave_box", List.of("from", "to", "heading",
            "reference", "amplitude", "signal"));

    /** The kinds of signal. */
    static final Section SIGNAL = new Section("signal", List.of("pulse", "ramped_wave", "gaussian_derivative"));
    static final Section PULSE = new Section("signal.pulse", List.of("wavelength", "frequency", "bandwidth"));
    static final Section RAMPED_WAVE = new Section("signal.ramped_wave", List.of("wavelength", "frequency", "ramp"));
    static final Section GAUSSIAN_DERIVATIVE = new Section("signal.gaussian_derivative", List.of("wavelength", "frequency"));

    static final Section PROBE = new Section("probes[]", List.of("name", "at", "component"));
    static final Section FLUX = new Section("flux", List.of("wavelengths", "frequencies", "lines", "transfer_matrix",
            "incident_run", "reference_permittivity"));
    static final Section WAVELENGTH_RANGE = new Section("flux.wavelengths", List.of("from", "to", "count"));
    static final Section FREQUENCY_RANGE = new Section("flux.frequencies", List.of("from", "to", "count"));
    static final Section FLUX_LINE = new Section("flux.lines[]", List.of("name", "y", "measures"));
    static final Section SURFACES = new Section("surfaces", List.of("wavelengths", "frequencies", "normalise", "segments",
            "boxes", "far_field", "exit_spectra", "incident_run"));
    static final Section SURFACE_WAVELENGTHS = new Section("surfaces.wavelengths", List.of("from", "to", "count"));
    static final Section SURFACE_FREQUENCIES = new Section("surfaces.frequencies", List.of("from", "to", "count"));
    static final Section SEGMENT = new Section("surfaces.segments[]", List.of("name", "from", "to"));
    static final Section BOX = new Section("surfaces.boxes[]", List.of("name", "from", "to"));
    static final Section FAR_FIELD = new Section("surfaces.far_field[]", List.of("name", "from", "to", "angles"));
    static final Section EXIT_SPECTRUM = new Section("surfaces.exit_spectra[]", List.of("name", "y", "towards",
            "numerical_aperture"));
    static final Section OUTPUT = new Section("output", List.of("folder", "write", "frame_interval", "frame_times",
            "components", "region"));
    static final Section REGION = new Section("output.region", List.of("from", "to"));
    static final Section MAPS = new Section("maps", List.of("wavelengths", "frequencies", "region", "log_decades", "decay",
            "normalise"));
    static final Section MAP_WAVELENGTH_RANGE = new Section("maps.wavelengths", List.of("from", "to", "count"));
    static final Section MAP_FREQUENCY_RANGE = new Section("maps.frequencies", List.of("from", "to", "count"));
    static final Section DECAY_LINE = new Section("maps.decay[]", List.of("name", "from", "to"));
    static final Section UNTIL = new Section("until", List.of("time", "steps", "energy_below", "latest"),
            Map.of("decay", new Renamed("energy_below", "energy_below: FRACTION, the same fraction of the largest field energy"),
                    "limit", new Renamed("latest", "latest: TIME, the same simulated time")));
    static final Section NUMERICS = new Section("numerics", List.of("precision", "threads", "courant",
            "dispersion_correction"));

    /**
     * The sweep: a top-level key of its own, read beside the case proper (the other commands run the
     * case as written), so it is not one of {@link #ROOT}'s keys.
     */
    static final Section SWEEP = new Section("sweep", List.of("parameters", "combine", "sample"));
    static final Section SWEEP_RANGE = new Section("sweep.parameters.NAME", List.of("from", "to", "count", "spacing"));
    static final Section SAMPLE = new Section("sweep.sample", List.of("count", "seed", "parameters", "require"));
    static final Section SAMPLE_PARAMETER = new Section("sweep.sample.parameters.NAME", List.of("distribution", "mean",
            "standard_deviation", "low", "high"));
    static final Section SAMPLE_LIMIT = new Section("sweep.sample.require.COLUMN", List.of("min", "max"));

    static final List<Section> ALL = List.of(ROOT, DOMAIN, GRID, MATERIAL, DRUDE, LORENTZ, SHAPES, RECTANGLE, POLYGON, DISK,
            ELLIPSE, HALF_PLANE, LAYER_STACK, LAYER, BOUNDARIES, SOURCES, POINT_SOURCE, LINE_SOURCE, PLANE_WAVE, GAUSSIAN_BEAM, PLANE_WAVE_BOX, SIGNAL,
            PULSE, RAMPED_WAVE, GAUSSIAN_DERIVATIVE, PROBE, FLUX, WAVELENGTH_RANGE, FREQUENCY_RANGE, FLUX_LINE, SURFACES, SURFACE_WAVELENGTHS, SURFACE_FREQUENCIES, SEGMENT, BOX, FAR_FIELD,
            EXIT_SPECTRUM, MAPS, MAP_WAVELENGTH_RANGE,
            MAP_FREQUENCY_RANGE, DECAY_LINE, OUTPUT, REGION, UNTIL,
            NUMERICS, SWEEP, SWEEP_RANGE, SAMPLE, SAMPLE_PARAMETER, SAMPLE_LIMIT);

    private Schema() {
    }
}

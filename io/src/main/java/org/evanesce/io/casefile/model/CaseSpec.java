package org.evanesce.io.casefile.model;

import java.util.Collections;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.evanesce.io.casefile.text.Located;
import org.evanesce.io.casefile.text.Value;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Side;

/**
 * A validated case: every value resolved to SI units and remembering where it was written.
 * Built by {@code org.evanesce.io.casefile.CaseReader}; the records are immutable. It holds what the file asks
 * for; what follows from it (the grid's cells, each PML in cells) is derived in planning.
 *
 * @param source           the case file's name as given
 * @param title            the case's one-line title
 * @param parameters       the named parameters after overrides, in file order
 * @param polarization     s (Ez, Hx, Hy) or p (Hz, Ex, Ey) for the whole run
 * @param designWavelength vacuum wavelength at which materials are evaluated and resolution is counted, m
 * @param domain           the simulated rectangle
 * @param grid             the grid asked for (planning derives the cells from it)
 * @param materials        every material the scene uses, by name (library ones included)
 * @param shapes           in order; later shapes override earlier ones
 * @param boundaries       all four sides
 * @param sources          at least one
 * @param probes           possibly none
 * @param flux             frequency-domain power through lines, when the case asks for it
 * @param maps             frequency-domain field maps and decay fits, when the case asks for them
 * @param output           what to write
 * @param stop             when to stop
 * @param numerics         precision, threads, Courant number
 * @param sweep            the parameter values {@code evanesce sweep} runs, when the case has a sweep section
 * @param polarizations    s, p or both as written (or set); for both, {@code polarization} is s, and the commands
 *                         that run the case read it again with {@code --set polarization=p} for the p run
 * @param surfaces         power through segments and boxes, far fields and exit spectra, when the case asks for them
 */
public record CaseSpec(String source, Optional<String> title, Map<String, Parameter> parameters,
        Located<Polarization> polarization, Value designWavelength, DomainSpec domain, GridRequest grid,
        Map<String, MaterialSpec> materials, List<ShapeSpec> shapes, Map<Side, BoundarySpec> boundaries,
        List<SourceSpec> sources, List<ProbeSpec> probes, Optional<FluxSpec> flux, Optional<MapsSpec> maps, OutputSpec output, StopSpec stop, NumericsSpec numerics,
        Optional<SweepSpec> sweep, PolarizationChoice polarizations, Optional<SurfacesSpec> surfaces) {

    public CaseSpec {
        parameters = Collections.unmodifiableMap(new LinkedHashMap<>(parameters));
        materials = Collections.unmodifiableMap(new LinkedHashMap<>(materials));
        shapes = List.copyOf(shapes);
        boundaries = Collections.unmodifiableMap(new EnumMap<>(boundaries));
        sources = List.copyOf(sources);
        probes = List.copyOf(probes);
    }

    public BoundarySpec boundary(Side side) {
        return boundaries.get(side);
    }

    /** The material at (x, y): the last shape covering the point, else the background. */
    public String materialAt(double x, double y) {
        return materialAt(shapes, domain.background().value(), x, y);
    }

    static String materialAt(List<ShapeSpec> shapes, String background, double x, double y) {
        for (int k = shapes.size() - 1; k >= 0; k--) {
            String m = shapes.get(k).materialAt(x, y);
            if (m != null) {
                return m;
            }
        }
        return background;
    }
}

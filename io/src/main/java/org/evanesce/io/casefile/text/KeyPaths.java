package org.evanesce.io.casefile.text;

import java.util.Collections;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import org.evanesce.solver.grid.Side;

/**
 * The key paths the parts of a case were written under, for messages about them
 * ({@code sources[1].plane_wave}, {@code boundaries.left}): the spec's values keep their line and
 * column, these keep their keys. Each list runs parallel to the spec's list of the same name.
 *
 * @param shapes     one per shape
 * @param sources    one per source
 * @param probes     one per probe
 * @param boundaries one per side
 */
public record KeyPaths(List<String> shapes, List<String> sources, List<String> probes,
        Map<Side, String> boundaries) {

    public KeyPaths {
        shapes = List.copyOf(shapes);
        sources = List.copyOf(sources);
        probes = List.copyOf(probes);
        Map<Side, String> sides = new EnumMap<>(Side.class);
        sides.putAll(boundaries);
        boundaries = Collections.unmodifiableMap(sides);
    }
}

package org.evanesce.io.plan;

import java.util.List;
import java.util.Optional;
import org.evanesce.io.casefile.model.MapsSpec;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.record.FieldMap;

/**
 * What field output a run writes: the node box and components of `fields` and `field_frames`, the
 * steps at which frames are taken, and the frequency-domain maps.
 *
 * @param box        the nodes covered, {i0, j0, i1, j1} (i1, j1 exclusive)
 * @param components the components written
 * @param frameSteps the steps after which frames are taken (empty without field_frames)
 * @param maps       the maps, when the case has a {@code maps} section
 */
public record FieldPlan(int[] box, List<Component> components, long[] frameSteps, Optional<Maps> maps) {

    public FieldPlan {
        box = box.clone();
        components = List.copyOf(components);
        frameSteps = frameSteps.clone();
    }

    /**
     * The maps of a run.
     *
     * @param spec the case's section
     * @param map  the running transforms, registered on the run
     * @param box  the nodes mapped, {i0, j0, i1, j1}
     * @param steady  a continuous wave's transform window
     * @param monitor with a window: a line across the region's middle row transforming its early and late halves
     * @param continuousUnwindowed a continuous wave drives the run but the maps transform the whole run, switch-on
     *                included (the case has several sources, so no one period to window)
     */
    public record Maps(MapsSpec spec, FieldMap map, int[] box, Optional<SteadyState> steady,
                       List<org.evanesce.solver.record.FluxLine> monitor, boolean continuousUnwindowed) {
        public Maps {
            box = box.clone();
            monitor = List.copyOf(monitor);
        }
    }
}

package org.evanesce.io.sweep;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.evanesce.io.casefile.model.SampleSpec;
import org.evanesce.io.casefile.model.SweepSpec;
import org.evanesce.io.tolerance.Distribution;

/**
 * The points of a sample sweep: one {@link Random} seeded with the sample's seed; for each point in
 * turn, each parameter in file order is drawn from its distribution ({@link Distribution#draw}: a
 * truncated normal by rejection), and written as an override with every digit in SI units. The same
 * seed gives the same points on any machine (java.util.Random's sequence is specified), so shards and
 * resumed runs agree on every point.
 */
public final class SamplePoints {

    private SamplePoints() {
    }

    /** The distribution a parameter is drawn from. */
    public static Distribution distribution(SampleSpec.Varied v) {
        return v.kind() == SampleSpec.Kind.UNIFORM
                ? new Distribution(v.name(), Distribution.Kind.UNIFORM, v.dimension(), v.low(), v.high(), v.low(), v.high(),
                        v.definition())
                : new Distribution(v.name(), Distribution.Kind.NORMAL, v.dimension(), v.mean(), v.sd(), v.low(), v.high(),
                        v.definition());
    }

    static List<SweepPoint> draw(SweepSpec sweep) {
        SampleSpec s = sweep.sample().orElseThrow();
        List<Distribution> ds = s.parameters().stream().map(SamplePoints::distribution).toList();
        List<String> names = ds.stream().map(Distribution::name).toList();
        Random rnd = new Random(s.seed());
        List<SweepPoint> out = new ArrayList<>();
        for (int p = 0; p < s.count(); p++) {
            List<String> texts = new ArrayList<>();
            for (Distribution d : ds) {
                texts.add(d.override(d.draw(rnd)));
            }
            out.add(new SweepPoint(p, names, texts));
        }
        return out;
    }
}

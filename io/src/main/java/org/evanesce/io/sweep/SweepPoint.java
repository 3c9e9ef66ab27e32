package org.evanesce.io.sweep;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.evanesce.io.casefile.model.SweepSpec;

/**
 * One point of a sweep: the swept parameters' expression texts, which are applied as
 * {@code --set name=text} overrides.
 *
 * @param number the point's number, from 0, in sweep order
 * @param names  the swept parameters in the sweep's order
 * @param texts  each parameter's expression text at this point
 */
public record SweepPoint(int number, List<String> names, List<String> texts) {

    public SweepPoint {
        names = List.copyOf(names);
        texts = List.copyOf(texts);
        if (names.size() != texts.size()) {
            throw new IllegalArgumentException(names.size() + " names but " + texts.size() + " values");
        }
    }

    /**
     * Every point of a sweep in order. {@code product}: every combination, the first parameter
     * varying slowest (like nested loops with the first outermost); {@code zip}: the n-th value of
     * every parameter; a sample: the drawn points ({@link SamplePoints}).
     */
    public static List<SweepPoint> expand(SweepSpec sweep) {
        if (sweep.sample().isPresent()) {
            return SamplePoints.draw(sweep);
        }
        List<SweepSpec.Axis> axes = sweep.parameters();
        List<String> names = axes.stream().map(SweepSpec.Axis::name).toList();
        long count = sweep.pointCount();
        List<SweepPoint> out = new ArrayList<>();
        for (int p = 0; p < count; p++) {
            List<String> texts = new ArrayList<>();
            if (sweep.combine() == SweepSpec.Combine.ZIP) {
                for (SweepSpec.Axis a : axes) {
                    texts.add(a.values().get(p));
                }
            } else {
                // mixed-radix digits of p, the last parameter the fastest digit
                int[] digit = new int[axes.size()];
                int rest = p;
                for (int k = axes.size() - 1; k >= 0; k--) {
                    int n = axes.get(k).values().size();
                    digit[k] = rest % n;
                    rest /= n;
                }
                for (int k = 0; k < axes.size(); k++) {
                    texts.add(axes.get(k).values().get(digit[k]));
                }
            }
            out.add(new SweepPoint(p, names, texts));
        }
        return out;
    }

    /** The overrides of this point, name to expression text, in the sweep's order. */
    public Map<String, String> overrides() {
        Map<String, String> m = new LinkedHashMap<>();
        for (int k = 0; k < names.size(); k++) {
            m.put(names.get(k), texts.get(k));
        }
        return m;
    }

    /** {@code gap=150 nm, theta=45 deg}, for messages. */
    public String describe() {
        List<String> parts = new ArrayList<>();
        for (int k = 0; k < names.size(); k++) {
            parts.add(names.get(k) + "=" + texts.get(k));
        }
        return String.join(", ", parts);
    }

    /** The point's folder name inside the sweep folder, {@code point-0003}. */
    public String folderName() {
        return folderName(number);
    }

    static String folderName(int number) {
        return String.format(Locale.ROOT, "point-%04d", number);
    }
}

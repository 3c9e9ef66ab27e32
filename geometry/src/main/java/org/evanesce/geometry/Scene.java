package org.evanesce.geometry;

import java.util.ArrayList;
import java.util.List;
import org.evanesce.geometry.shape.Shape;

/**
 * What fills the plane: a background material and an ordered list of shapes with their
 * materials. Where shapes overlap, the later entry wins. Immutable; build it with {@link #builder}.
 */
public final class Scene {

    /** One shape and the material that fills it. */
    public record Entry(Shape shape, Material material) {
        public Entry {
            if (shape == null || material == null) {
                throw new IllegalArgumentException("scene entry: shape and material must both be given");
            }
        }
    }

    private final Material background;
    private final List<Entry> entries;

    private Scene(Material background, List<Entry> entries) {
        this.background = background;
        this.entries = List.copyOf(entries);
    }

    /** A scene of only the background. */
    public static Builder builder(Material background) {
        if (background == null) {
            throw new IllegalArgumentException("scene background material must be given");
        }
        return new Builder(background);
    }

    /** The material wherever no shape is. */
    public Material background() {
        return background;
    }

    /** The shapes in order; later ones win. */
    public List<Entry> entries() {
        return entries;
    }

    /** The material at (x, y) metres: the last entry containing the point, else the background. */
    public Material materialAt(double x, double y) {
        for (int k = entries.size() - 1; k >= 0; k--) {
            if (entries.get(k).shape().contains(x, y)) {
                return entries.get(k).material();
            }
        }
        return background;
    }

    /** Collects entries in order. */
    public static final class Builder {
        private final Material background;
        private final List<Entry> entries = new ArrayList<>();

        private Builder(Material background) {
            this.background = background;
        }

        /** Appends a shape; it wins over everything added before. */
        public Builder add(Shape shape, Material material) {
            entries.add(new Entry(shape, material));
            return this;
        }

        /** Appends the layers of a stack, first to last. */
        public Builder add(LayerStack stack) {
            entries.addAll(stack.entries());
            return this;
        }

        public Scene build() {
            return new Scene(background, entries);
        }
    }
}

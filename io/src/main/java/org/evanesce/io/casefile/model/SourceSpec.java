package org.evanesce.io.casefile.model;

import java.util.Optional;
import org.evanesce.io.casefile.text.Located;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;
import org.evanesce.solver.grid.Component;

/** A soft current source that drives one field component. */
public sealed interface SourceSpec {

    Located<Component> component();

    /**
     * Peak amplitude of the driving current at each site, η0·Δ·J (or Δ·M for a magnetic current) in V/m: for
     * a plane wave's sheet that is η0 times its current per metre (or its magnetic current per metre), whatever
     * the cell size. A Gaussian beam's amplitude is its z field at the waist centre instead.
     */
    Value amplitude();

    SignalSpec signal();

    /** Where the source's entry starts. */
    SourcePosition at();

    /** The case-file kind, e.g. {@code point}. */
    String kind();

    /** The source's middle, metres. */
    double[] centre();

    /** A source at one point. */
    record PointSource(Point location, Located<Component> component, Value amplitude, SignalSpec signal,
            SourcePosition at) implements SourceSpec {

        @Override
        public String kind() {
            return "point";
        }

        @Override
        public double[] centre() {
            return new double[] {location.x().si(), location.y().si()};
        }
    }

    /**
     * A source along a horizontal or vertical segment from {@code from} to {@code to}.
     * {@code angle} tilts the launched wavefront: the wave leaves at this angle from the segment's
     * normal, turned towards the direction from {@code from} to {@code to}, in the material at the
     * segment's middle; a delay along the segment produces the tilt. {@code waist}, if given, gives
     * the amplitude the profile exp(−(s/waist)²) with s the distance from the middle; otherwise
     * the amplitude is uniform.
     */
    record LineSource(Point from, Point to, Located<Component> component, Value amplitude, Value angle,
            Optional<Value> waist, SignalSpec signal, SourcePosition at) implements SourceSpec {

        @Override
        public String kind() {
            return "line";
        }

        @Override
        public double[] centre() {
            return new double[] {(from.x().si() + to.x().si()) / 2, (from.y().si() + to.y().si()) / 2};
        }

        /** True when the segment runs along x. */
        public boolean horizontal() {
            return from.y().si() == to.y().si();
        }

        public double length() {
            return Math.hypot(to.x().si() - from.x().si(), to.y().si() - from.y().si());
        }
    }

    /** Which way a plane wave's incident half travels. */
    enum Direction {
        /** Towards +y. */
        UP,
        /** Towards −y. */
        DOWN;

        /** +1 for up, −1 for down. */
        public int sign() {
            return this == UP ? 1 : -1;
        }
    }

    /**
     * A wave launched one way from a horizontal line at height {@link #y}: travelling in
     * {@link #direction}, at {@link #angle} from that direction's normal, turned towards +x, in the
     * material at the line.
     */
    sealed interface Launched extends SourceSpec {
        /** The launching line's height, m. */
        Value y();

        /** The angle of incidence at the centre frequency, rad. */
        Value angle();

        Located<Direction> direction();
    }

    /**
     * A plane wave launched from a horizontal line across the whole (periodic) width at height
     * {@code y}: a current sheet driving Ez (s) or Hz (p) with the phase e^{i kx x}, kx = n k0 sin θ at
     * the signal's centre frequency in the material at the line (n its index). The sheet radiates
     * both ways; the incident wave is the half travelling in {@code direction}, at {@code angle}
     * from that direction's normal, turned towards +x. With a pulse every frequency f has its own
     * angle, sin θ(f) = kx c0 / (2π f n).
     */
    record PlaneWave(Value y, Value angle, Located<Direction> direction, Located<Component> component, Value amplitude,
            SignalSpec signal, SourcePosition at) implements Launched {

        @Override
        public String kind() {
            return "plane_wave";
        }

        @Override
        public double[] centre() {
            return new double[] {0, y.si()};
        }
    }

    /**
     * A 2D Gaussian beam injected one way through a total-field/scattered-field line at height
     * {@code y} (the total field lies on the side the beam travels to): waist radius {@code waist}
     * (the field falls to 1/e at that distance from the axis at the waist), waist centre
     * {@code waistAt}, travelling in {@code direction} at {@code angle} from its normal, turned
     * towards +x. The line lies in one lossless material; the z component (Ez for s, η0Hz for p) is
     * {@code amplitude} at the waist centre.
     */
    record GaussianBeamSource(Value y, Value waist, Point waistAt, Value angle, Located<Direction> direction,
            Located<Component> component, Value amplitude, SignalSpec signal, SourcePosition at) implements Launched {

        @Override
        public String kind() {
            return "gaussian_beam";
        }

        @Override
        public double[] centre() {
            return new double[] {waistAt.x().si(), waistAt.y().si()};
        }

        /**
         * The launching line is used, and must lie in one material, this many footprints (waist / cos θ)
         * either side of the axis: there the field is e^−9 of its peak (1e-8 of the peak power).
         */
        public static final double SPAN_FOOTPRINTS = 3;

        /** Half the used length of the launching line, m. */
        public double reach() {
            return SPAN_FOOTPRINTS * waist.si() / Math.cos(angle.si());
        }

        /** Where the beam's axis crosses the launching line, x in m. */
        public double axisAtLine() {
            double dy = y.si() - waistAt.y().si();
            return waistAt.x().si() + dy * Math.tan(angle.si()) * direction.value().sign();
        }
    }

    /**
     * A plane wave inside the rectangle from {@code from} to {@code to} (total field inside, on and inside the
     * rectangle's nodes; only what the scene scatters outside it): travelling at {@code heading} from +x,
     * counter-clockwise, its z component (Ez for s, η0Hz for p) {@code amplitude}·sin(2πft) at {@code reference}
     * (default: the box's centre). The medium outside the box must be one lossless material or layers along y;
     * in layers the incident field is the whole layered solution (solver.source.TotalFieldBox).
     */
    record PlaneWaveBox(Point from, Point to, Value heading, Optional<Point> reference, Located<Component> component,
            Value amplitude, SignalSpec signal, SourcePosition at) implements SourceSpec {

        @Override
        public String kind() {
            return "plane_wave_box";
        }

        @Override
        public double[] centre() {
            return new double[] {(from.x().si() + to.x().si()) / 2, (from.y().si() + to.y().si()) / 2};
        }

        /** The reference point, m: given, or the centre. */
        public double[] referencePoint() {
            return reference.map(p -> new double[] {p.x().si(), p.y().si()}).orElse(centre());
        }
    }
}

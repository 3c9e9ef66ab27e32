package org.evanesce.io.plan;

import java.io.ByteArrayOutputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.source.IncidentSheet;
import org.evanesce.solver.source.Source;

/**
 * The identity of an incident-power run: a SHA-256 of exactly what its result depends on, so that two
 * cases with the same key have incident-power runs that give the same numbers, bit for bit (results do
 * not depend on the thread count), and one run can serve both (a sweep over the scene: a gap, a film).
 *
 * <p>What is hashed, in this order: polarization, precision and Courant number; the homogeneous material grid the run
 * steps (where its nodes lie, its material table with every permittivity and conductivity as the grid has
 * them, each site's material ids, as runs of equal ids); each side's boundary; every source (component, cells, amplitudes, signal)
 * and every incident sheet (component, cells, phasors, delays, signal); the recorders in the order they were
 * registered (row, cells, frequencies and, for a continuous wave, the transform window). {@link #withSteps}
 * adds, once the case's run has ended, the number of steps and the program's version and build id (any
 * change of the program may change the numbers). The scene beyond the incident medium is not part of it.
 * Doubles are hashed by their bits; text (a signal's or boundary's parameters) by its exact decimal form.
 */
public final class IncidentKey {

    /** What a case's run is configured with besides its material grid, as the planner configures the builder. */
    public record Setup(Polarization polarization, Precision precision, double courant, Map<Side, Boundary> sides,
                        List<Source> sources, List<IncidentSheet> sheets) {
        public Setup {
            sides = Map.copyOf(sides);
            sources = List.copyOf(sources);
            sheets = List.copyOf(sheets);
        }
    }

    private final ByteArrayOutputStream bytes = new ByteArrayOutputStream();
    private final DataOutputStream out = new DataOutputStream(bytes);
    private final MessageDigest md;

    /** Starts a key with the set-up. */
    IncidentKey(Setup s, MaterialGrid grid) {
        try {
            md = MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is part of every Java runtime", e);
        }
        text("evanesce incident-power run 2");
        text(s.polarization().name());
        text(s.precision().name());
        number(s.courant());
        var g = grid.spec();
        numbers(g.x0(), g.y0(), g.cellSize());
        integer(g.nx());
        integer(g.ny());
        integer(grid.materials().size());
        for (Material m : grid.materials()) {
            text(m.name());
            numbers(m.relativePermittivity(), m.conductivity());
        }
        for (FieldSite site : FieldSite.values()) {
            text(site.name());
            runs(grid.ids(site));
        }
        for (Side side : Side.values()) {
            Boundary b = s.sides().get(side);
            text(side.name() + " " + (b == null ? "none" : b.toString()));
        }
        integer(s.sources().size());
        for (Source src : s.sources()) {
            text(src.component().name());
            integers(src.cells());
            numbers(src.amplitudes());
            numbers(src.imagAmplitudes());
            text(src.signal().toString());
        }
        integer(s.sheets().size());
        for (IncidentSheet sh : s.sheets()) {
            text(sh.component().name());
            integers(sh.cells());
            numbers(sh.re());
            numbers(sh.im());
            numbers(sh.delays());
            text(sh.signal().toString());
        }
    }

    /** Adds how the run is done (e.g. on a strip that stands for the full width). */
    void method(String how) {
        text("method " + how);
    }

    /** Adds a recorder of the run: what it is, where and what it transforms. */
    void recorder(String what, int row, int firstCell, int cells, double[] frequencies, String window) {
        text(what);
        integer(row);
        integer(firstCell);
        integer(cells);
        numbers(frequencies);
        text(window);
    }

    /** The key of the set-up so far, 64 lower-case hex digits. */
    String hex() {
        flush();
        try {
            return HexFormat.of().formatHex(((MessageDigest) md.clone()).digest());
        } catch (CloneNotSupportedException e) {
            throw new IllegalStateException("SHA-256 digests can be cloned", e);
        }
    }

    /**
     * The key of a set-up's run of {@code steps} steps by this program: the SHA-256 of the set-up's key, the step
     * count, the program's version and its build id.
     */
    public static String withSteps(String setupKey, long steps, String version, String buildId) {
        try {
            MessageDigest d = MessageDigest.getInstance("SHA-256");
            d.update(("evanesce incident-power run\nset-up " + setupKey + "\nsteps " + steps + "\nversion " + version
                    + "\nbuild " + buildId + "\n").getBytes(java.nio.charset.StandardCharsets.UTF_8));
            return HexFormat.of().formatHex(d.digest());
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is part of every Java runtime", e);
        }
    }

    /**
     * The key of a set-up's run of any number of steps by this program: the SHA-256 of the set-up's key, the program's
     * version and its build id. Runs of one such key are the same run stopped at different steps, so a state of one
     * can be continued to give another's result bit for bit ({@code IncidentPowerCache.Continuation}).
     */
    public static String anySteps(String setupKey, String version, String buildId) {
        return withSteps(setupKey, -1, version, buildId);
    }

    private void flush() {
        try {
            out.flush();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        md.update(bytes.toByteArray());
        bytes.reset();
    }

    private void text(String s) {
        try {
            out.writeUTF(s);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private void integer(int v) {
        try {
            out.writeInt(v);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private void integers(int[] a) {
        integer(a.length);
        for (int v : a) {
            integer(v);
        }
        if (bytes.size() > 1 << 20) {
            flush();
        }
    }

    /**
     * A site's material ids as runs: the length, then each run's id and count. The grid of an incident-power run is
     * homogeneous, so its ids are a few runs; hashing every id had taken about 0.13 s of the two-prism example's
     * planning (three sites of 0.86 M cells; JFR, 1 ms samples), most of it in the interpreter.
     */
    private void runs(int[] ids) {
        integer(ids.length);
        int i = 0;
        while (i < ids.length) {
            int v = ids[i];
            int j = i + 1;
            while (j < ids.length && ids[j] == v) {
                j++;
            }
            integer(v);
            integer(j - i);
            i = j;
        }
        if (bytes.size() > 1 << 20) {
            flush();
        }
    }

    private void number(double v) {
        try {
            out.writeLong(Double.doubleToRawLongBits(v));
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private void numbers(double... a) {
        integer(a.length);
        for (double v : a) {
            number(v);
        }
    }
}

package org.evanesce.solver;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.dispersion.DispersiveMaterial;
import org.evanesce.geometry.dispersion.FaceMixtures;
import org.evanesce.geometry.dispersion.SeriesMaterial;

/**
 * A horizontal film between two half-spaces on the grid with its faces averaged as
 * {@link FaceMixtures} says (what io's planner does at a metal's faces): each electric site takes the
 * fractions of the materials over its cell along y, [y − ½, y + ½] around its own row; Ez and Ex (along
 * the faces) the arithmetic mean, Ey (across them) the harmonic mean, or, with {@code staircaseNormal},
 * the material at its own point (the rule before the harmonic mean, kept to measure the difference).
 */
final class FacedFilm {

    final MaterialGrid grid;
    final Map<Integer, DispersiveMaterial> dispersive = new LinkedHashMap<>();
    final Map<Integer, SeriesMaterial> series = new LinkedHashMap<>();

    /**
     * @param below  the half-space under y0 (cells, continuous)
     * @param film   the film from y0 to y1
     * @param above  the half-space above y1
     */
    FacedFilm(int nx, int ny, double dx, Material below, DispersiveMaterial film, double y0, double y1, Material above,
              boolean staircaseNormal) {
        Material filmEntry = MetalRuns.placeholder(film);
        List<DispersiveMaterial> parts = List.of(DispersiveMaterial.of(below), film, DispersiveMaterial.of(above));
        Material[] plain = {below, filmEntry, above};
        Map<Material, Object> models = new LinkedHashMap<>();
        models.put(filmEntry, film);
        MaterialGrid.Builder b = MaterialGrid.builder(nx, ny, dx, below);
        for (FieldSite s : FieldSite.values()) {
            for (int j = 0; j < ny; j++) {
                double y = j + s.dy;
                double[] f = {overlap(y - 0.5, y + 0.5, Double.NEGATIVE_INFINITY, y0),
                        overlap(y - 0.5, y + 0.5, y0, y1), overlap(y - 0.5, y + 0.5, y1, Double.POSITIVE_INFINITY)};
                Material m;
                int whole = whole(f);
                if (whole >= 0) {
                    m = plain[whole];
                } else if (s == FieldSite.EY && staircaseNormal) {
                    m = plain[y < y0 ? 0 : y < y1 ? 1 : 2];
                } else {
                    String name = String.format(Locale.ROOT, "%s %.9f %.9f %.9f", s == FieldSite.EY ? "series" : "parallel",
                            f[0], f[1], f[2]);
                    if (s == FieldSite.EY) {
                        SeriesMaterial sm = FaceMixtures.series(name, parts, f);
                        m = new Material(name, sm.epsInfinity(), 0);
                        models.put(m, sm);
                    } else {
                        DispersiveMaterial d = FaceMixtures.parallel(name, parts, f);
                        m = new Material(name, d.epsInfinity(), 0);
                        models.put(m, d);
                    }
                }
                for (int i = 0; i < nx; i++) {
                    b.set(s, i, j, m);
                }
            }
        }
        grid = b.build();
        List<Material> table = new ArrayList<>(grid.materials());
        for (Map.Entry<Material, Object> e : models.entrySet()) {
            int k = table.indexOf(e.getKey());
            if (k < 0) {
                continue;
            }
            if (e.getValue() instanceof SeriesMaterial sm) {
                series.put(k, sm);
            } else {
                dispersive.put(k, (DispersiveMaterial) e.getValue());
            }
        }
    }

    /** Declares the film's and the mixtures' entries. */
    void declare(Simulation.Builder b) {
        dispersive.forEach(b::dispersive);
        series.forEach(b::series);
    }

    private static double overlap(double a, double b, double lo, double hi) {
        return Math.max(0, Math.min(b, hi) - Math.max(a, lo));
    }

    /** The index of the one material that fills the cell, or −1. */
    private static int whole(double[] f) {
        for (int k = 0; k < f.length; k++) {
            if (f[k] == 1) {
                return k;
            }
        }
        return -1;
    }
}

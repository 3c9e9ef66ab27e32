package org.evanesce.io.plan.grid;

import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.io.casefile.model.BoundarySpec;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.model.DomainSpec;
import org.evanesce.io.casefile.model.GridRequest;
import org.evanesce.io.casefile.model.MaterialSpec;
import org.evanesce.io.casefile.text.Diagnostic;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;
import org.evanesce.solver.grid.Side;

/**
 * The one place a case's grid is derived from what it asks for: the cell size (given, or from the cells per
 * wavelength in the densest material at the design wavelength), the node counts that cover the domain, and
 * each PML's thickness in cells.
 */
public final class GridDerivation {

    /** The most nodes one grid may have: one Java array per field, with the geometry module's margin. */
    public static final long MAX_NODES = Integer.MAX_VALUE - 64;

    private GridDerivation() {
    }

    /**
     * Derives the grid of a finished case. Notes (the cell size picked, a domain that is not a whole number of
     * cells) and errors go to {@code out}, at the request's position.
     *
     * @return the grid, or null when it cannot be built (an error was added)
     */
    public static GridPlan derive(CaseSpec spec, List<Diagnostic> out) {
        GridRequest r = spec.grid();
        DomainSpec domain = spec.domain();
        String path = r.path();
        Value cell;
        Optional<Value> perWavelength = Optional.empty();
        if (r.cell().isPresent()) {
            Value c = r.cell().get();
            cell = r.scale() == 1 ? c : new Value(c.si() / r.scale(), c.at());
        } else {
            Value written = r.cellsPerWavelength().orElseThrow();
            Value n = new Value(written.si() * r.scale(), written.at());
            MaterialSpec densest = spec.materials().values().stream().max((a, b) -> Double.compare(a.index(), b.index())).orElseThrow();
            double wavelength = spec.designWavelength().si();
            cell = new Value(wavelength / (densest.index() * n.si()), n.at());
            perWavelength = Optional.of(n);
            note(out, n.at(), path, String.format("cell size %s: %s cells per wavelength of %s in %s (n = %s)",
                    fmt(cell.si()), Units.number(n.si()), fmt(wavelength), densest.name(), Units.number(densest.index())));
        }
        cell = periodicCell(spec, cell, path, out);
        double cx = Math.ceil(domain.width().si() / cell.si() - 1e-9);
        double cy = Math.ceil(domain.height().si() / cell.si() - 1e-9);
        if ((cx + 1) * (cy + 1) > MAX_NODES) {
            out.add(new Diagnostic(Diagnostic.Severity.ERROR, cell.at(), path, String.format("the grid would have %.0f x %.0f "
                    + "nodes, more than one array can hold (%d values); use a larger cell or a smaller domain", cx + 1, cy + 1, MAX_NODES)));
            return null;
        }
        if (cx < 2 || cy < 2) {
            out.add(new Diagnostic(Diagnostic.Severity.ERROR, cell.at(), path, String.format("the domain (%s x %s) is only %d x %d "
                    + "cells of %s; at least 2 cells along each side are needed", fmt(domain.width().si()), fmt(domain.height().si()),
                    (long) cx, (long) cy, fmt(cell.si()))));
            return null;
        }
        double slack = 1e-6 * cell.si();
        if (cx * cell.si() > domain.width().si() + slack || cy * cell.si() > domain.height().si() + slack) {
            note(out, cell.at(), path, String.format("the domain (%s x %s) is not a whole number of %s cells; the grid covers %s x %s (%d x %d cells) about the same centre",
                    fmt(domain.width().si()), fmt(domain.height().si()), fmt(cell.si()),
                    fmt(cx * cell.si()), fmt(cy * cell.si()), (long) cx, (long) cy));
        }
        Map<Side, Integer> pml = new EnumMap<>(Side.class);
        for (Side side : Side.values()) {
            if (spec.boundary(side) instanceof BoundarySpec.Pml p) {
                pml.put(side, pmlCells(p, cell.si()));
            }
        }
        return new GridPlan(cell, (int) cx + 1, (int) cy + 1, perWavelength, r.offset(), pml);
    }

    /**
     * With periodic sides (left and right, the only pair that may be) the domain's width is the period, so it must
     * be a whole number of cells: the cell shrinks to width / ceil(width / cell), and a note says so. Otherwise the
     * period would be up to a cell longer than the case says, and every shape that ends at the domain's edge would
     * leave a slit of background in each period.
     */
    static Value periodicCell(CaseSpec spec, Value cell, String path, List<Diagnostic> out) {
        if (!(spec.boundary(Side.LEFT) instanceof BoundarySpec.Periodic)) {
            return cell;
        }
        double period = spec.domain().width().si();
        double cells = Math.ceil(period / cell.si() - 1e-9);
        double fitted = period / cells;
        if (Math.abs(fitted - cell.si()) <= 1e-9 * cell.si()) {
            return cell;
        }
        note(out, cell.at(), path, String.format("cell size %s instead of %s, so that the periodic width (%s) is a whole "
                + "number of cells (%d)", fmt(fitted), fmt(cell.si()), fmt(period), (long) cells));
        return new Value(fitted, cell.at());
    }

    /** A PML's cells: as written, or its thickness rounded to whole cells (at least 1). */
    static int pmlCells(BoundarySpec.Pml p, double cell) {
        if (p.cells().isPresent()) {
            return p.cells().getAsInt();
        }
        return (int) Math.max(1, Math.min(Math.round(p.thickness().orElseThrow().si() / cell), Integer.MAX_VALUE));
    }

    private static void note(List<Diagnostic> out, SourcePosition at, String path, String message) {
        out.add(new Diagnostic(Diagnostic.Severity.NOTE, at, path, message));
    }

    private static String fmt(double metres) {
        return Units.format(metres, Dimension.LENGTH);
    }
}

package org.evanesce.io.casefile.model;

import java.util.Optional;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;

/**
 * The grid as the case asks for it: a cell length or a number of cells per wavelength (exactly one), as
 * written. Planning turns it into a cell size and node counts ({@code org.evanesce.io.plan.grid.GridDerivation}).
 *
 * @param cell               the cell length, metres
 * @param cellsPerWavelength cells per wavelength in the densest material the scene uses, at the design wavelength
 * @param scale              the resolution as written is multiplied by this: the cell divided by it, the cells per
 *                           wavelength multiplied (an accuracy study's finer levels); 1 normally
 * @param offset             the nodes are moved by this fraction of a cell along x and y from the centred position
 *                           (an accuracy study's offset runs), in [0, 1); 0 normally
 */
public record GridRequest(Optional<Value> cell, Optional<Value> cellsPerWavelength, double scale, double offset) {

    public GridRequest {
        if (cell.isPresent() == cellsPerWavelength.isPresent()) {
            throw new IllegalArgumentException("a grid request has exactly one of a cell and cells per wavelength");
        }
    }

    /** Where the request was written: at the cell's or the count's value. */
    public SourcePosition at() {
        return cell.orElseGet(cellsPerWavelength::orElseThrow).at();
    }

    /** The key it was written under. */
    public String path() {
        return cell.isPresent() ? "grid.cell" : "grid.cells_per_wavelength";
    }
}

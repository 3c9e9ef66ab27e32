package org.evanesce.io.output.image;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Optional;
import org.junit.jupiter.api.Test;

class DisplayUnitTest {

    @Test
    void theUnitMakesTheExtentReadFromOneToAThousand() {
        assertEquals(DisplayUnit.UM, DisplayUnit.forExtent(6.4e-6));
        assertEquals(DisplayUnit.UM, DisplayUnit.forExtent(1e-6));
        assertEquals(DisplayUnit.UM, DisplayUnit.forExtent(999e-6));
        assertEquals(DisplayUnit.NM, DisplayUnit.forExtent(8e-7));
        assertEquals(DisplayUnit.NM, DisplayUnit.forExtent(3e-10), "below 1 nm stays in nm");
        assertEquals(DisplayUnit.MM, DisplayUnit.forExtent(1.5e-3));
        assertEquals(DisplayUnit.M, DisplayUnit.forExtent(2.0));
        assertEquals(DisplayUnit.M, DisplayUnit.forExtent(5000.0));
    }

    @Test
    void symbolsAsInCaseFiles() {
        assertEquals(Optional.of(DisplayUnit.UM), DisplayUnit.fromSymbol("um"));
        assertEquals(Optional.of(DisplayUnit.UM), DisplayUnit.fromSymbol("\u00b5m"));
        assertEquals(Optional.of(DisplayUnit.NM), DisplayUnit.fromSymbol(" NM "));
        assertTrue(DisplayUnit.fromSymbol("ft").isEmpty());
        assertEquals("um", DisplayUnit.UM.symbol);
    }

    @Test
    void extentMustBePositive() {
        assertThrows(IllegalArgumentException.class, () -> DisplayUnit.forExtent(0));
        assertThrows(IllegalArgumentException.class, () -> DisplayUnit.forExtent(Double.POSITIVE_INFINITY));
    }
}

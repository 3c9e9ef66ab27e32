package org.evanesce.io.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.List;
import java.util.Map;
import java.util.stream.IntStream;
import org.evanesce.io.casefile.ReadOptions;
import org.evanesce.io.plan.CaseLoader;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.io.plan.CasePlanner;
import org.junit.jupiter.api.Test;

/**
 * Issue 17: a sweep reads and plans its points side by side, but reports them in point order, and keeps plans
 * for the points' runs only within its heap budget, handing each out once.
 */
class SweepPreparationTest {

    /** The shipped plane-wave gap example (19 x 191 cells); its plan's memory estimate is the unit of the budgets below. */
    private static final java.nio.file.Path CASE = java.nio.file.Path.of("../cases/gap-tunnelling-plane-wave.yaml");

    @Test
    void outcomesComeInTheItemsOrderWhateverFinishesFirst() {
        List<Integer> items = IntStream.range(0, 40).boxed().toList();
        List<SweepPreparation.Attempt<Integer>> out = SweepPreparation.each(items, 3, k -> {
            Thread.sleep((40 - k) % 7); // later items often finish first
            if (k % 13 == 5) {
                throw new java.io.IOException("item " + k);
            }
            return k * k;
        });
        assertEquals(items.size(), out.size());
        for (int k = 0; k < items.size(); k++) {
            if (k % 13 == 5) {
                assertNull(out.get(k).value());
                assertEquals("item " + k, out.get(k).error().getMessage(), "the item's own exception");
            } else {
                assertEquals(k * k, out.get(k).value(), "item " + k);
                assertNull(out.get(k).error());
            }
        }
        assertThrows(AssertionError.class, () -> SweepPreparation.each(items, 2, k -> {
            throw new AssertionError("an error ends the whole call");
        }));
    }

    @Test
    void plansAreKeptWithinTheBudgetAndHandedOutOnce() throws Exception {
        CasePlan a = plan("150 nm");
        CasePlan b = plan("200 nm");
        long bytes = a.memory().total();
        assertEquals(bytes, b.memory().total(), "the gap does not change the estimate");
        SweepPreparation.Plans kept = new SweepPreparation.Plans(bytes + bytes / 2);
        kept.offer(0, a);
        kept.offer(1, b);
        assertEquals(1, kept.size(), "the second plan does not fit");
        assertNull(kept.take(1, 2), "not kept: planned again when its point runs");
        assertSame(a, kept.take(0, 2));
        assertNull(kept.take(0, 2), "handed out once");
        kept.offer(1, b);
        assertSame(b, kept.take(1, 1), "a plan handed out frees its share of the budget");
        assertEquals(0, kept.size());
        kept.offer(0, a);
        kept.fitBeside(bytes, 2 * bytes);
        assertEquals(1, kept.size(), "the running points and the kept plan fit the heap together");
        kept.fitBeside(bytes + 1, 2 * bytes);
        assertEquals(0, kept.size(), "they do not: the kept plans go");
        assertNull(kept.take(0, 2));
    }

    private static CasePlan plan(String gap) throws Exception {
        return CasePlanner.plan(CaseLoader.parse(java.nio.file.Files.readString(CASE), CASE.toString(), Map.of("gap", gap),
                ReadOptions.defaults()).spec(), null);
    }
}

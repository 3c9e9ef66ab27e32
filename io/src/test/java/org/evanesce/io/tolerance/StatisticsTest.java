package org.evanesce.io.tolerance;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/** The tolerance study's summaries against published definitions and examples. */
class StatisticsTest {

    @Test
    void quantilesInterpolateBetweenOrderStatistics() {
        // Hyndman & Fan (1996) definition 7: h = (n - 1) p; for 1..10, p = 0.05 gives 1 + 0.45 (the default of common
        // statistics packages, from memory)
        double[] v = {10, 3, 5, 1, 2, 4, 6, 8, 7, 9};
        assertEquals(1.45, Statistics.quantile(v, 0.05), 1e-14);
        assertEquals(5.5, Statistics.quantile(v, 0.5), 1e-15);
        assertEquals(9.55, Statistics.quantile(v, 0.95), 1e-14);
        assertEquals(1, Statistics.quantile(v, 0), 0);
        assertEquals(10, Statistics.quantile(v, 1), 0);
    }

    @Test
    void theSampleStandardDeviationUsesNMinusOne() {
        // 2, 4, 4, 4, 5, 5, 7, 9: population sd 2, sample sd sqrt(32/7) (common textbook example, from memory)
        double[] v = {2, 4, 4, 4, 5, 5, 7, 9};
        assertEquals(5, Statistics.mean(v), 0);
        assertEquals(Math.sqrt(32.0 / 7), Statistics.standardDeviation(v), 1e-15);
    }

    @Test
    void wilsonIntervalsInvertTheScoreTest() {
        // Newcombe, Stat. Med. 17, 857 (1998), table II, 81 of 263: 0.2553 to 0.3662 (method 3)
        double[] ci = Statistics.wilson(81, 263);
        assertEquals(0.2553, ci[0], 5e-5);
        assertEquals(0.3662, ci[1], 5e-5);
        // by definition each end p satisfies |k/n - p| = z sqrt(p (1 - p) / n) (Wilson 1927)
        for (long[] kn : new long[][] {{81, 263}, {0, 50}, {50, 50}, {1, 1000}, {997, 1000}}) {
            double p = (double) kn[0] / kn[1];
            for (double end : Statistics.wilson(kn[0], kn[1])) {
                double lhs = Math.abs(p - end);
                double rhs = Statistics.Z95 * Math.sqrt(end * (1 - end) / kn[1]);
                assertEquals(rhs, lhs, 1e-12, () -> kn[0] + " of " + kn[1] + ": end " + end);
            }
        }
    }
}

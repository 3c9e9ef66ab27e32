package org.evanesce.solver;

import org.evanesce.solver.boundary.PmlParameters;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.junit.jupiter.api.Test;

class PmlScratchTmpTest {
    @Test
    void sweep() {
        String spec = System.getProperty("pml", "3,1,3,0.02");
        for (String one : spec.split(";")) {
            String[] v = one.split(",");
            PmlParameters p = new PmlParameters(12, Double.parseDouble(v[0]), Double.parseDouble(v[1]),
                    Double.parseDouble(v[2]), Double.parseDouble(v[3]));
            Precision prec = Precision.valueOf(System.getProperty("prec", "FLOAT"));
            StringBuilder sb = new StringBuilder(one + " " + prec + ":");
            long t0 = System.nanoTime();
            for (Polarization pol : Polarization.values()) {
                for (PmlReflectionTest.Medium m : PmlReflectionTest.Medium.values()) {
                    for (PmlReflectionTest.Measured r : PmlReflectionTest.measure(pol, m, p, prec)) {
                        sb.append(String.format(" %s/%s/%s=%.1f", pol, m, r.site().name(), r.decibels()));
                    }
                }
            }
            sb.append(String.format("  [%.1f s]", (System.nanoTime() - t0) * 1e-9));
            System.out.println("RESULT " + sb);
        }
    }
}

package org.evanesce.io.run;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.evanesce.io.plan.FluxPlan;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.reference.AngularSpectrum;

/**
 * The finite-beam reference of a beam case at each of its frequencies ({@link BeamReference#of}), computed once for
 * flux.csv and the beam plots together, the frequencies shared out over the run's threads. Each frequency's reference
 * is its own computation, so the numbers do not depend on the thread count.
 */
public final class BeamReferences {

    private final AngularSpectrum.Converged[] byFrequency;

    private BeamReferences(AngularSpectrum.Converged[] byFrequency) {
        this.byFrequency = byFrequency;
    }

    /**
     * The references of the plan's beam at every frequency, or none (every entry null) without a beam and an exact stack.
     *
     * @param threads at most this many frequencies at a time; at least 1
     */
    public static BeamReferences of(FluxPlan plan, Polarization pol, int threads) {
        int count = plan.frequencies().length;
        AngularSpectrum.Converged[] out = new AngularSpectrum.Converged[count];
        if (plan.exact().isEmpty() || plan.beam().isEmpty()) {
            return new BeamReferences(out);
        }
        int workers = Math.max(1, Math.min(threads, count));
        if (workers == 1) {
            for (int q = 0; q < count; q++) {
                out[q] = one(plan, pol, q);
            }
            return new BeamReferences(out);
        }
        ExecutorService pool = Executors.newFixedThreadPool(workers, r -> {
            Thread t = new Thread(r, "beam-reference");
            t.setDaemon(true);
            return t;
        });
        try {
            List<Future<AngularSpectrum.Converged>> jobs = new ArrayList<>();
            for (int q = 0; q < count; q++) {
                int f = q;
                jobs.add(pool.submit(() -> one(plan, pol, f)));
            }
            for (int q = 0; q < count; q++) {
                out[q] = jobs.get(q).get();
            }
        } catch (ExecutionException e) {
            if (e.getCause() instanceof RuntimeException r) {
                throw r;
            }
            if (e.getCause() instanceof Error err) {
                throw err;
            }
            throw new IllegalStateException(e.getCause());
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted while computing the beam references", e);
        } finally {
            pool.shutdownNow();
        }
        return new BeamReferences(out);
    }

    private static AngularSpectrum.Converged one(FluxPlan plan, Polarization pol, int q) {
        double wl = plan.wavelength(q);
        return BeamReference.of(plan, plan.exact().orElseThrow().stack().apply(wl), pol, wl);
    }

    /** The reference at frequency number q, or null without one. */
    AngularSpectrum.Converged at(int q) {
        return byFrequency[q];
    }
}

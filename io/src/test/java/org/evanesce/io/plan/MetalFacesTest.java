package org.evanesce.io.plan;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertSame;

import java.util.Map;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.dispersion.DispersiveMaterial;
import org.evanesce.geometry.dispersion.MetalLibrary;
import org.evanesce.geometry.dispersion.SeriesMaterial;
import org.evanesce.geometry.dispersion.Spectral;
import org.junit.jupiter.api.Test;

/**
 * The face average of a metal: for a tangential field the mixture's ε(ω) is the fill-fraction-weighted
 * arithmetic mean of the constituents' ε(ω) at every frequency (A. Farjadpour et al., Opt. Lett. 31, 2972
 * (2006): the mean for the field tangential to a face), also for the discrete ε_d; across a face along a grid
 * axis the harmonic mean (the layers in series); a normal field at a tilted face keeps its point-sampled material.
 */
class MetalFacesTest {

    /** Round-off of summing a few Drude-Lorentz terms in double. */
    private static final double ROUND_OFF = 1e-12;

    private final DispersiveMaterial gold = MetalLibrary.get("gold").material();
    private final Material standIn = new Material("gold", gold.epsInfinity(), 0);
    private final Material glass = Material.ofIndex("glass", 1.515);

    @Test
    void aTangentialSiteGetsTheArithmeticMeanAtEveryFrequency() {
        MetalFaces faces = new MetalFaces(Map.of(standIn, gold));
        double f = 0.3;
        Material m = faces.mix(FieldSite.EX, new Material[] {standIn, glass}, new double[] {f, 1 - f}, 0);
        DispersiveMaterial mix = faces.mixtures().get(m);
        double dt = 5e-18;
        for (double ev : new double[] {0.5, 1.96, 3.0, 5.0}) {
            double w = Spectral.omegaOfElectronVolts(ev);
            Complex want = gold.permittivity(w).times(f).plus(1.515 * 1.515 * (1 - f));
            assertEquals(0, mix.permittivity(w).minus(want).abs(), ROUND_OFF * want.abs(), ev + " eV");
            Complex wantD = gold.discretePermittivity(w, dt).times(f).plus(1.515 * 1.515 * (1 - f));
            assertEquals(0, mix.discretePermittivity(w, dt).minus(wantD).abs(), ROUND_OFF * wantD.abs(), ev + " eV, discrete");
        }
        assertSame(m, faces.mix(FieldSite.EZ, new Material[] {standIn, glass}, new double[] {f, 1 - f}, 0),
                "the same geometry shares one entry");
    }

    @Test
    void aSiteAcrossAGridAlignedFaceGetsTheHarmonicMeanAtEveryFrequency() {
        MetalFaces faces = new MetalFaces(Map.of(standIn, gold));
        double f = 0.3;
        Material m = faces.mix(FieldSite.EY, new Material[] {standIn, glass}, new double[] {f, 1 - f}, 1);
        SeriesMaterial mix = faces.seriesMixtures().get(m);
        double dt = 5e-18;
        for (double ev : new double[] {0.5, 1.96, 3.0, 5.0}) {
            double w = Spectral.omegaOfElectronVolts(ev);
            // 1/ε = f/ε_gold + (1 − f)/ε_glass: the layers in series (common practice)
            Complex want = gold.permittivity(w).reciprocal().times(f).plus((1 - f) / (1.515 * 1.515)).reciprocal();
            assertEquals(0, mix.permittivity(w).minus(want).abs(), ROUND_OFF * want.abs(), ev + " eV");
            Complex wantD = gold.discretePermittivity(w, dt).reciprocal().times(f).plus((1 - f) / (1.515 * 1.515))
                    .reciprocal();
            assertEquals(0, mix.discretePermittivity(w, dt).minus(wantD).abs(), ROUND_OFF * wantD.abs(), ev + " eV, discrete");
        }
        assertEquals(1 / (f / gold.epsInfinity() + (1 - f) / (1.515 * 1.515)), m.relativePermittivity(), ROUND_OFF,
                "the stand-in holds the high-frequency value");
    }

    @Test
    void aNormalSiteAtATiltedFaceKeepsItsPointSampledMaterial() {
        MetalFaces faces = new MetalFaces(Map.of(standIn, gold));
        assertNull(faces.mix(FieldSite.EY, new Material[] {standIn, glass}, new double[] {0.5, 0.5}, 0.5));
    }
}

package org.evanesce.geometry;

/** How the rasteriser assigns a material to a field site near an interface. */
public enum Smoothing {
    /** The material at the site point itself (later shapes win): a staircase, first-order accurate at interfaces. */
    NONE,
    /**
     * Anisotropic subpixel smoothing (A. Farjadpour et al., Opt. Lett. 31, 2972 (2006)): each site
     * whose pixel is cut by an interface gets its own permittivity mixing the arithmetic and harmonic
     * means by the interface orientation; see {@link Rasterizer}.
     */
    ANISOTROPIC
}

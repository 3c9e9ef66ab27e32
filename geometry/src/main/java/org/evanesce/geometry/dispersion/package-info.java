/**
 * Frequency-dependent (dispersive) materials: the model, its time discretisation, and where the
 * numbers come from.
 *
 * <ul>
 * <li>{@link org.evanesce.geometry.dispersion.DispersiveMaterial}: ε∞, σ, Drude and Lorentz terms;
 *     the continuous ε(ω) and the discrete ε_d(ω, Δt) the time stepping realises, and both indices.</li>
 * <li>{@link org.evanesce.geometry.dispersion.AdeCoefficients}: the auxiliary-differential-equation
 *     update (equations, state per cell, modified ca', cb', the reference post-pass) for the engine.</li>
 * <li>{@link org.evanesce.geometry.dispersion.MetalLibrary}: Rakić et al.'s Lorentz–Drude metals and
 *     Johnson &amp; Christy's gold; {@link org.evanesce.geometry.dispersion.SingleIndexModel}: one
 *     measured index; {@link org.evanesce.geometry.dispersion.NkTable} and
 *     {@link org.evanesce.geometry.dispersion.PoleFit}: measured tables and passive fits to them; each
 *     gives a {@link org.evanesce.geometry.dispersion.SourcedMaterial} with citation and validity band.</li>
 * </ul>
 *
 * <p>Conventions (docs/architecture.md): time dependence exp(−iωt), so a lossy material has Im ε ≥ 0 and an
 * index n + iκ with κ ≥ 0; SI units inside (ω in rad/s, wavelengths in metres), with constructors
 * from photon energies in eV (ħω). This package computes coefficients but holds no fields, no time
 * loop and no files.
 */
package org.evanesce.geometry.dispersion;

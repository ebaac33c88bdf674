// The asymmetrical peak of a short-circuit current from the X/R at the fault (IEC 60909-0, the factor κ).

/** κ = 1.02 + 0.98 e^(−3R/X); X/R of zero or below gives the resistive limit 1.02, an infinite X/R the limit 2. */
export function peakFactor(xOverR: number): number {
  if (!(xOverR > 0)) return 1.02;
  if (!Number.isFinite(xOverR)) return 2;
  return 1.02 + 0.98 * Math.exp(-3 / xOverR);
}

/** i_p = κ √2 I_k'' (amperes, instantaneous). */
export function asymmetricalPeakAmperes(symmetricalAmperes: number, xOverR: number): number {
  return peakFactor(xOverR) * Math.SQRT2 * symmetricalAmperes;
}

/**
 * The energy tolerance below which a feature of a curve counts as noise.
 *
 * Rule (common practice, a k-sigma threshold): 6 × the estimated noise σ,
 * plus 1e−10 Eh so that exact model data still has a positive tolerance. For
 * normal noise a difference of two points has standard deviation √2·σ, so 6σ
 * is 4.2 of those standard deviations: a pure-noise rise exceeds it with
 * probability about 1e−5 per pair of neighbouring points.
 */
export const NOISE_TOLERANCE_FACTOR = 6;
export const NOISE_TOLERANCE_FLOOR_HARTREE = 1e-10;

export function noiseToleranceHartree(noiseHartree: number): number {
  return NOISE_TOLERANCE_FACTOR * noiseHartree + NOISE_TOLERANCE_FLOOR_HARTREE;
}

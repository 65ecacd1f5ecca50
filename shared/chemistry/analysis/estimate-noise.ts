/**
 * Noise level of a curve's energies, in hartree, from the data alone.
 *
 * Method: each interior point is compared with the cubic through its two
 * neighbours on either side (Lagrange interpolation on the uneven grid); the
 * residual r_i is divided by √(1 + Σ w_j²) (w_j the interpolation weights) so
 * that it has the standard deviation σ of independent noise, and σ is taken as
 * the scaled median absolute residual, 1.4826·median|r_i| — the robust scale
 * estimator of Hampel (J. Am. Stat. Assoc. 69 (1974) 383; the 1.4826 factor is
 * 1/Φ⁻¹(3/4) for normal noise). The median ignores the few points where the
 * curve itself is too steep for a cubic (the repulsive wall). Residual-based
 * variance estimation from local differences follows Gasser, Sroka &
 * Jennen-Steinmetz, Biometrika 73 (1986) 625 (there with a linear stencil).
 *
 * For exact model data the result is not zero but the cubic-interpolation
 * error of the grid (≈ h⁴·E''''/6), typically 1e−6 Eh for a 0.05 a0 grid.
 */
import { prepareCurve, type CurveInput } from './prepare-curve';

export function estimateNoise(input: CurveInput): number {
  const curve = prepareCurve(input);
  const x = curve.distanceBohr;
  const y = curve.energyHartree;
  const n = curve.count;
  if (n < 5) return 0;
  const scaled = new Float64Array(n - 4);
  for (let i = 2; i < n - 2; i++) {
    const xi = x[i];
    const x0 = x[i - 2];
    const x1 = x[i - 1];
    const x3 = x[i + 1];
    const x4 = x[i + 2];
    // Lagrange weights of the cubic through x0, x1, x3, x4 evaluated at xi
    const w0 = ((xi - x1) * (xi - x3) * (xi - x4)) / ((x0 - x1) * (x0 - x3) * (x0 - x4));
    const w1 = ((xi - x0) * (xi - x3) * (xi - x4)) / ((x1 - x0) * (x1 - x3) * (x1 - x4));
    const w3 = ((xi - x0) * (xi - x1) * (xi - x4)) / ((x3 - x0) * (x3 - x1) * (x3 - x4));
    const w4 = ((xi - x0) * (xi - x1) * (xi - x3)) / ((x4 - x0) * (x4 - x1) * (x4 - x3));
    const residual = y[i] - (w0 * y[i - 2] + w1 * y[i - 1] + w3 * y[i + 1] + w4 * y[i + 2]);
    scaled[i - 2] = Math.abs(residual) / Math.sqrt(1 + w0 * w0 + w1 * w1 + w3 * w3 + w4 * w4);
  }
  scaled.sort();
  const m = scaled.length;
  const median = m % 2 === 1 ? scaled[(m - 1) >> 1] : 0.5 * (scaled[m / 2 - 1] + scaled[m / 2]);
  return 1.4826 * median;
}

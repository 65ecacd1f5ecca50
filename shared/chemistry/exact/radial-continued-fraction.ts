/**
 * Residual of the radial equation (m = 0)
 *   d/dλ[(λ² − 1)L′] + [−A + a·λ − c²λ²]L = 0,  a = R(Za + Zb),
 * in Jaffé's form L = (λ + 1)^σ e^(−c(λ − 1)) Σ g_n ((λ − 1)/(λ + 1))^n,
 * σ = a/(2c) − 1. The coefficients obey the three-term recurrence
 *   α_n g_(n+1) + β_n g_n + γ_n g_(n−1) = 0,
 *   α_n = (n + 1)²,
 *   β_n = −2n² + (2σ − 4c)n − A − c² + 2cσ + σ,
 *   γ_n = (n − 1 − σ)²,
 * and a bound state is the minimal solution, i.e. a zero of the continued fraction
 *   F = β_0 − α_0γ_1/(β_1 − α_1γ_2/(β_2 − …)),
 * evaluated bottom-up from `terms` levels. The tail converges like exp(−4√(2cN)),
 * so N ≈ 20 + 40/c levels reach rounding.
 * Source: Jaffé, Z. Phys. 87 (1934) 535; Bates, Ledsham & Stewart, Phil. Trans.
 * R. Soc. A 246 (1953) 215; continued-fraction form as in Leaver, J. Math. Phys.
 * 27 (1986) 1238. Recurrence coefficients re-derived symbolically for this module.
 */

export interface RadialInput {
  /** c = √(−E_el·R²/2) */
  c: number;
  /** a = R(Za + Zb) */
  a: number;
  separationConstant: number;
  /** levels of the continued fraction; default 20 + ⌈40/c⌉ */
  terms?: number;
}

export function radialContinuedFractionTerms(c: number): number {
  return Math.min(200000, 20 + Math.ceil(40 / c));
}

export function radialContinuedFraction({ c, a, separationConstant, terms }: RadialInput): number {
  const sigma = a / (2 * c) - 1;
  const base = -separationConstant - c * c + 2 * c * sigma + sigma; // β_n at n = 0
  const linear = 2 * sigma - 4 * c;
  const levels = terms ?? radialContinuedFractionTerms(c);
  let tail = 0;
  for (let n = levels; n >= 1; n--) {
    const beta = -2 * n * n + linear * n + base;
    const gamma = (n - 1 - sigma) * (n - 1 - sigma);
    tail = (n * n * gamma) / (beta - tail); // α_(n−1) = n²
  }
  return base - tail;
}

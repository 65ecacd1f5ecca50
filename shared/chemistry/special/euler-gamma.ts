/**
 * Euler's constant γ = lim (1 + 1/2 + … + 1/n − ln n) = 0.57721 56649 01532 86060 65…
 * (Abramowitz & Stegun, Handbook of Mathematical Functions, 1964, 6.1.3;
 * NIST DLMF 5.2.3). Rounded to double precision.
 */
export const EULER_GAMMA = 0.5772156649015329;

/**
 * Morse potential E(R) = E∞ + De[(1 − e^(−a(R−Re)))² − 1]
 * (P. M. Morse, Phys. Rev. 34 (1929) 57), written with its dissociation limit
 * E∞, so that E(Re) = E∞ − De. Its curvature at Re is k = 2De·a², and its
 * harmonic wavenumber ωe = a·√(2De/μ)/(2πc).
 */
export interface MorseParameters {
  deHartree: number;
  aPerBohr: number;
  reBohr: number;
  asymptoteHartree: number;
}

export function morseEnergy(distanceBohr: number, p: MorseParameters): number {
  const q = 1 - Math.exp(-p.aPerBohr * (distanceBohr - p.reBohr));
  return p.asymptoteHartree + p.deHartree * (q * q - 1);
}

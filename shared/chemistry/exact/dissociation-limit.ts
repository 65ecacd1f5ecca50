/**
 * Separated-atoms energy of the exact one-electron two-centre problem: the
 * electron bound to the larger charge, hydrogen-like −Z²/2 (for Za = Zb both
 * 1sσg and 2pσu go to −Z²/2). Total and electronic energies share this limit
 * (Za·Zb/R and the −Zmin/R attraction of the far nucleus both vanish).
 * Source: hydrogen-like energy −Z²/(2n²), n = 1 (e.g. Bethe & Salpeter, Quantum
 * Mechanics of One- and Two-Electron Atoms, 1957, §2); correlation of the
 * separated-atom limit: Bates, Ledsham & Stewart (1953).
 */
import { assertPositive } from '@shared/chemistry/lcao/assert-positive';

export function exactDissociationLimit({ za, zb }: { za: number; zb: number }): number {
  assertPositive('za', za);
  assertPositive('zb', zb);
  const z = Math.max(za, zb);
  return (-z * z) / 2;
}

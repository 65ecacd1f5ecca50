/**
 * Electronic energy of the Heitler–London valence-bond wave function
 * a(1)b(2) + b(1)a(2), singlet (W. Heitler & F. London, Z. Phys. 44 (1927)
 * 455; integrals of Sugiura 1927; science.md §3):
 *   E = [2Haa + (aa|bb) + 2S·Hab + (ab|ab)] / (1 + S²)
 * and its triplet partner a(1)b(2) − b(1)a(2), ³Σu⁺:
 *   E = [2Haa + (aa|bb) − 2S·Hab − (ab|ab)] / (1 − S²)
 * (in the minimal basis the triplet space function is the same as the
 * σgσu one, so this equals tripletElectronicEnergy — a check used in tests).
 */
import type { H2OneElectronIntegrals } from './one-electron-integrals';
import type { H2TwoElectronIntegrals } from './two-electron-integrals';

export function valenceBondElectronicEnergy(
  { overlap: s, haa, hab }: H2OneElectronIntegrals,
  { coulombTwoCentre, exchange }: H2TwoElectronIntegrals,
  spin: 'singlet' | 'triplet' = 'singlet',
): number {
  const coulomb = 2 * haa + coulombTwoCentre;
  const exchangeTerm = 2 * s * hab + exchange;
  return spin === 'singlet' ? (coulomb + exchangeTerm) / (1 + s * s) : (coulomb - exchangeTerm) / (1 - s * s);
}

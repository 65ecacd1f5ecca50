/**
 * Atomic masses of the light isotopes Bondmark offers, in unified atomic mass
 * units (u), and the nuclear masses derived from them.
 *
 * Source: NIST "Atomic Weights and Isotopic Compositions for All Elements"
 * (Coursey, Schwab, Tsai & Dragoset), whose relative atomic masses are those of
 * the 2016 Atomic Mass Evaluation (Wang et al., Chin. Phys. C 41 (2017)
 * 030003). Values typed from memory and compared with copies of the NIST table
 * in public code; 12C is exact by definition.
 *
 * Nuclear mass: m_nucleus = m_atom − Z·me (in me, via DALTON_ME, CODATA 2018),
 * neglecting the electrons' binding energy (13.6 eV ≈ 2.7e−5 me for H, below
 * 1e−6 relative for all isotopes here). For the bare proton the CODATA 2018
 * value PROTON_MASS_ME is used instead, which includes that binding energy.
 */
import { DALTON_ME, PROTON_MASS_ME } from '../units';

export interface Isotope {
  symbol: string;
  element: string;
  protons: number;
  massNumber: number;
  /** atomic (neutral-atom) mass in u */
  atomicMassU: number;
}

function isotope(symbol: string, element: string, protons: number, massNumber: number, atomicMassU: number): Isotope {
  return { symbol, element, protons, massNumber, atomicMassU };
}

/** Keyed by the mass-number symbol, e.g. '1H', '2H', '16O'. 'D' and 'T' are aliases of '2H' and '3H'. */
export const ISOTOPES: Readonly<Record<string, Isotope>> = Object.freeze({
  '1H': isotope('1H', 'H', 1, 1, 1.00782503223),
  '2H': isotope('2H', 'H', 1, 2, 2.01410177812),
  '3H': isotope('3H', 'H', 1, 3, 3.0160492779),
  '4He': isotope('4He', 'He', 2, 4, 4.00260325413),
  '6Li': isotope('6Li', 'Li', 3, 6, 6.0151228874),
  '7Li': isotope('7Li', 'Li', 3, 7, 7.0160034366),
  '9Be': isotope('9Be', 'Be', 4, 9, 9.012183065),
  '10B': isotope('10B', 'B', 5, 10, 10.01293695),
  '11B': isotope('11B', 'B', 5, 11, 11.00930536),
  '12C': isotope('12C', 'C', 6, 12, 12),
  '13C': isotope('13C', 'C', 6, 13, 13.00335483507),
  '14N': isotope('14N', 'N', 7, 14, 14.00307400443),
  '15N': isotope('15N', 'N', 7, 15, 15.00010889888),
  '16O': isotope('16O', 'O', 8, 16, 15.99491461957),
  '18O': isotope('18O', 'O', 8, 18, 17.99915961286),
  '19F': isotope('19F', 'F', 9, 19, 18.99840316273),
  '20Ne': isotope('20Ne', 'Ne', 10, 20, 19.9924401762),
});

const ALIASES: Readonly<Record<string, string>> = { D: '2H', T: '3H' };

export type MassKind = 'atomic' | 'nuclear';

export function findIsotope(symbol: string): Isotope {
  const key = ALIASES[symbol] ?? symbol;
  const found = Object.prototype.hasOwnProperty.call(ISOTOPES, key) ? ISOTOPES[key] : undefined;
  if (!found) {
    throw new RangeError(`Unknown isotope "${symbol}"; known: ${Object.keys(ISOTOPES).join(', ')}, D, T.`);
  }
  return found;
}

/** Mass of an isotope in electron masses: the neutral atom, or the bare nucleus. */
export function isotopeMassMe(symbol: string, kind: MassKind = 'atomic'): number {
  const iso = findIsotope(symbol);
  if (kind === 'atomic') return iso.atomicMassU * DALTON_ME;
  if (iso.symbol === '1H') return PROTON_MASS_ME;
  return iso.atomicMassU * DALTON_ME - iso.protons;
}

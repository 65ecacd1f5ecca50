/**
 * Which diatomic species Bondmark draws, and reading formulas such as "O2", "N2+", "O2^2-",
 * "O₂²⁻", "CN−", "NO+" (charge may also be given separately).
 */

export type LevelScheme = 'one-s' | 'second-period' | 'heteronuclear' | 'hydride';

export interface DiatomicSpecies {
  /** canonical neutral formula, e.g. "O2", "CO", "HF" */
  formula: string;
  charge: number;
  /** ASCII species text, e.g. "O2", "O2+", "O2^2-" */
  species: string;
  /** Unicode species text, e.g. "O₂²⁻" */
  display: string;
  /** element drawn on the left (less electronegative; H for hydrides) */
  left: string;
  /** element drawn on the right */
  right: string;
  homonuclear: boolean;
  scheme: LevelScheme;
  electronCount: number;
  /** caveats on what a single-configuration diagram can say for this species */
  notes: string[];
}

export const ATOMIC_NUMBER: Readonly<Record<string, number>> = { H: 1, He: 2, Li: 3, Be: 4, B: 5, C: 6, N: 7, O: 8, F: 9, Ne: 10 };

const HOMONUCLEAR_ELEMENTS = ['H', 'He', 'Li', 'Be', 'B', 'C', 'N', 'O', 'F', 'Ne'];
const HOMONUCLEAR_CHARGES = [-2, -1, 0, 1, 2];

interface HeteronuclearEntry {
  left: string;
  right: string;
  charges: number[];
  notes?: string[];
}

/**
 * Heteronuclear species with the charges allowed. The Aufbau ground terms of all of these agree
 * with the observed ground states (Huber & Herzberg 1979; from memory) except where a note says so.
 */
export const HETERONUCLEAR_SPECIES: Readonly<Record<string, HeteronuclearEntry>> = {
  CO: { left: 'C', right: 'O', charges: [-1, 0, 1] },
  CN: { left: 'C', right: 'N', charges: [-1, 0, 1] },
  NO: { left: 'N', right: 'O', charges: [-1, 0, 1] },
  BN: {
    left: 'B',
    right: 'N',
    charges: [-1, 0],
    notes: [
      'BN: the simple diagram gives ¹Σ⁺ (…1π⁴), but the observed ground state is X³Π (…1π³5σ¹) with a¹Σ⁺ just above ' +
        '(Huber & Herzberg 1979; from memory): 1π and 5σ are too close for a single-configuration Aufbau picture.',
    ],
  },
  BO: { left: 'B', right: 'O', charges: [0] },
  CF: { left: 'C', right: 'F', charges: [0, 1] },
  NF: { left: 'N', right: 'F', charges: [0] },
  BH: { left: 'H', right: 'B', charges: [0, 1] },
  CH: { left: 'H', right: 'C', charges: [-1, 0, 1] },
  NH: { left: 'H', right: 'N', charges: [-1, 0, 1] },
  OH: { left: 'H', right: 'O', charges: [-1, 0, 1] },
  HF: { left: 'H', right: 'F', charges: [0, 1] },
};

const SPECIES_NOTES: Readonly<Record<string, string>> = {
  C2: 'C2: X¹Σg⁺ is the observed ground state, but a³Πu (…1πu³3σg¹) lies only about 0.09 eV above it (Huber & Herzberg 1979; from memory).',
};

const CHARACTER_MAP: Record<string, string> = {
  '⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5', '⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9',
  '₀': '0', '₁': '1', '₂': '2', '₃': '3', '₄': '4', '₅': '5', '₆': '6', '₇': '7', '₈': '8', '₉': '9',
  '⁺': '+', '＋': '+', '⁻': '-', '−': '-', '–': '-', '－': '-',
};

const SUBSCRIPT_TWO = '₂';
const SUPERSCRIPTS: Record<string, string> = { '1': '¹', '2': '²', '+': '⁺', '-': '⁻' };

export function describeSupportedSpecies(): string {
  return (
    'Bondmark draws H2, He2 and Li2 … Ne2 (charges −2 … +2 where the electrons fit the levels drawn) and ' +
    Object.entries(HETERONUCLEAR_SPECIES)
      .map(([f, e]) => `${f}${e.charges.length > 1 || e.charges[0] !== 0 ? ` (charges ${e.charges.map(signed).join(', ')})` : ''}`)
      .join(', ')
  );
}

function signed(q: number): string {
  return q > 0 ? `+${q}` : q < 0 ? `−${-q}` : '0';
}

function chargeSuffix(charge: number): { ascii: string; unicode: string } {
  if (charge === 0) return { ascii: '', unicode: '' };
  const sign = charge > 0 ? '+' : '-';
  const size = Math.abs(charge);
  const ascii = size === 1 ? sign : `^${size}${sign}`;
  const unicode = (size === 1 ? '' : SUPERSCRIPTS[String(size)] ?? String(size)) + SUPERSCRIPTS[sign];
  return { ascii, unicode };
}

/** Charge written after a formula: "", "+", "-", "++", "--", "2+", "+2", … (separators already removed). */
function readChargeSuffix(rest: string): number | null {
  if (rest === '') return 0;
  let m = /^(\d)([+-])$/.exec(rest);
  if (m) return Number(m[1]) * (m[2] === '+' ? 1 : -1);
  m = /^([+-])(\d)?$/.exec(rest);
  if (m) return (m[2] ? Number(m[2]) : 1) * (m[1] === '+' ? 1 : -1);
  m = /^([+-])\1$/.exec(rest);
  if (m) return 2 * (m[1] === '+' ? 1 : -1);
  return null;
}

function unknown(formula: string): RangeError {
  return new RangeError(`unknown formula '${formula}': ${describeSupportedSpecies()}`);
}

/**
 * Species from a formula and an optional separate charge.
 * Throws RangeError for unknown formulas, conflicting or disallowed charges, and electron counts
 * that do not fit the levels drawn (e.g. He2⁻ would need 2s levels).
 */
export function parseDiatomicFormula(formula: string, charge?: number): DiatomicSpecies {
  if (typeof formula !== 'string') throw new RangeError('formula must be text, e.g. "O2" or "NO+"');
  const cleaned = [...formula.normalize('NFC')]
    .map((ch) => CHARACTER_MAP[ch] ?? ch)
    .join('')
    .replace(/[\s^{}[\]()]/g, '');
  const m = /^([A-Z][a-z]?)(2|[A-Z][a-z]?)(.*)$/.exec(cleaned);
  if (!m) throw unknown(formula);
  const [, first, second, rest] = m;
  const formulaCharge = readChargeSuffix(rest);
  if (formulaCharge === null) throw unknown(formula);
  if (charge !== undefined) {
    if (!Number.isInteger(charge)) throw new RangeError(`charge must be an integer, got ${charge}`);
    if (rest !== '' && formulaCharge !== charge) {
      throw new RangeError(`charge given twice and differently: '${formula}' says ${signed(formulaCharge)}, charge option says ${signed(charge)}`);
    }
  }
  const q = charge ?? formulaCharge;

  let canonical: string;
  let left: string;
  let right: string;
  let scheme: LevelScheme;
  let allowed: number[];
  let capacity: number;
  const notes: string[] = [];
  if (second === '2') {
    if (!HOMONUCLEAR_ELEMENTS.includes(first)) throw unknown(formula);
    canonical = `${first}2`;
    left = right = first;
    scheme = first === 'H' || first === 'He' ? 'one-s' : 'second-period';
    allowed = HOMONUCLEAR_CHARGES;
    capacity = scheme === 'one-s' ? 4 : 20;
    if (SPECIES_NOTES[canonical]) notes.push(SPECIES_NOTES[canonical]);
  } else {
    const direct = HETERONUCLEAR_SPECIES[`${first}${second}`];
    const reversed = HETERONUCLEAR_SPECIES[`${second}${first}`];
    const key = direct ? `${first}${second}` : reversed ? `${second}${first}` : null;
    if (!key) throw unknown(formula);
    const entry = HETERONUCLEAR_SPECIES[key];
    canonical = key;
    left = entry.left;
    right = entry.right;
    scheme = left === 'H' ? 'hydride' : 'heteronuclear';
    allowed = entry.charges;
    capacity = scheme === 'hydride' ? 12 : 20;
    notes.push(...(entry.notes ?? []));
  }
  if (!allowed.includes(q)) {
    throw new RangeError(`${canonical} with charge ${signed(q)} is not drawn; allowed charges: ${allowed.map(signed).join(', ')}`);
  }
  const electronCount = ATOMIC_NUMBER[left] + ATOMIC_NUMBER[right] - q;
  if (electronCount < 1) throw new RangeError(`${canonical} with charge ${signed(q)} has no electrons left to place`);
  if (electronCount > capacity) {
    throw new RangeError(
      `${canonical} with charge ${signed(q)} has ${electronCount} electrons, more than the ${capacity} the levels drawn for ${canonical} hold`,
    );
  }
  const suffix = chargeSuffix(q);
  const displayFormula = second === '2' ? `${first}${SUBSCRIPT_TWO}` : canonical;
  return {
    formula: canonical,
    charge: q,
    species: `${canonical}${suffix.ascii}`,
    display: `${displayFormula}${suffix.unicode}`,
    left,
    right,
    homonuclear: second === '2',
    scheme,
    electronCount,
    notes,
  };
}

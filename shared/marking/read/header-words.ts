/**
 * Reading column headers the way people type them: the unit ("R / Å", "E (eV)",
 * "energy [kJ/mol]", "E in hartree", "E_eV", a units row under the names) and the role
 * (distance, energy, or another quantity such as the overlap S).
 */
import type { DistanceUnit, EnergyUnit } from '@shared/chemistry/units';

export interface UnitWords {
  distance: DistanceUnit | null;
  energy: EnergyUnit | null;
}

const DISTANCE_SPELLINGS: Record<string, DistanceUnit> = {};
const ENERGY_SPELLINGS: Record<string, EnergyUnit> = {};
function spell<U extends string>(table: Record<string, U>, unit: U, words: string[]) {
  for (const w of words) table[w] = unit;
}
spell(DISTANCE_SPELLINGS, 'angstrom', [
  'å', 'a', 'ang', 'ang.', 'angs', 'angs.', 'angstrom', 'angstroms', 'ångström', 'ångströms', 'angström',
  'angströms', 'ångstrom', 'ångstroms', 'angstroem', 'angstroems', 'aa',
]);
spell(DISTANCE_SPELLINGS, 'pm', ['pm', 'picometre', 'picometres', 'picometer', 'picometers']);
spell(DISTANCE_SPELLINGS, 'bohr', ['bohr', 'bohrs', 'a0', 'a_0', 'a.u.', 'au', 'a.u', 'atomicunits', 'atomicunit', 'bohrradius', 'bohrradii']);
spell(ENERGY_SPELLINGS, 'hartree', ['eh', 'e_h', 'ha', 'hartree', 'hartrees', 'a.u.', 'au', 'a.u', 'atomicunits', 'atomicunit']);
spell(ENERGY_SPELLINGS, 'ev', ['ev', 'electronvolt', 'electronvolts', 'electron-volt', 'electron-volts']);
spell(ENERGY_SPELLINGS, 'kj/mol', ['kj/mol', 'kjmol-1', 'kj/mole', 'kjmole-1', 'kjpermol', 'kj/(mol)']);
spell(ENERGY_SPELLINGS, 'kcal/mol', ['kcal/mol', 'kcalmol-1', 'kcal/mole', 'kcalmole-1', 'kcalpermol']);
spell(ENERGY_SPELLINGS, 'cm-1', ['cm-1', '1/cm', 'wavenumber', 'wavenumbers', 'cm**-1', 'cm(-1)', 'kayser']);

/** lower case, superscripts and subscripts flattened, products and spaces removed: "kJ·mol⁻¹" → "kjmol-1" */
export function unitKey(text: string): string {
  return text
    .normalize('NFC')
    .toLowerCase()
    .replace(/\u212b/g, 'å')
    .replace(/[⁻\u2212\u2013]/g, '-')
    .replace(/¹/g, '1')
    .replace(/₀/g, '0')
    .replace(/ₕ/g, 'h')
    .replace(/\^/g, '')
    .replace(/[·⋅∙×*]/g, ' ')
    .replace(/\s+/g, '');
}

/** the unit a piece of text spells on its own, if any ("Å", "kJ mol^-1", "a.u.") */
export function unitFromText(text: string): UnitWords {
  const key = unitKey(text);
  let distance = DISTANCE_SPELLINGS[key] ?? null;
  let energy = ENERGY_SPELLINGS[key] ?? null;
  if (!distance && !energy && key.endsWith('.')) {
    distance = DISTANCE_SPELLINGS[key.slice(0, -1)] ?? null;
    energy = ENERGY_SPELLINGS[key.slice(0, -1)] ?? null;
  }
  if (!distance && !energy && key.endsWith('s')) {
    // plurals not listed ("electronvolts" are)
    energy = ENERGY_SPELLINGS[key.slice(0, -1)] ?? null;
  }
  return { distance, energy };
}

export type HeaderRole = 'distance' | 'energy' | 'other' | null;

export interface HeaderReading {
  /** the header with its unit part removed, trimmed ("R / Å" → "R") */
  name: string;
  units: UnitWords;
  /** text written where a unit belongs that is no unit Bondmark reads ("nm", "mEh") */
  unknownUnit: string | null;
  role: HeaderRole;
  curve: 'bonding' | 'antibonding' | null;
}

const BRACKETS = /\(([^()]*)\)|\[([^[\]]*)\]|\{([^{}]*)\}/g;
const WORD_UNIT_TAIL = /[\s_]+([^\s_]+(?:\s*(?:\/|·|\s)\s*mole?(?:\s*\^?\s*[-⁻−]\s*[1¹])?)?)$/i;

/** splits "E (eV)", "R / Å", "energy [kJ/mol]", "E in hartree", "E_eV", "Å" into name and unit */
export function readHeader(text: string): HeaderReading {
  const original = text.replace(/\s+/g, ' ').trim();
  let name = original;
  let units: UnitWords = { distance: null, energy: null };
  let unknownUnit: string | null = null;
  const found = (u: UnitWords) => u.distance !== null || u.energy !== null;

  // 1. a bracketed unit: "E (eV)", "R [Å]", "E{kcal/mol}"
  for (const match of original.matchAll(BRACKETS)) {
    const inner = (match[1] ?? match[2] ?? match[3] ?? '').trim();
    const u = unitFromText(inner);
    if (found(u)) {
      units = u;
      name = (original.slice(0, match.index) + original.slice((match.index ?? 0) + match[0].length)).trim();
      break;
    }
  }
  // 2. after a slash: "R / Å", "E/kJ/mol" (try each slash from the left)
  if (!found(units)) {
    for (let i = original.indexOf('/'); i >= 0; i = original.indexOf('/', i + 1)) {
      const u = unitFromText(original.slice(i + 1));
      if (found(u)) {
        units = u;
        name = original.slice(0, i).trim();
        break;
      }
      const tail = original.slice(i + 1).trim();
      if (i > 0 && /\s$/.test(original.slice(0, i)) && tail.length > 0 && tail.length <= 8 && !/\s/.test(tail) && unknownUnit === null) {
        unknownUnit = tail;
      }
    }
  }
  // 3. "... in <unit>"
  if (!found(units)) {
    const inMatch = /\s+in\s+(.+)$/i.exec(original);
    if (inMatch) {
      const u = unitFromText(inMatch[1]);
      if (found(u)) {
        units = u;
        name = original.slice(0, inMatch.index).trim();
      }
    }
  }
  // 4. a trailing word or _suffix: "R bohr", "E_eV" (a lone "A" or "h" only counts in brackets)
  if (!found(units)) {
    const tail = WORD_UNIT_TAIL.exec(original);
    if (tail) {
      const key = unitKey(tail[1]);
      if (key !== 'a' && key !== 'h' && key !== 'aa') {
        const u = unitFromText(tail[1]);
        if (found(u)) {
          units = u;
          name = original.slice(0, tail.index).trim();
        }
      }
    }
  }
  // 5. the whole header is a unit: "Å", "eV"
  if (!found(units)) {
    const key = unitKey(original);
    if (key !== 'a' && key !== 'h' && key !== 'aa') {
      const u = unitFromText(original);
      if (found(u)) {
        units = u;
        name = '';
      }
    }
  }
  if (found(units)) unknownUnit = null;
  else if (unknownUnit === null) {
    for (const match of original.matchAll(BRACKETS)) {
      const inner = (match[1] ?? match[2] ?? match[3] ?? '').trim();
      if (/^(nm|m|cm|fm|mm|µm|um|mh|meh|mha|millihartree|ry|rydberg|k|kelvin|j|kj|kcal|mev|j\/mol|cal\/mol|hz|thz|ghz)$/i.test(inner)) {
        unknownUnit = inner;
      }
    }
  }
  let role = roleFromName(name);
  if (role === null && name === '') {
    role = units.distance && !units.energy ? 'distance' : units.energy && !units.distance ? 'energy' : null;
  }
  return { name, units, unknownUnit, role, curve: curveFromName(name || original) };
}

/** lower case, '_' as a space, spaces collapsed; a '-' between letters becomes a space too */
function simplify(name: string): string {
  return name
    .normalize('NFC')
    .toLowerCase()
    .replace(/_+/g, ' ')
    .replace(/(?<=\p{L})-(?=\p{L})/gu, ' ')
    .replace(/\s+/g, ' ')
    .trim();
}

const DISTANCE_NAMES = new Set(['r', 'd', 'x', 'rab', 'r ab', 'r(ab)', 'rhh', 'r hh', 'r(hh)', 'dist', 'dist.', 'distance', 'length', 'bond length', 'bondlength', 'bond distance', 'internuclear distance', 'separation']);
const OTHER_NAMES = new Set([
  's', 'sab', 's ab', 's(r)', 'overlap', 'j', 'k', 'j(r)', 'k(r)', 'coulomb', 'resonance', 'exchange', 'haa', 'hab', 'hbb',
  'zeta', 'ζ', 'exponent', 'index', 'idx', 'no', 'no.', 'nr', 'nr.', 'n', '#', 'i', 'point', 'step', 'number',
  'error', 'residual', 'deviation', 'diff', 'difference', 'weight', 'derivative', 'gradient', 'force', 'ratio', 'c1', 'c2',
]);

export function roleFromName(rawName: string): HeaderRole {
  const name = simplify(rawName);
  if (name === '') return null;
  if (/\b(overlap|integral|zeta|exponent|index|residual|deviation|derivative|gradient|coefficient|force)\b/.test(name)) return 'other';
  if (/d\s*e\s*\/\s*d\s*r/.test(name)) return 'other';
  if (OTHER_NAMES.has(name)) return 'other';
  if (DISTANCE_NAMES.has(name)) return 'distance';
  if (/\b(distance|bond length|bondlength|internuclear|separation)\b/.test(name)) return 'distance';
  if (/^r\s*[(_]?\s*(ab|a b|hh|h h|h2)?\s*[)]?$/.test(name)) return 'distance';
  if (/energ|bonding|potential|gerade|hartree|σ|sigma|\bpes\b|\bmo\b|\bvb\b|\bci\b|\blcao\b|\bexact\b/.test(name)) return 'energy';
  if (/^(e|Δe|δe|de|u|v|y|w|etot|e total|total)\b/.test(name) || /^e\s*[+\-−–±]/.test(name) || /^[eΔδ][\s(_^]/.test(name)) return 'energy';
  return null;
}

export function curveFromName(rawName: string): 'bonding' | 'antibonding' | null {
  const name = simplify(rawName);
  if (/anti ?bonding|ungerade|σ\s*\*|σ\s*u\b|σ\s*u\*|sigma\s*\*|sigma\s*u\b|sigma\*/.test(name)) return 'antibonding';
  if (/^e\s*[_^]?\s*[(\[{]?\s*[-−–]\s*[)\]}]?$/.test(name)) return 'antibonding';
  if (/\bbonding\b|gerade|σ\s*g\b|sigma\s*g\b/.test(name)) return 'bonding';
  if (/^e\s*[_^]?\s*[(\[{]?\s*\+\s*[)\]}]?$/.test(name)) return 'bonding';
  return null;
}

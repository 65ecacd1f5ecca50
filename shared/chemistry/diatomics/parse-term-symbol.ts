/**
 * Reading term symbols of linear molecules as people type them.
 *
 * Accepted (all give the same structured term):
 *   "³Σg⁻", "3Σg-", "3Σ-g", "^3\Sigma_g^-", "^{3}\Sigma_{g}^{-}", "$^3\Sigma^-_g$",
 *   "3Sigma_g^-", "3Sigmag-", "3 sigma g -", "triplet sigma g minus", "Triplet Sigma-g-minus",
 *   "X³Σg⁻" / "X 3Sigma_g-" (a leading state letter X, A, B, …, a, b, … is dropped, with a note).
 * Also: Unicode minus (−), full-width ＋/－, superscript digits, subscript ₂… are normalised;
 * "gerade"/"ungerade", "plus"/"minus"/"positive"/"negative" in word form; multiplicity words
 * singlet … octet. Lenient readings, each reported in `notes`:
 *   lowercase Greek σ π δ φ for Σ Π Δ Φ; Latin capitals S P D F for Σ Π Δ Φ (ASCII shorthand).
 * Rejected with a reason: no multiplicity, no Λ, ± on a Π/Δ/… term, both g and u, anything left over.
 * A Σ term without ± is accepted with reflection null and a note (it then differs from Σ⁺ and Σ⁻).
 */
import { makeTermSymbol, type LambdaName, type Parity, type Reflection, type TermSymbol } from './term-symbol';

export type TermSymbolParseResult =
  | { ok: true; term: TermSymbol; notes: string[] }
  | { ok: false; term: null; reason: string };

const MULTIPLICITY_WORDS: Record<string, number> = {
  singlet: 1,
  doublet: 2,
  triplet: 3,
  quartet: 4,
  quintet: 5,
  sextet: 6,
  septet: 7,
  octet: 8,
};

const LAMBDA_WORDS: Record<string, LambdaName> = { sigma: 'Sigma', pi: 'Pi', delta: 'Delta', phi: 'Phi', gamma: 'Gamma' };
const GREEK_UPPER: Record<string, LambdaName> = { Σ: 'Sigma', Π: 'Pi', Δ: 'Delta', Φ: 'Phi', Γ: 'Gamma' };
const GREEK_LOWER: Record<string, LambdaName> = { σ: 'Sigma', π: 'Pi', δ: 'Delta', φ: 'Phi', ϕ: 'Phi' };
const LATIN_SHORTHAND: Record<string, LambdaName> = { S: 'Sigma', P: 'Pi', D: 'Delta', F: 'Phi' };

const CHARACTER_MAP: Record<string, string> = {
  '⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5', '⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9',
  '₀': '0', '₁': '1', '₂': '2', '₃': '3', '₄': '4', '₅': '5', '₆': '6', '₇': '7', '₈': '8', '₉': '9',
  '⁺': '+', '₊': '+', '＋': '+', '⁻': '-', '₋': '-', '−': '-', '–': '-', '－': '-', '‐': '-',
  'ᵍ': 'g', 'ᵤ': 'u', 'ᵘ': 'u',
};

function normaliseCharacters(text: string): string {
  return [...text.normalize('NFC')].map((ch) => CHARACTER_MAP[ch] ?? ch).join('');
}

function fail(reason: string): TermSymbolParseResult {
  return { ok: false, term: null, reason };
}

/** Parity and reflection from the tail after Λ: only g, u, + and − may remain. */
function readTail(
  tail: string,
): { parity: Parity | null; reflection: Reflection | null } | { error: string } {
  let parity: Parity | null = null;
  let reflection: Reflection | null = null;
  for (const ch of tail) {
    if (ch === 'g' || ch === 'u') {
      if (parity !== null) {
        return { error: parity === ch ? `parity '${ch}' given twice` : "both 'g' and 'u' given; a term has one parity" };
      }
      parity = ch;
    } else if (ch === '+' || ch === '-') {
      if (reflection !== null) {
        return { error: reflection === ch ? `reflection '${ch}' given twice` : "both '+' and '−' given; a Σ term has one reflection symmetry" };
      }
      reflection = ch;
    } else {
      return { error: `unexpected '${ch}' after the Λ symbol (only g, u, + and − may follow)` };
    }
  }
  return { parity, reflection };
}

function build(
  multiplicity: number,
  lambda: LambdaName,
  parity: Parity | null,
  reflection: Reflection | null,
  notes: string[],
): TermSymbolParseResult {
  if (multiplicity < 1) return fail(`multiplicity must be 1 or more (2S + 1), got ${multiplicity}`);
  if (lambda !== 'Sigma' && reflection !== null) {
    return fail(`'${reflection === '+' ? '+' : '−'}' (reflection symmetry) belongs only to Σ terms, not to ${lambda} terms`);
  }
  if (lambda === 'Sigma' && reflection === null) notes.push('no + or − given for the Σ term; reflection left unspecified');
  return { ok: true, term: makeTermSymbol(multiplicity, lambda, parity, reflection), notes };
}

function parseWords(words: string[], notes: string[]): TermSymbolParseResult {
  let multiplicity: number | null = null;
  let lambda: LambdaName | null = null;
  let parityWord = '';
  for (const raw of words) {
    const w = raw.toLowerCase();
    if (w in MULTIPLICITY_WORDS) {
      if (multiplicity !== null) return fail(`more than one multiplicity word ('${raw}')`);
      multiplicity = MULTIPLICITY_WORDS[w];
    } else if (/^\d+$/.test(w)) {
      if (multiplicity !== null) return fail(`more than one multiplicity ('${raw}')`);
      multiplicity = Number(w);
    } else if (w in LAMBDA_WORDS || raw in GREEK_UPPER) {
      if (lambda !== null) return fail(`more than one Λ symbol ('${raw}')`);
      lambda = LAMBDA_WORDS[w] ?? GREEK_UPPER[raw];
    } else if (w === 'g' || w === 'gerade') parityWord += 'g';
    else if (w === 'u' || w === 'ungerade') parityWord += 'u';
    else if (w === 'plus' || w === 'positive' || w === '+') parityWord += '+';
    else if (w === 'minus' || w === 'negative' || w === '-') parityWord += '-';
    else return fail(`unrecognised word '${raw}' in the term symbol`);
  }
  if (multiplicity === null) return fail('no spin multiplicity (e.g. "triplet" or 3) found');
  if (lambda === null) return fail('no Λ symbol (Σ, Π, Δ, Φ or sigma, pi, delta, phi) found');
  const tail = readTail(parityWord);
  if ('error' in tail) return fail(tail.error);
  return build(multiplicity, lambda, tail.parity, tail.reflection, notes);
}

/** Λ symbol at the start of `s`; returns the name and the rest. */
function readLambda(s: string, notes: string[]): { lambda: LambdaName; rest: string } | null {
  const word = /^(sigma|delta|gamma|phi|pi)/i.exec(s);
  if (word) return { lambda: LAMBDA_WORDS[word[1].toLowerCase()], rest: s.slice(word[1].length) };
  const first = s[0];
  if (first in GREEK_UPPER) return { lambda: GREEK_UPPER[first], rest: s.slice(1) };
  if (first in GREEK_LOWER) {
    notes.push(`lowercase '${first}' read as the term symbol ${GREEK_LOWER[first]} (term symbols use capital Greek letters)`);
    return { lambda: GREEK_LOWER[first], rest: s.slice(1) };
  }
  if (first in LATIN_SHORTHAND) {
    notes.push(`Latin '${first}' read as ${LATIN_SHORTHAND[first]} (ASCII shorthand)`);
    return { lambda: LATIN_SHORTHAND[first], rest: s.slice(1) };
  }
  return null;
}

/**
 * Structured term from typed text, or the reason it cannot be read.
 * Returns `{ ok: true, term, notes }` or `{ ok: false, term: null, reason }`.
 */
export function parseTermSymbol(text: string): TermSymbolParseResult {
  if (typeof text !== 'string') return fail('term symbol must be text');
  const notes: string[] = [];
  let s = normaliseCharacters(text).trim();
  if (s === '') return fail('empty term symbol');

  // LaTeX and markup: $…$, \mathrm{…}, \text{…}, \left/\right, braces, ^ and _
  s = s
    .replace(/\$/g, '')
    .replace(/\\+/g, '\\')
    .replace(/\\(mathrm|text|textrm|rm|mathit|it)(?![A-Za-z])/g, '')
    .replace(/\\(Sigma|Pi|Delta|Phi|Gamma|sigma|pi|delta|phi)(?![A-Za-z])/g, (_m, name: string) => name)
    .replace(/\\(pm|mp)(?![A-Za-z])/g, '?')
    .replace(/[{}]/g, '');
  if (/\\/.test(s)) return fail(`unrecognised LaTeX command in '${text}'`);
  if (s.includes('?')) return fail('± is not a term symbol label; give + or −');

  // word form: "triplet sigma g minus", "3 sigma g minus"
  const withoutNames = s.replace(/sigma|delta|gamma|phi|pi|gerade|ungerade/gi, '');
  if (/[a-z]{3,}/i.test(withoutNames)) {
    const words = s
      .replace(/(?<=[a-z\d])-(?=[a-z])/gi, ' ')
      .replace(/[\^_()]/g, ' ')
      .replace(/(\d)(?=[^\d\s])/g, '$1 ')
      .replace(/([+-])/g, ' $1 ')
      .split(/[\s,;/]+/)
      .filter((w) => w !== '');
    return parseWords(words, notes);
  }

  s = s.replace(/[\s^_()]/g, '');
  // a leading state letter (X, A, B, … or a, b, …) followed by the multiplicity
  const state = /^([A-Za-z])~?(?=\d)/.exec(s);
  if (state) {
    notes.push(`state letter '${state[1]}' ignored`);
    s = s.slice(state[0].length);
  }
  const multiplicityMatch = /^(\d+)/.exec(s);
  if (!multiplicityMatch) return fail('no spin multiplicity (2S + 1) in front of the Λ symbol');
  const multiplicity = Number(multiplicityMatch[1]);
  s = s.slice(multiplicityMatch[1].length);
  if (s === '') return fail('no Λ symbol (Σ, Π, Δ, Φ) after the multiplicity');
  const lambda = readLambda(s, notes);
  if (!lambda) return fail(`'${s[0]}' is not a Λ symbol (expected Σ, Π, Δ, Φ or Sigma, Pi, Delta, Phi)`);
  const tail = readTail(lambda.rest);
  if ('error' in tail) return fail(tail.error);
  return build(multiplicity, lambda.lambda, tail.parity, tail.reflection, notes);
}

/**
 * Whether two term symbols are the same term (multiplicity, Λ, parity and reflection all equal).
 * Strings are read with `parseTermSymbol`; an unreadable string equals nothing.
 */
export function termSymbolsEqual(a: TermSymbol | string, b: TermSymbol | string): boolean {
  const ta = typeof a === 'string' ? parseTermSymbol(a).term : a;
  const tb = typeof b === 'string' ? parseTermSymbol(b).term : b;
  if (!ta || !tb) return false;
  return ta.multiplicity === tb.multiplicity && ta.lambda === tb.lambda && ta.parity === tb.parity && ta.reflection === tb.reflection;
}

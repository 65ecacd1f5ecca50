/**
 * Reading a typed MO configuration and comparing it with a diagram's occupations.
 *
 * Accepted (the comparison is by the occupancy of each level, so the order of the terms does not
 * matter):
 * - MO-numbered terms as the diagram labels them: "(1σg)²", "1σg^2", "1σg2", "(1sigma_g)^2",
 *   "1 sigma g 2", "$(1\sigma_g)^2$"; the antibonding star is optional ("2σu*" = "2σu"); heteronuclear
 *   molecules have no g/u ("5σ2 1π4").
 * - valence-label terms: "σ2s² σ*2s² σ2p² π2p⁴ π*2p²" (here the star is what tells σ*2s from σ2s, so
 *   it is required).
 * - the occupancy as a superscript, after ^, or as a plain digit 0–4 right after the orbital.
 * - the core: written out, abbreviated ("KK", "K", "[core]", "[He2]", "[Be2]"), or left out — any
 *   core level not named is taken as filled when no core level is named at all.
 * - numbering from the core (the diagram's own: O2's first valence σg is 2σg) or from the valence
 *   shell only (O2's first valence σg called 1σg): the answer is right when either reading matches.
 * Levels not named are empty. Anything left over that is not a term makes the answer unreadable.
 */
import type { MoDiagram } from '@shared/chemistry/diatomics';

export type ConfigurationReading =
  | { ok: true; matches: boolean; reading: 'core-numbered' | 'valence-numbered' | 'valence-labels' | null }
  | { ok: false; reason: string };

interface Term {
  /** key: "2σg" (numbered, no star) or "σ*2s" (valence label) */
  key: string;
  form: 'numbered' | 'label';
  occupancy: number;
  text: string;
}

const SUPERSCRIPTS: Record<string, string> = { '⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4' };

function normalise(text: string): string {
  return text
    .normalize('NFC')
    .replace(/[⁰¹²³⁴]/g, (c) => `^${SUPERSCRIPTS[c]}`)
    .replace(/\\+/g, '\\')
    .replace(/\$|\\mathrm|\\text|\\left|\\right|[{}]/g, '')
    .replace(/\\?sigma|Σ/gi, 'σ')
    .replace(/\\?pi|Π/gi, 'π')
    .replace(/\\?ast|\u2217|⋆/g, '*')
    .replace(/\^\s*\*/g, '*')
    .replace(/_/g, '');
}

const CORE_MARKERS = /\bKK\b|\bK\b|\[\s*(?:core|He2?|Be2?|Ne2?)\s*\]|\bcore\b/gi;
const NUMBERED = /\(?\s*(\d{1,2})\s*([σπ])\s*(\*?)\s*([gu]?)\s*(\*?)\s*\)?\s*\^?\s*([0-4])/y;
const LABELLED = /\(?\s*([σπ])\s*(\*?)\s*([12])\s*([sp])\s*(\*?)\s*\)?\s*\^?\s*([0-4])/y;
const SEPARATOR = /[\s,;.·+]+/y;

/** Terms of a typed configuration, or why it cannot be read. */
export function readConfigurationTerms(text: string): { terms: Term[]; coreMarker: boolean } | { error: string } {
  let s = normalise(text);
  const coreMarker = CORE_MARKERS.test(s);
  CORE_MARKERS.lastIndex = 0;
  s = s.replace(CORE_MARKERS, ' ');
  const terms: Term[] = [];
  let i = 0;
  while (i < s.length) {
    SEPARATOR.lastIndex = i;
    if (SEPARATOR.exec(s)) { i = SEPARATOR.lastIndex; continue; }
    NUMBERED.lastIndex = i;
    let m = NUMBERED.exec(s);
    if (m) {
      terms.push({ key: `${Number(m[1])}${m[2]}${m[4]}`, form: 'numbered', occupancy: Number(m[6]), text: m[0].trim() });
      i = NUMBERED.lastIndex;
      continue;
    }
    LABELLED.lastIndex = i;
    m = LABELLED.exec(s);
    if (m) {
      const star = m[2] || m[5] ? '*' : '';
      terms.push({ key: `${m[1]}${star}${m[3]}${m[4]}`, form: 'label', occupancy: Number(m[6]), text: m[0].trim() });
      i = LABELLED.lastIndex;
      continue;
    }
    const rest = s.slice(i).trim();
    return { error: `'${rest.length > 20 ? `${rest.slice(0, 20)}…` : rest}' is not an orbital with its electron count` };
  }
  if (terms.length === 0) return { error: 'no orbital with an electron count was found' };
  return { terms, coreMarker };
}

const stripStar = (label: string) => label.replace(/\*/g, '');
const parityOf = (label: string) => (/[gu]$/.test(stripStar(label)) ? stripStar(label).slice(-1) : '');

/** Level index by numbered key, numbering from the core (the diagram's labels) or from the valence shell. */
function numberedKeys(diagram: MoDiagram, fromValence: boolean): Map<string, number> {
  const keys = new Map<string, number>();
  const counters = new Map<string, number>();
  diagram.levels.forEach((level, index) => {
    if (!fromValence) {
      keys.set(stripStar(level.label), index);
      return;
    }
    if (level.core) return;
    const symbol = level.symmetry === 'pi' ? 'π' : 'σ';
    const family = `${symbol}${parityOf(level.label)}`;
    const n = (counters.get(family) ?? 0) + 1;
    counters.set(family, n);
    keys.set(`${n}${family}`, index);
  });
  return keys;
}

function labelKeys(diagram: MoDiagram): Map<string, number> {
  const keys = new Map<string, number>();
  diagram.levels.forEach((level, index) => {
    if (/^[σπ]\*?[12][sp]$/.test(level.valenceLabel)) keys.set(level.valenceLabel, index);
  });
  return keys;
}

function occupanciesFor(diagram: MoDiagram, terms: Term[], numbered: Map<string, number>, labels: Map<string, number>, coreFilledIfUnnamed: boolean): number[] | string {
  const occupancy = diagram.levels.map(() => 0);
  const named = diagram.levels.map(() => false);
  for (const term of terms) {
    const index = term.form === 'numbered' ? numbered.get(term.key) : labels.get(term.key);
    if (index === undefined) return `'${term.text}' is not a level of ${diagram.display}`;
    if (named[index]) return `'${term.text}' names a level twice`;
    named[index] = true;
    occupancy[index] = term.occupancy;
  }
  const anyCoreNamed = diagram.levels.some((l, i) => l.core && named[i]);
  if (!anyCoreNamed && coreFilledIfUnnamed) diagram.levels.forEach((l, i) => { if (l.core) occupancy[i] = l.capacity; });
  return occupancy;
}

/** Reads a typed configuration and says whether it gives every level of `diagram` its occupancy. */
export function compareConfiguration(text: string, diagram: MoDiagram): ConfigurationReading {
  const read = readConfigurationTerms(text);
  if ('error' in read) return { ok: false, reason: read.error };
  const expected = diagram.levels.map((l) => l.occupancy);
  const labels = labelKeys(diagram);
  const readings: ['core-numbered' | 'valence-numbered', Map<string, number>][] = [
    ['core-numbered', numberedKeys(diagram, false)],
    ['valence-numbered', numberedKeys(diagram, true)],
  ];
  let firstProblem: string | null = null;
  let readable = false;
  for (const [name, numbered] of readings) {
    const found = occupanciesFor(diagram, read.terms, numbered, labels, true);
    if (typeof found === 'string') {
      firstProblem ??= found;
      continue;
    }
    readable = true;
    if (found.every((o, i) => o === expected[i])) {
      const onlyLabels = read.terms.every((t) => t.form === 'label');
      return { ok: true, matches: true, reading: onlyLabels ? 'valence-labels' : name };
    }
  }
  if (!readable) return { ok: false, reason: firstProblem ?? 'no level could be matched' };
  return { ok: true, matches: false, reading: null };
}

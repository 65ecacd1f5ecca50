/**
 * Reading typed Hückel orbital energies as x values of E = α + xβ.
 *
 * Accepted, one value per orbital (degenerate orbitals repeated, or each level once):
 * - energies in α and β: "α + 1.618β", "alpha - 0.618 beta", "a+1.618b", "α", "α − β", "α + √2β",
 *   "α + 2√2 β", "E1 = α + 2β";
 * - plain x values: "1.618, 0.618, -0.618, -1.618" or "2 1 1 -1 -1 -2";
 * - separators: comma, semicolon, new line; when the text holds a semicolon or a new line, a comma
 *   between digits is a decimal comma ("1,618; 0,618").
 * β is negative, so bonding levels have x > 0 (the convention of the reference).
 */

export type HuckelEnergiesReading = { ok: true; x: number[] } | { ok: false; reason: string };

function coefficient(text: string): number | null {
  if (text === '' || text === '+') return 1;
  if (text === '-') return -1;
  const m = /^([+-]?)(\d+(?:\.\d+)?)?(?:(?:√|sqrt)\(?(\d+(?:\.\d+)?)\)?)?$/.exec(text);
  if (!m || (m[2] === undefined && m[3] === undefined)) return null;
  const sign = m[1] === '-' ? -1 : 1;
  const factor = m[2] !== undefined ? Number(m[2]) : 1;
  const root = m[3] !== undefined ? Math.sqrt(Number(m[3])) : 1;
  return sign * factor * root;
}

function readItem(raw: string): number | null {
  let s = raw.replace(/\s+/g, '').replace(/^(?:[a-z]\d*|e_?\{?\d*\}?)=/i, '');
  s = s.replace(/alpha|α/gi, 'α').replace(/beta|β/gi, 'β');
  if (/^[+-]?[\d.√]|^sqrt/.test(s) && !/[αβ]/.test(s)) return coefficient(s);
  // bare Latin a/b for alpha/beta, only in the α/β form
  s = s.replace(/^a(?=$|[+-])/i, 'α').replace(/b$/i, 'β');
  if (s === 'α') return 0;
  let m = /^α([+-])(.*)β$/.exec(s);
  if (m) {
    const c = coefficient(m[2].replace(/^\*|\*$/g, '').replace(/^\((.*)\)$/, '$1'));
    return c === null ? null : (m[1] === '-' ? -1 : 1) * c;
  }
  m = /^(.*)β$/.exec(s);
  if (m) return coefficient(m[1].replace(/\*$/, ''));
  return null;
}

export function parseHuckelEnergies(answer: string | number | null | undefined): HuckelEnergiesReading {
  if (typeof answer === 'number') return Number.isFinite(answer) ? { ok: true, x: [answer] } : { ok: false, reason: 'the value is not a number' };
  if (typeof answer !== 'string' || answer.trim() === '') return { ok: false, reason: 'no energies given' };
  let text = answer.normalize('NFKC').replace(/[\u2212\u2013]/g, '-').trim().replace(/^\[|\]$/g, '');
  const decimalComma = /[;\n]/.test(text);
  if (decimalComma) text = text.replace(/(\d),(\d)/g, '$1.$2');
  const symbolic = /α|β|alpha|beta/i.test(text);
  const items = text
    .split(symbolic || decimalComma ? /[,;\n]+/ : /[,;\s]+/)
    .map((s) => s.trim())
    .filter((s) => s !== '');
  if (items.length === 0) return { ok: false, reason: 'no energies given' };
  const x: number[] = [];
  for (const item of items) {
    const value = readItem(item);
    if (value === null || !Number.isFinite(value)) return { ok: false, reason: `'${item}' is not an energy α + xβ or a number x` };
    x.push(value);
  }
  return { ok: true, x };
}

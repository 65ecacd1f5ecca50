/**
 * Reading a typed number answer: a bond order ("2.5", "2,5", "5/2", "2½", "bond order = 2.5")
 * or a count of unpaired electrons ("2", "two", "none"). Plain text rules, no formula.
 */

const NUMBER_WORDS: Record<string, number> = {
  none: 0, zero: 0, no: 0, one: 1, two: 2, three: 3, four: 4, five: 5, six: 6, seven: 7, eight: 8, nine: 9, ten: 10,
};

function clean(text: string): string {
  let s = text.normalize('NFKC').trim().toLowerCase();
  // "bond order = 2.5", "n = 2": keep what follows the last "=" or ":"
  const eq = Math.max(s.lastIndexOf('='), s.lastIndexOf(':'));
  if (eq >= 0) s = s.slice(eq + 1).trim();
  return s.replace(/[\u2212\u2013]/g, '-').replace(/\s+/g, ' ');
}

/** A number typed as decimal (point or comma), fraction, mixed fraction or with ½; null when unreadable. */
export function parseAnswerNumber(answer: string | number | null | undefined): number | null {
  if (typeof answer === 'number') return Number.isFinite(answer) ? answer : null;
  if (typeof answer !== 'string') return null;
  // NFKC turns "½" into "1⁄2" (fraction slash); put the half back first
  let s = clean(answer.replace(/½/g, '.5')).replace(/\u2044/g, '/');
  s = s.replace(/^(\d+)\s*\.5$/, '$1.5');
  if (s === '') return null;
  if (s in NUMBER_WORDS) return NUMBER_WORDS[s];
  if (/^[+-]?\.5$/.test(s)) return Number(s.replace('.5', '0.5'));
  let m = /^([+-]?\d+)(?:[.,](\d+))?$/.exec(s);
  if (m) return Number(`${m[1]}.${m[2] ?? '0'}`);
  m = /^([+-]?\d+)\s*\/\s*(\d+)$/.exec(s);
  if (m && Number(m[2]) !== 0) return Number(m[1]) / Number(m[2]);
  m = /^(\d+) (\d+)\/(\d+)$/.exec(s);
  if (m && Number(m[3]) !== 0) return Number(m[1]) + Number(m[2]) / Number(m[3]);
  return null;
}

/** A whole number (digits or a word from none/zero … ten); null when unreadable or not whole. */
export function parseAnswerCount(answer: string | number | null | undefined): number | null {
  const value = parseAnswerNumber(answer);
  if (value === null || !Number.isInteger(value) || value < 0) return null;
  return value;
}

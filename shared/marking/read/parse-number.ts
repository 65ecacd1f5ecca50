/**
 * Numbers as people and programs write them in data files: 1.25, -1.2e-3, +.5, 1.0D-03 (Fortran),
 * −0.5 (Unicode minus), and with a decimal comma (1,25) when the file uses one.
 */

const POINT_NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eEdD][+-]?\d+)?$/;
const COMMA_NUMBER = /^[+-]?(?:\d+,?\d*|,\d+)(?:[eE][+-]?\d+)?$/;
/** a number that can only be read with a decimal comma: digits, one comma, digits */
const COMMA_DECIMAL = /^[+-]?\d*,\d+(?:[eE][+-]?\d+)?$/;
/** a number with a decimal point and digits on both sides or an exponent */
const POINT_DECIMAL = /^[+-]?\d*\.\d+(?:[eEdD][+-]?\d+)?$/;

/** trims spaces (including no-break and thin spaces) and maps Unicode minus signs to '-' */
export function normalizeNumberText(text: string): string {
  let t = text.trim();
  if (t.length > 0 && (t.charCodeAt(0) === 0x2212 || t.charCodeAt(0) === 0x2013 || t.charCodeAt(0) === 0xfe63 || t.charCodeAt(0) === 0xff0d)) {
    t = '-' + t.slice(1);
  }
  if (/[\u2212\u00a0\u2009\u202f]/.test(t)) t = t.replace(/\u2212/g, '-').replace(/[\u00a0\u2009\u202f]/g, '');
  return t;
}

/** the number the text spells, or null (NaN, Inf and words are not numbers here) */
export function parseNumberText(text: string, decimalComma: boolean): number | null {
  const t = normalizeNumberText(text);
  if (t.length === 0 || t.length > 64) return null;
  if (decimalComma) {
    if (!COMMA_NUMBER.test(t)) return null;
    const value = Number(t.replace(',', '.'));
    return Number.isFinite(value) ? value : null;
  }
  if (!POINT_NUMBER.test(t)) return null;
  const value = Number(/[dD]/.test(t) ? t.replace(/[dD]/, 'e') : t);
  return Number.isFinite(value) ? value : null;
}

export function looksLikeCommaDecimal(text: string): boolean {
  return COMMA_DECIMAL.test(normalizeNumberText(text));
}

export function looksLikePointDecimal(text: string): boolean {
  return POINT_DECIMAL.test(normalizeNumberText(text));
}

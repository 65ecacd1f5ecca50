/**
 * Term symbols of linear molecules, ^(2S+1)Λ_(g/u)^(±), as structured values and as text.
 * Notation as in G. Herzberg, Molecular Spectra and Molecular Structure I: Spectra of Diatomic
 * Molecules, 2nd ed. (1950), ch. V; the reflection label ± is written only on Σ terms.
 */

export type LambdaName = 'Sigma' | 'Pi' | 'Delta' | 'Phi' | 'Gamma';
export type Parity = 'g' | 'u';
export type Reflection = '+' | '-';

export interface TermSymbol {
  /** 2S + 1 */
  multiplicity: number;
  lambda: LambdaName;
  /** 'g' or 'u' for homonuclear molecules (centre of inversion), otherwise null */
  parity: Parity | null;
  /** σv reflection character, only for Σ terms; null for Λ > 0 (or when not stated) */
  reflection: Reflection | null;
  /** Unicode text, e.g. "³Σg⁻" */
  text: string;
}

export const LAMBDA_NAMES: readonly LambdaName[] = ['Sigma', 'Pi', 'Delta', 'Phi', 'Gamma'];
const LAMBDA_GREEK: Record<LambdaName, string> = { Sigma: 'Σ', Pi: 'Π', Delta: 'Δ', Phi: 'Φ', Gamma: 'Γ' };
const SUPERSCRIPT_DIGITS = ['⁰', '¹', '²', '³', '⁴', '⁵', '⁶', '⁷', '⁸', '⁹'];

/** |Λ| of a term name: Σ 0, Π 1, Δ 2, Φ 3, Γ 4. */
export function lambdaValue(name: LambdaName): number {
  return LAMBDA_NAMES.indexOf(name);
}

/** Term name of |Λ| (0 → Sigma …); RangeError beyond Γ (Λ = 4). */
export function lambdaName(lambda: number): LambdaName {
  const name = LAMBDA_NAMES[Math.abs(lambda)];
  if (name === undefined) throw new RangeError(`no term name for Λ = ${lambda} (Bondmark names Σ, Π, Δ, Φ, Γ)`);
  return name;
}

/** Non-negative integer written in Unicode superscript digits. */
export function superscriptNumber(n: number): string {
  return String(n)
    .split('')
    .map((d) => SUPERSCRIPT_DIGITS[Number(d)] ?? d)
    .join('');
}

/** Term symbol with its Unicode text; checks that ± is only given for Σ terms. */
export function makeTermSymbol(
  multiplicity: number,
  lambda: LambdaName | number,
  parity: Parity | null = null,
  reflection: Reflection | null = null,
): TermSymbol {
  if (!Number.isInteger(multiplicity) || multiplicity < 1) {
    throw new RangeError(`multiplicity must be a positive integer (2S + 1), got ${multiplicity}`);
  }
  const name = typeof lambda === 'number' ? lambdaName(lambda) : lambda;
  if (name !== 'Sigma' && reflection !== null) {
    throw new RangeError(`a reflection label (+/−) belongs only to Σ terms, not ${name}`);
  }
  const term = { multiplicity, lambda: name, parity, reflection, text: '' };
  term.text = formatTermSymbol(term, 'unicode');
  return term;
}

export type TermSymbolStyle = 'unicode' | 'ascii' | 'latex';

/**
 * Text of a term: 'unicode' "³Σg⁻", 'ascii' "3Sigma_g^-", 'latex' "^{3}\Sigma_{g}^{-}".
 */
export function formatTermSymbol(term: Omit<TermSymbol, 'text'>, style: TermSymbolStyle = 'unicode'): string {
  const { multiplicity, lambda, parity, reflection } = term;
  if (style === 'unicode') {
    const refl = reflection === '+' ? '⁺' : reflection === '-' ? '⁻' : '';
    return `${superscriptNumber(multiplicity)}${LAMBDA_GREEK[lambda]}${parity ?? ''}${refl}`;
  }
  if (style === 'ascii') {
    return `${multiplicity}${lambda}${parity ? `_${parity}` : ''}${reflection ? `^${reflection}` : ''}`;
  }
  return `^{${multiplicity}}\\${lambda}${parity ? `_{${parity}}` : ''}${reflection ? `^{${reflection}}` : ''}`;
}

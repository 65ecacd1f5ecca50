import { describe, expect, it } from 'vitest';
import {
  enumerateMicrostates,
  formatTermSymbol,
  groundTermFromShells,
  makeTermSymbol,
  parseTermSymbol,
  termsFromShells,
  termSymbolsEqual,
  type OpenShell,
  type TermWithCount,
} from '@shared/chemistry/diatomics';

/** term texts with repeats, in code-point order (compare with `sorted([...])`) */
const texts = (terms: TermWithCount[]) => terms.flatMap((t) => Array.from({ length: t.count }, () => t.term.text)).sort();
const sorted = (list: string[]) => [...list].sort();
const pi = (electrons: number, parity: 'g' | 'u' | null = null): OpenShell => ({ symmetry: 'pi', parity, electrons });
const sigma = (electrons: number, parity: 'g' | 'u' | null = null): OpenShell => ({ symmetry: 'sigma', parity, electrons });

/** number of microstates a term stands for: (2S + 1) spin components × (1 for Σ, 2 for Λ > 0) */
const size = (t: TermWithCount) => t.count * t.term.multiplicity * (t.lambdaValue === 0 ? 1 : 2);

describe('microstate enumeration', () => {
  it('π² has C(4,2) = 6 microstates with M_L ∈ {−2, 0, 2} (computed: combinatorics)', () => {
    const states = enumerateMicrostates([pi(2)]);
    expect(states).toHaveLength(6);
    expect(states.map((s) => s.ml).sort()).toEqual([-2, 0, 0, 0, 0, 2]);
    expect(states.filter((s) => s.ml === 0).map((s) => s.twiceMs).sort()).toEqual([-2, 0, 0, 2]);
  });

  it('closed and empty shells give one microstate with M_L = M_S = 0', () => {
    expect(enumerateMicrostates([pi(4), sigma(2), pi(0)])).toEqual([{ ml: 0, twiceMs: 0, spinOrbitals: expect.any(Array) }]);
  });

  it('rejects impossible occupations', () => {
    expect(() => enumerateMicrostates([sigma(3)])).toThrow(RangeError);
    expect(() => enumerateMicrostates([pi(5)])).toThrow(RangeError);
  });
});

describe('terms of configurations (Herzberg, Spectra of Diatomic Molecules, 1950, Tables 28–29; from memory)', () => {
  it('π² (homonuclear g) → ³Σg⁻, ¹Δg, ¹Σg⁺, Hund order', () => {
    expect(termsFromShells([pi(2, 'g')], { homonuclear: true }).map((t) => t.term.text)).toEqual(['³Σg⁻', '¹Δg', '¹Σg⁺']);
  });

  it('πu² gives g terms too (parity is the product over electrons)', () => {
    expect(termsFromShells([pi(2, 'u')], { homonuclear: true }).map((t) => t.term.text)).toEqual(['³Σg⁻', '¹Δg', '¹Σg⁺']);
  });

  it('π¹ and π³ → ²Π; σ¹ → ²Σ⁺; σ² and π⁴ → ¹Σ⁺', () => {
    expect(texts(termsFromShells([pi(1)], { homonuclear: false }))).toEqual(sorted(['²Π']));
    expect(texts(termsFromShells([pi(3, 'g')], { homonuclear: true }))).toEqual(sorted(['²Πg']));
    expect(texts(termsFromShells([pi(3, 'u')], { homonuclear: true }))).toEqual(sorted(['²Πu']));
    expect(texts(termsFromShells([sigma(1, 'u')], { homonuclear: true }))).toEqual(sorted(['²Σu⁺']));
    expect(texts(termsFromShells([sigma(2)], { homonuclear: false }))).toEqual(sorted(['¹Σ⁺']));
    expect(texts(termsFromShells([], { homonuclear: true }))).toEqual(sorted(['¹Σg⁺']));
  });

  it('σ¹σ¹ → ³Σ⁺, ¹Σ⁺', () => {
    expect(texts(termsFromShells([sigma(1), sigma(1)], { homonuclear: false }))).toEqual(sorted(['¹Σ⁺', '³Σ⁺']));
  });

  it('σ¹π¹ → ³Π, ¹Π', () => {
    expect(texts(termsFromShells([sigma(1), pi(1)], { homonuclear: false }))).toEqual(sorted(['¹Π', '³Π']));
  });

  it('π¹π¹ (non-equivalent) → ¹Σ⁺, ³Σ⁺, ¹Σ⁻, ³Σ⁻, ¹Δ, ³Δ', () => {
    expect(texts(termsFromShells([pi(1), pi(1)], { homonuclear: false }))).toEqual(sorted(['¹Δ', '¹Σ⁺', '¹Σ⁻', '³Δ', '³Σ⁺', '³Σ⁻']));
  });

  it('O2 πu³πg³ → ³Σu⁺, ³Σu⁻, ³Δu, ¹Σu⁺, ¹Σu⁻, ¹Δu (the B³Σu⁻ upper state of the Schumann–Runge bands; from memory)', () => {
    const terms = termsFromShells([pi(3, 'u'), pi(3, 'g')], { homonuclear: true });
    expect(texts(terms)).toEqual(sorted(['³Σu⁺', '³Σu⁻', '³Δu', '¹Σu⁺', '¹Σu⁻', '¹Δu']));
  });

  it('π²σ¹ → ⁴Σ⁻, ²Δ, ²Σ⁺, ²Σ⁻ (Herzberg Table 29; from memory)', () => {
    const terms = termsFromShells([pi(2), sigma(1)], { homonuclear: false });
    expect(texts(terms)).toEqual(sorted(['⁴Σ⁻', '²Δ', '²Σ⁺', '²Σ⁻']));
    expect(terms[0].term.text).toBe('⁴Σ⁻');
  });

  it('π²π² (non-equivalent) reaches Λ = 4 (Γ)', () => {
    const terms = termsFromShells([pi(2), pi(2)], { homonuclear: false });
    expect(terms.some((t) => t.term.lambda === 'Gamma')).toBe(true);
    expect(terms[0].term.text).toBe('⁵Σ⁺'); // Σ⁻ × Σ⁻ gives Σ⁺ (Herzberg, Wigner–Witmer rules; from memory)
  });

  it('terms account for every microstate (Σ: 2S+1 states, Λ > 0: 2(2S+1)) for many configurations', () => {
    const configurations: OpenShell[][] = [];
    for (let a = 0; a <= 4; a++) for (let b = 0; b <= 4; b++) for (let s = 0; s <= 2; s++) configurations.push([pi(a, 'u'), pi(b, 'g'), sigma(s, 'g')]);
    for (const shells of configurations) {
      const terms = termsFromShells(shells, { homonuclear: true });
      expect(terms.reduce((n, t) => n + size(t), 0)).toBe(enumerateMicrostates(shells).length);
      for (const t of terms) expect(t.count).toBeGreaterThan(0);
    }
  });

  it('ground term by Hund: largest S, then largest Λ', () => {
    expect(groundTermFromShells([pi(1), pi(1)], { homonuclear: false }).text).toBe('³Δ');
    expect(groundTermFromShells([pi(2, 'g')], { homonuclear: true }).text).toBe('³Σg⁻');
  });

  it('homonuclear shells need a parity', () => {
    expect(() => termsFromShells([pi(2)], { homonuclear: true })).toThrow(/parity/);
  });
});

describe('term symbol text', () => {
  it('formats Unicode, ASCII and LaTeX', () => {
    const t = makeTermSymbol(3, 'Sigma', 'g', '-');
    expect(t.text).toBe('³Σg⁻');
    expect(formatTermSymbol(t, 'ascii')).toBe('3Sigma_g^-');
    expect(formatTermSymbol(t, 'latex')).toBe('^{3}\\Sigma_{g}^{-}');
    expect(makeTermSymbol(2, 1).text).toBe('²Π');
    expect(makeTermSymbol(12, 'Delta', 'u').text).toBe('¹²Δu');
    expect(() => makeTermSymbol(2, 'Pi', 'g', '+')).toThrow(RangeError);
    expect(() => makeTermSymbol(0, 'Pi')).toThrow(RangeError);
  });
});

describe('parseTermSymbol', () => {
  const tripletSigmaGMinus = [
    '3Σg-',
    '³Σg⁻',
    '^3\\Sigma_g^-',
    '^3\\\\Sigma_g^-', // doubled backslash, as it appears when escaped once too often
    '^{3}\\Sigma_{g}^{-}',
    '$^3\\Sigma^-_g$',
    '^3\\mathrm{\\Sigma}_g^-',
    '3Sigma_g^-',
    '3Sigmag-',
    '3sigma_g^-',
    '3Σ-g',
    '3Σ⁻g',
    '3Σg−',
    ' 3 Σ g - ',
    'X³Σg⁻',
    'X 3Sigma_g-',
    'X^3Σ_g^-',
    'triplet sigma g minus',
    'Triplet Sigma-g-minus',
    'TRIPLET SIGMA GERADE MINUS',
    '3 sigma g minus',
    'triplet Σ g −',
    'triplet sigma minus g',
    '3Sg-',
    '3σg-',
  ];
  it.each(tripletSigmaGMinus)('reads %j as ³Σg⁻', (text) => {
    const r = parseTermSymbol(text);
    expect(r.ok).toBe(true);
    expect(r.term).toMatchObject({ multiplicity: 3, lambda: 'Sigma', parity: 'g', reflection: '-', text: '³Σg⁻' });
  });

  it.each([
    ['2Pi_g', '²Πg'],
    ['doublet pi g', '²Πg'],
    ['²Πg', '²Πg'],
    ['2Πg', '²Πg'],
    ['2 Pi g', '²Πg'],
    ['2Pg', '²Πg'],
    ['2Π', '²Π'],
    ['doublet pi', '²Π'],
    ['1Σ+', '¹Σ⁺'],
    ['¹Σ⁺', '¹Σ⁺'],
    ['1Sigma^+', '¹Σ⁺'],
    ['singlet sigma plus', '¹Σ⁺'],
    ['1Σg+', '¹Σg⁺'],
    ['1Sigma_g^+', '¹Σg⁺'],
    ['singlet sigma g plus', '¹Σg⁺'],
    ['a¹Δg', '¹Δg'],
    ['singlet delta g', '¹Δg'],
    ['1Deltag', '¹Δg'],
    ['²Σu⁺', '²Σu⁺'],
    ['doublet sigma ungerade plus', '²Σu⁺'],
    ['4Σ-', '⁴Σ⁻'],
    ['quartet sigma minus', '⁴Σ⁻'],
    ['3Δu', '³Δu'],
    ['2Phi', '²Φ'],
    ['5Πu', '⁵Πu'],
  ])('reads %j as %s', (text, expected) => {
    const r = parseTermSymbol(text);
    expect(r.ok, JSON.stringify(r)).toBe(true);
    expect(r.term!.text).toBe(expected);
  });

  it('reports lenient readings in notes', () => {
    const latin = parseTermSymbol('3Sg-');
    expect(latin.ok && latin.notes.join(' ')).toMatch(/Latin 'S'/);
    const lower = parseTermSymbol('2πg');
    expect(lower.ok && lower.notes.join(' ')).toMatch(/lowercase/);
    const state = parseTermSymbol('X 1Σg+');
    expect(state.ok && state.notes.join(' ')).toMatch(/state letter 'X'/);
    const noReflection = parseTermSymbol('1Σg');
    expect(noReflection.ok).toBe(true);
    expect(noReflection.term!.reflection).toBeNull();
    expect(noReflection.ok && noReflection.notes.join(' ')).toMatch(/no \+ or −/);
  });

  it.each([
    ['', /empty/],
    ['Σg+', /multiplicity/],
    ['sigma g plus', /multiplicity/],
    ['3', /no Λ/],
    ['3Xg', /not a Λ symbol/],
    ['2Π+', /only to Σ/],
    ['doublet pi plus', /only to Σ/],
    ['3Σgu', /both 'g' and 'u'/],
    ['3Σ+-', /both '\+' and '−'/],
    ['3Σgg', /twice/],
    ['3Σg*', /unexpected/],
    ['triplet blob', /unrecognised word/],
    ['3\\Omega', /LaTeX/],
    ['3Σ\\pm', /±/],
    ['0Σ+', /multiplicity/],
    ['triplet singlet sigma', /more than one/],
  ])('rejects %j with a reason', (text, reason) => {
    const r = parseTermSymbol(text);
    expect(r.ok).toBe(false);
    expect(r.term).toBeNull();
    expect(!r.ok && r.reason).toMatch(reason);
  });

  it('round-trips every formatted term (Unicode, ASCII, LaTeX)', () => {
    for (const multiplicity of [1, 2, 3, 4, 5])
      for (const lambda of ['Sigma', 'Pi', 'Delta', 'Phi'] as const)
        for (const parity of ['g', 'u', null] as const)
          for (const reflection of lambda === 'Sigma' ? (['+', '-'] as const) : ([null] as const)) {
            const t = makeTermSymbol(multiplicity, lambda, parity, reflection);
            for (const style of ['unicode', 'ascii', 'latex'] as const) {
              const r = parseTermSymbol(formatTermSymbol(t, style));
              expect(r.term, `${t.text} ${style}`).toEqual(t);
            }
          }
  });
});

describe('termSymbolsEqual', () => {
  it('compares structured terms and typed text', () => {
    expect(termSymbolsEqual('3Σg-', 'triplet sigma g minus')).toBe(true);
    expect(termSymbolsEqual(makeTermSymbol(3, 'Sigma', 'g', '-'), '^3\\Sigma_g^-')).toBe(true);
    expect(termSymbolsEqual('3Σg-', '3Σg+')).toBe(false);
    expect(termSymbolsEqual('3Σg-', '3Σu-')).toBe(false);
    expect(termSymbolsEqual('3Σg-', '1Σg-')).toBe(false);
    expect(termSymbolsEqual('3Σg-', '3Σ-')).toBe(false); // parity missing is a different answer
    expect(termSymbolsEqual('1Σg', '1Σg+')).toBe(false); // reflection missing is a different answer
    expect(termSymbolsEqual('2Π', '2Δ')).toBe(false);
    expect(termSymbolsEqual('nonsense', 'nonsense')).toBe(false);
  });
});

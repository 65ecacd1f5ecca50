/**
 * Terms of a linear-molecule configuration by enumeration of microstates (determinants).
 *
 * Method (Herzberg, Spectra of Diatomic Molecules, 2nd ed. 1950, ch. VI §1; I. N. Levine,
 * Quantum Chemistry, 7th ed., §13.8 "term symbols of diatomic molecules"):
 * - spin-orbitals: σ has λ = 0, π has λ = +1 and −1; each with ms = ±½;
 * - every way to place the electrons of each open shell is one microstate with
 *   M_L = Σλ and M_S = Σms;
 * - a term ^(2S+1)Λ with Λ > 0 has components M_L = ±Λ, M_S = −S … S; a Σ term only M_L = 0.
 *   Hence the number of terms with (Λ, S) is N(M_L = Λ, M_S = S) − N(M_L = Λ, M_S = S + 1);
 * - Σ⁺ / Σ⁻: the reflection σv through a plane containing the axis maps λ → −λ and commutes
 *   with spin. On the M_L = 0, M_S = M block it permutes determinants (with the sign of the
 *   reordering), so the number of +1 eigenvalues is P(M) = (dim + trace)/2 and the number of
 *   Σ⁺ terms of spin S is P(S) − P(S + 1). The phase convention of the π± orbitals cancels,
 *   because an M_L = 0 determinant holds as many λ = +1 as λ = −1 electrons;
 * - parity (homonuclear): the product of the parities of all electrons, i.e. 'u' when an odd
 *   number of electrons sits in u orbitals (closed shells always give 'g').
 * The ground term follows Hund's rules for molecules: largest S, then largest Λ.
 */
import { makeTermSymbol, type LambdaName, type Parity, type Reflection, type TermSymbol, LAMBDA_NAMES } from './term-symbol';

export type OrbitalSymmetry = 'sigma' | 'pi';

export interface OpenShell {
  symmetry: OrbitalSymmetry;
  /** parity of the orbital for homonuclear molecules; null otherwise */
  parity: Parity | null;
  /** electrons in this shell: 0…2 for σ, 0…4 for π */
  electrons: number;
  /** optional label, only carried into error messages */
  label?: string;
}

export interface Microstate {
  /** M_L = Σλ */
  ml: number;
  /** 2·M_S (an integer) */
  twiceMs: number;
  /** occupied spin-orbitals, each as [shell index, λ, 2·ms] */
  spinOrbitals: Array<[number, number, number]>;
}

export interface TermWithCount {
  term: TermSymbol;
  /** how many times the term occurs in the configuration */
  count: number;
  /** S */
  spin: number;
  /** |Λ| */
  lambdaValue: number;
}

interface SpinOrbital {
  shell: number;
  lambda: number;
  twiceMs: number;
  /** index of the σv image */
  mirror: number;
}

function spinOrbitalsOf(shells: OpenShell[]): { list: SpinOrbital[]; byShell: number[][] } {
  const list: SpinOrbital[] = [];
  const byShell: number[][] = [];
  shells.forEach((shell, s) => {
    const capacity = shell.symmetry === 'sigma' ? 2 : 4;
    if (!Number.isInteger(shell.electrons) || shell.electrons < 0 || shell.electrons > capacity) {
      const name = shell.label ?? `shell ${s}`;
      throw new RangeError(`${name}: a ${shell.symmetry} shell holds 0…${capacity} electrons, got ${shell.electrons}`);
    }
    const start = list.length;
    if (shell.symmetry === 'sigma') {
      list.push({ shell: s, lambda: 0, twiceMs: 1, mirror: start }, { shell: s, lambda: 0, twiceMs: -1, mirror: start + 1 });
    } else {
      // order: λ=+1 α, λ=+1 β, λ=−1 α, λ=−1 β; σv: λ → −λ at the same spin
      list.push(
        { shell: s, lambda: 1, twiceMs: 1, mirror: start + 2 },
        { shell: s, lambda: 1, twiceMs: -1, mirror: start + 3 },
        { shell: s, lambda: -1, twiceMs: 1, mirror: start },
        { shell: s, lambda: -1, twiceMs: -1, mirror: start + 1 },
      );
    }
    byShell.push(Array.from({ length: list.length - start }, (_, i) => start + i));
  });
  return { list, byShell };
}

function combinations(items: number[], k: number): number[][] {
  if (k === 0) return [[]];
  const out: number[][] = [];
  for (let i = 0; i <= items.length - k; i++) {
    for (const rest of combinations(items.slice(i + 1), k - 1)) out.push([items[i], ...rest]);
  }
  return out;
}

/** All determinants (as sorted spin-orbital index lists) of the shells. */
function determinants(shells: OpenShell[], byShell: number[][]): number[][] {
  let result: number[][] = [[]];
  shells.forEach((shell, s) => {
    const choices = combinations(byShell[s], shell.electrons);
    const next: number[][] = [];
    for (const partial of result) for (const choice of choices) next.push([...partial, ...choice]);
    result = next;
  });
  return result;
}

/** Every microstate of the configuration (closed shells contribute M_L = M_S = 0). */
export function enumerateMicrostates(shells: OpenShell[]): Microstate[] {
  const { list, byShell } = spinOrbitalsOf(shells);
  return determinants(shells, byShell).map((det) => ({
    ml: det.reduce((sum, i) => sum + list[i].lambda, 0),
    twiceMs: det.reduce((sum, i) => sum + list[i].twiceMs, 0),
    spinOrbitals: det.map((i) => [list[i].shell, list[i].lambda, list[i].twiceMs] as [number, number, number]),
  }));
}

/** Sign of the permutation that sorts `values` (distinct numbers) ascending. */
function permutationSign(values: number[]): number {
  const a = [...values];
  let sign = 1;
  for (let i = 0; i < a.length; i++) {
    for (let j = 0; j < a.length - 1 - i; j++) {
      if (a[j] > a[j + 1]) {
        [a[j], a[j + 1]] = [a[j + 1], a[j]];
        sign = -sign;
      }
    }
  }
  return sign;
}

/** Hund ordering: larger S first, then larger Λ, then Σ⁻ before Σ⁺ (only to make the order total). */
function hundCompare(a: TermWithCount, b: TermWithCount): number {
  if (a.spin !== b.spin) return b.spin - a.spin;
  if (a.lambdaValue !== b.lambdaValue) return b.lambdaValue - a.lambdaValue;
  const rank = (r: Reflection | null) => (r === '-' ? 0 : r === '+' ? 1 : 2);
  return rank(a.term.reflection) - rank(b.term.reflection);
}

/**
 * All terms arising from the shells, each with its multiplicity of occurrence, sorted by
 * Hund's rules (the first entry is the Hund ground term). `homonuclear` adds g/u labels
 * (every shell must then carry a parity).
 */
export function termsFromShells(shells: OpenShell[], options: { homonuclear: boolean }): TermWithCount[] {
  const { list, byShell } = spinOrbitalsOf(shells);
  let parity: Parity | null = null;
  if (options.homonuclear) {
    let uElectrons = 0;
    shells.forEach((shell, s) => {
      if (shell.parity === null) throw new RangeError(`${shell.label ?? `shell ${s}`}: a homonuclear shell needs a parity (g or u)`);
      if (shell.parity === 'u') uElectrons += shell.electrons;
    });
    parity = uElectrons % 2 === 0 ? 'g' : 'u';
  }

  const dets = determinants(shells, byShell);
  const count = new Map<string, number>();
  // trace of σv on each M_L = 0, M_S block
  const mirrorTrace = new Map<number, number>();
  let maxTwiceMs = 0;
  let maxMl = 0;
  for (const det of dets) {
    const ml = det.reduce((sum, i) => sum + list[i].lambda, 0);
    const twiceMs = det.reduce((sum, i) => sum + list[i].twiceMs, 0);
    maxTwiceMs = Math.max(maxTwiceMs, twiceMs);
    maxMl = Math.max(maxMl, ml);
    count.set(`${ml},${twiceMs}`, (count.get(`${ml},${twiceMs}`) ?? 0) + 1);
    if (ml === 0) {
      const image = det.map((i) => list[i].mirror);
      const sameSet = [...image].sort((x, y) => x - y).every((v, k) => v === det[k]);
      if (sameSet) mirrorTrace.set(twiceMs, (mirrorTrace.get(twiceMs) ?? 0) + permutationSign(image));
    }
  }
  const n = (ml: number, twiceMs: number) => count.get(`${ml},${twiceMs}`) ?? 0;
  const plusCount = (twiceMs: number) => (n(0, twiceMs) + (mirrorTrace.get(twiceMs) ?? 0)) / 2;

  const terms: TermWithCount[] = [];
  const add = (twiceS: number, lambda: number, reflection: Reflection | null, howMany: number) => {
    if (howMany <= 0) return;
    if (lambda >= LAMBDA_NAMES.length) throw new RangeError(`term with Λ = ${lambda} is beyond Γ; not supported`);
    terms.push({
      term: makeTermSymbol(twiceS + 1, lambda as number, parity, reflection),
      count: howMany,
      spin: twiceS / 2,
      lambdaValue: lambda,
    });
  };
  for (let twiceS = maxTwiceMs; twiceS >= 0; twiceS -= 2) {
    for (let lambda = maxMl; lambda >= 1; lambda--) add(twiceS, lambda, null, n(lambda, twiceS) - n(lambda, twiceS + 2));
    const sigmaTotal = n(0, twiceS) - n(0, twiceS + 2);
    const sigmaPlus = plusCount(twiceS) - plusCount(twiceS + 2);
    add(twiceS, 0, '-', sigmaTotal - sigmaPlus);
    add(twiceS, 0, '+', sigmaPlus);
  }
  return terms.sort(hundCompare);
}

/** Hund ground term of the shells (largest S, then largest Λ). */
export function groundTermFromShells(shells: OpenShell[], options: { homonuclear: boolean }): TermSymbol {
  return termsFromShells(shells, options)[0].term;
}

export type { LambdaName };

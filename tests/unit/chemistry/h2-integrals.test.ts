/**
 * Every H2 integral against an independent deterministic quadrature.
 * Prolate spheroidal coordinates about the two protons: λ = (ra + rb)/R,
 * μ = (ra − rb)/R, dV = (R³/8)(λ² − μ²) dλ dμ dφ (Slater, Quantum Theory of
 * Molecules and Solids, vol. 1, 1963, appendix 3). Coulomb-type integrals use
 * the potential of a normalized 1s charge cloud, V(r) = 1/r − (ζ + 1/r)e^(−2ζr)
 * (Gauss's law applied to ζ³/π e^(−2ζr)); the exchange integral, whose charge
 * cloud ab is not spherical about either proton, uses F. Neumann's expansion
 * of 1/r12 in spheroidal coordinates (Rüdenberg, J. Chem. Phys. 19 (1951) 1459):
 *   1/r12 = (2/R) Σ_l (2l + 1) P_l(λ<) Q_l(λ>) P_l(μ1) P_l(μ2) + (terms with m ≠ 0),
 * and the m ≠ 0 terms vanish for densities that do not depend on φ. The
 * overlap density ab = (ζ³/π)e^(−wλ) has μ-moments only for l = 0 and 2, so
 * the sum is finite; the λ1, λ2 integrals and the μ moments are done by
 * Gauss–Legendre panels, nothing in closed form.
 */
import { describe, expect, it } from 'vitest';
import { gaussLegendre, integratePanels } from '@shared/chemistry/numeric';
import { twoElectronIntegrals } from '@shared/chemistry/h2/two-electron-integrals';
import { h2OneElectronIntegrals } from '@shared/chemistry/h2/one-electron-integrals';
import { exchangeIntegral } from '@shared/chemistry/h2/exchange-integral';

type Density = (lambda: number, mu: number) => number;

/** Potential of a normalized 1s Slater density with exponent ζ at distance r (Gauss's law). */
function potentialOf1sCloud(zeta: number, r: number): number {
  return 1 / r - (zeta + 1 / r) * Math.exp(-2 * zeta * r);
}

/** ∫ f dV for an axially symmetric f(ra, rb), spheroidal coordinates, λ = 1 + t. */
function spheroidalIntegral(f: (ra: number, rb: number) => number, distanceBohr: number, zeta: number): number {
  const w = zeta * distanceBohr;
  const tMax = 50 / w;
  const mu = gaussLegendre(64);
  const inner = (t: number): number => {
    const lambda = 1 + t;
    let sum = 0;
    for (let i = 0; i < mu.nodes.length; i++) {
      const m = mu.nodes[i];
      const ra = (distanceBohr * (lambda + m)) / 2;
      const rb = (distanceBohr * (lambda - m)) / 2;
      sum += mu.weights[i] * (lambda * lambda - m * m) * f(ra, rb);
    }
    return sum;
  };
  return ((Math.PI * distanceBohr ** 3) / 4) * integratePanels(inner, 0, tMax, 80, 24);
}

/** Legendre P_l(x), l ≤ 2. */
function legendreP(l: number, x: number): number {
  return l === 0 ? 1 : l === 1 ? x : (3 * x * x - 1) / 2;
}

/**
 * Legendre function of the second kind Q_l(λ), λ > 1, l ≤ 2, given λ and
 * λ − 1 (kept separately so that λ → 1 keeps its digits): closed forms for
 * λ ≤ 2 (Q_0 = ½ ln((λ + 1)/(λ − 1)), A&S 8.4.2, then the recurrence A&S 8.5.3),
 * hypergeometric series Q_l(λ) = l!/((2l+1)!! λ^(l+1)) · 2F1((l+1)/2, (l+2)/2; l + 3/2; 1/λ²)
 * for λ > 2 (A&S 8.1.5), which avoids the cancellation of the closed forms at large λ.
 */
function legendreQ(l: number, lambda: number, lambdaMinusOne: number): number {
  if (lambda <= 2) {
    const q0 = 0.5 * Math.log((2 + lambdaMinusOne) / lambdaMinusOne);
    if (l === 0) return q0;
    const q1 = lambda * q0 - 1;
    if (l === 1) return q1;
    return (3 * lambda * q1 - q0) / 2;
  }
  const z = 1 / (lambda * lambda);
  const a = (l + 1) / 2;
  const b = (l + 2) / 2;
  const c = l + 1.5;
  let term = 1;
  let sum = 1;
  for (let k = 0; k < 400; k++) {
    term *= (((a + k) * (b + k)) / ((c + k) * (k + 1))) * z;
    sum += term;
    if (term < 1e-17 * sum) break;
  }
  const doubleFactorial = [1, 3, 15][l];
  const factorial = [1, 1, 2][l];
  return (factorial / (doubleFactorial * lambda ** (l + 1))) * sum;
}

/** Composite Gauss nodes in t on [0, tMax], geometrically graded towards t = 0 (log singularity of Q_l at λ = 1). */
function gradedPanels(tMax: number): number[] {
  const uniform = 40;
  const h = tMax / uniform;
  const edges = [0];
  for (let k = 24; k >= 1; k--) edges.push(h / 2 ** k);
  for (let k = 1; k <= uniform; k++) edges.push(k * h);
  return edges;
}

/**
 * (ρ1|ρ2) = ∫∫ ρ1(1) ρ2(2)/r12 by the m = 0 part of Neumann's expansion, l = 0…2.
 * Densities as functions of (λ, μ); exact when either density has no μ-moment above l = 2.
 */
function neumannRepulsion(rho1: Density, rho2: Density, distanceBohr: number, zeta: number): number {
  const w = zeta * distanceBohr;
  const tMax = Math.sqrt(50 / w);
  const muRule = gaussLegendre(64);
  const volume = (Math.PI * distanceBohr ** 3) / 4;
  /** μ-moments F_l(λ) = (πR³/4) ∫ (λ² − μ²) ρ(λ, μ) P_l(μ) dμ, l = 0, 1, 2 */
  const moments = (rho: Density, lambda: number): [number, number, number] => {
    const f: [number, number, number] = [0, 0, 0];
    for (let i = 0; i < muRule.nodes.length; i++) {
      const m = muRule.nodes[i];
      const g = muRule.weights[i] * (lambda * lambda - m * m) * rho(lambda, m);
      f[0] += g;
      f[1] += g * m;
      f[2] += g * legendreP(2, m);
    }
    return [f[0] * volume, f[1] * volume, f[2] * volume];
  };
  const n = 20;
  const rule = gaussLegendre(n);
  const edges = gradedPanels(tMax);
  /** ∫_{t0}^{t1} of [F1_l P_l(λ), F1_l Q_l(λ)]·2t dt for l = 0..2 */
  const innerPieces = (t0: number, t1: number): number[] => {
    const out = new Array(6).fill(0);
    const half = (t1 - t0) / 2;
    const mid = (t1 + t0) / 2;
    for (let i = 0; i < n; i++) {
      const t = mid + half * rule.nodes[i];
      const lambda = 1 + t * t;
      const f = moments(rho1, lambda);
      const weight = rule.weights[i] * half * 2 * t;
      for (let l = 0; l <= 2; l++) {
        out[l] += weight * f[l] * legendreP(l, lambda);
        out[3 + l] += weight * f[l] * legendreQ(l, lambda, t * t);
      }
    }
    return out;
  };
  const panelPieces = edges.slice(1).map((t1, k) => innerPieces(edges[k], t1));
  let total = 0;
  for (let k = 0; k + 1 < edges.length; k++) {
    const t0 = edges[k];
    const t1 = edges[k + 1];
    const half = (t1 - t0) / 2;
    const mid = (t1 + t0) / 2;
    for (let i = 0; i < n; i++) {
      const t2 = mid + half * rule.nodes[i];
      const lambda2 = 1 + t2 * t2;
      const below = innerPieces(t0, t2); // ∫ from panel start to t2
      const above = innerPieces(t2, t1); // ∫ from t2 to panel end
      const f2 = moments(rho2, lambda2);
      const weight = rule.weights[i] * half * 2 * t2;
      for (let l = 0; l <= 2; l++) {
        let lower = below[l]; // ∫_1^λ2 F1 P_l
        let upper = above[3 + l]; // ∫_λ2^∞ F1 Q_l
        for (let j = 0; j < k; j++) lower += panelPieces[j][l];
        for (let j = k + 1; j < panelPieces.length; j++) upper += panelPieces[j][3 + l];
        total += weight * (2 * l + 1) * f2[l] * (legendreQ(l, lambda2, t2 * t2) * lower + legendreP(l, lambda2) * upper);
      }
    }
  }
  return (2 / distanceBohr) * total;
}

const geometries = [
  { zeta: 1, distanceBohr: 0.3 }, // shortest distance on a curve grid
  { zeta: 1, distanceBohr: 1.4 },
  { zeta: 1.2, distanceBohr: 1.4 },
  { zeta: 1, distanceBohr: 2.5 },
  { zeta: 0.85, distanceBohr: 6 },
];

describe('H2 one-electron integrals (science.md §1 with Za = Zb = 1) against spheroidal quadrature', () => {
  for (const { zeta, distanceBohr } of geometries) {
    it(`S, Haa, Hab at ζ = ${zeta}, R = ${distanceBohr} bohr to 1e−13`, () => {
      const norm = zeta ** 3 / Math.PI;
      const a = (ra: number) => Math.exp(-zeta * ra);
      const overlap = spheroidalIntegral((ra, rb) => norm * a(ra) * a(rb), distanceBohr, zeta);
      // h φ_a = [−ζ²/2 + ζ/ra − 1/ra − 1/rb] φ_a, since −½∇² e^(−ζr) = (−ζ²/2 + ζ/r) e^(−ζr)
      const haa = spheroidalIntegral(
        (ra, rb) => norm * a(ra) * a(ra) * (-(zeta * zeta) / 2 + (zeta - 1) / ra - 1 / rb),
        distanceBohr,
        zeta,
      );
      const hab = spheroidalIntegral(
        (ra, rb) => norm * a(ra) * a(rb) * (-(zeta * zeta) / 2 + (zeta - 1) / rb - 1 / ra),
        distanceBohr,
        zeta,
      );
      const closed = h2OneElectronIntegrals({ zeta, distanceBohr });
      expect(Math.abs(closed.overlap - overlap)).toBeLessThan(1e-13);
      expect(Math.abs(closed.haa - haa)).toBeLessThan(1e-13);
      expect(Math.abs(closed.hab - hab)).toBeLessThan(1e-13);
    });
  }
});

describe('H2 two-electron integrals against independent quadrature', () => {
  it('(aa|aa) = 5ζ/8 against the radial integral ∫ ρ V dV of one 1s cloud', () => {
    for (const zeta of [0.8, 1, 1.3]) {
      const radial = integratePanels(
        (r) => 4 * Math.PI * r * r * (zeta ** 3 / Math.PI) * Math.exp(-2 * zeta * r) * potentialOf1sCloud(zeta, r),
        0,
        40 / zeta,
        40,
        24,
      );
      const closed = twoElectronIntegrals({ zeta, distanceBohr: 1.4 }).coulombOneCentre;
      expect(Math.abs(closed - radial)).toBeLessThan(1e-12);
    }
  });

  for (const { zeta, distanceBohr } of geometries) {
    it(`(aa|bb) and (aa|ab) at ζ = ${zeta}, R = ${distanceBohr} via the 1s-cloud potential, to 1e−13`, () => {
      const norm = zeta ** 3 / Math.PI;
      const coulombTwoCentre = spheroidalIntegral(
        (ra, rb) => norm * Math.exp(-2 * zeta * ra) * potentialOf1sCloud(zeta, rb),
        distanceBohr,
        zeta,
      );
      const hybrid = spheroidalIntegral(
        (ra, rb) => norm * Math.exp(-zeta * (ra + rb)) * potentialOf1sCloud(zeta, ra),
        distanceBohr,
        zeta,
      );
      const closed = twoElectronIntegrals({ zeta, distanceBohr });
      expect(Math.abs(closed.coulombTwoCentre - coulombTwoCentre)).toBeLessThan(1e-13);
      expect(Math.abs(closed.hybrid - hybrid)).toBeLessThan(1e-13);
    });
  }

  it('the Neumann-expansion quadrature reproduces (aa|ab), which was checked above by the potential route', () => {
    for (const { zeta, distanceBohr } of [geometries[0], geometries[2], geometries[4]]) {
      const w = zeta * distanceBohr;
      const norm = zeta ** 3 / Math.PI;
      const aa: Density = (lambda, mu) => norm * Math.exp(-w * (lambda + mu));
      const ab: Density = (lambda) => norm * Math.exp(-w * lambda);
      const byNeumann = neumannRepulsion(aa, ab, distanceBohr, zeta);
      expect(Math.abs(byNeumann - twoElectronIntegrals({ zeta, distanceBohr }).hybrid)).toBeLessThan(1e-13);
    }
  });

  for (const { zeta, distanceBohr } of [...geometries, { zeta: 1, distanceBohr: 1 }, { zeta: 1.1, distanceBohr: 10 }]) {
    it(`(ab|ab) (Sugiura) at ζ = ${zeta}, R = ${distanceBohr} via the Neumann expansion, to 1e−13`, () => {
      const w = zeta * distanceBohr;
      const norm = zeta ** 3 / Math.PI;
      const ab: Density = (lambda) => norm * Math.exp(-w * lambda);
      const byNeumann = neumannRepulsion(ab, ab, distanceBohr, zeta);
      const closed = twoElectronIntegrals({ zeta, distanceBohr }).exchange;
      expect(Math.abs(closed - byNeumann)).toBeLessThan(1e-13);
      // relative agreement too: at R = 10 the integral itself is only ~1e−6 hartree
      expect(Math.abs(closed - byNeumann) / closed).toBeLessThan(1e-11);
    });
  }
});

describe('H2 two-electron integrals at short and long range', () => {
  it('tend to the united-atom value 5ζ/8 as w → 0 without cancellation loss', () => {
    const zeta = 1.3;
    for (const w of [1e-8, 1e-5, 1e-3]) {
      const integrals = twoElectronIntegrals({ zeta, distanceBohr: w / zeta });
      // Taylor expansions of the closed forms of science.md §3 (derived here):
      // (aa|bb) = ζ(5/8 − w²/12 + O(w³)), (aa|ab) = ζ(5/8 − 7w²/48 + O(w³))
      expect(Math.abs(integrals.coulombTwoCentre - zeta * (5 / 8 - (w * w) / 12))).toBeLessThan(1e-15 + zeta * w ** 3);
      expect(Math.abs(integrals.hybrid - zeta * (5 / 8 - (7 * w * w) / 48))).toBeLessThan(1e-15 + zeta * w ** 3);
      // (ab|ab) = 5ζ/8 + O(w²); unguarded, Sugiura's form loses ~1e−7 at w = 1e−8 (6|ln w|/w · 1e−16)
      expect(Math.abs(integrals.exchange - (5 * zeta) / 8)).toBeLessThan(1e-15 + zeta * w * w);
      expect(integrals.exchange).toBeLessThanOrEqual((5 * zeta) / 8);
    }
  });

  it('keep the ordering (aa|aa) > (aa|bb) > (aa|ab) > (ab|ab) > 0 at every distance', () => {
    for (const w of [1e-3, 0.05, 0.3, 1, 3, 10]) {
      const integrals = twoElectronIntegrals({ zeta: 1, distanceBohr: w });
      expect(integrals.coulombOneCentre).toBeGreaterThan(integrals.coulombTwoCentre);
      expect(integrals.coulombTwoCentre).toBeGreaterThan(integrals.hybrid);
      expect(integrals.hybrid).toBeGreaterThan(integrals.exchange);
      expect(integrals.exchange).toBeGreaterThan(0);
    }
  });

  it('(ab|ab): the short-range and scaled forms of Sugiura’s formula agree where they meet (w = 1)', () => {
    // exchangeIntegral switches form at w = 1; the slope there is about −0.2886 ζ (computed, regression)
    const left = exchangeIntegral(1, 1);
    const right = exchangeIntegral(1, 1 + 1e-9);
    expect(Math.abs((right - left) / 1e-9 + 0.2886)).toBeLessThan(1e-3);
  });

  it('at large R: (aa|bb) → 1/R, hybrid and exchange vanish, nothing overflows', () => {
    for (const distanceBohr of [30, 200, 1000]) {
      const integrals = twoElectronIntegrals({ zeta: 1, distanceBohr });
      expect(Math.abs(integrals.coulombTwoCentre - 1 / distanceBohr)).toBeLessThan(1e-12);
      expect(integrals.hybrid).toBeGreaterThanOrEqual(0);
      expect(integrals.hybrid).toBeLessThan(1e-10);
      expect(integrals.exchange).toBeGreaterThanOrEqual(0);
      expect(integrals.exchange).toBeLessThan(1e-20);
      expect(Number.isFinite(integrals.exchange)).toBe(true);
    }
  });

  it('rejects a non-positive distance or exponent', () => {
    expect(() => twoElectronIntegrals({ zeta: 1, distanceBohr: 0 })).toThrow(RangeError);
    expect(() => twoElectronIntegrals({ zeta: -1, distanceBohr: 1 })).toThrow(RangeError);
  });
});


/**
 * Gauss–Legendre quadrature. Nodes and weights by Newton iteration on the
 * Legendre recurrence (Press et al., Numerical Recipes, 3rd ed., §4.6, gauleg).
 */
export interface QuadratureRule {
  nodes: Float64Array;
  weights: Float64Array;
}

const cache = new Map<number, QuadratureRule>();

/** n-point Gauss–Legendre rule on [-1, 1]; cached per n. */
export function gaussLegendre(n: number): QuadratureRule {
  const hit = cache.get(n);
  if (hit) return hit;
  if (!Number.isInteger(n) || n < 1) throw new RangeError(`gaussLegendre: n must be a positive integer, got ${n}`);
  const nodes = new Float64Array(n);
  const weights = new Float64Array(n);
  const m = Math.floor((n + 1) / 2);
  for (let i = 0; i < m; i++) {
    let z = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let pp = 0;
    for (let iter = 0; iter < 100; iter++) {
      let p1 = 1;
      let p2 = 0;
      for (let j = 1; j <= n; j++) {
        const p3 = p2;
        p2 = p1;
        p1 = ((2 * j - 1) * z * p2 - (j - 1) * p3) / j;
      }
      pp = (n * (z * p1 - p2)) / (z * z - 1);
      const z1 = z;
      z = z1 - p1 / pp;
      if (Math.abs(z - z1) < 1e-15) break;
    }
    nodes[i] = -z;
    nodes[n - 1 - i] = z;
    weights[i] = 2 / ((1 - z * z) * pp * pp);
    weights[n - 1 - i] = weights[i];
  }
  const rule = { nodes, weights };
  cache.set(n, rule);
  return rule;
}

/** ∫_a^b f(x) dx with an n-point Gauss–Legendre rule. */
export function integrate(f: (x: number) => number, a: number, b: number, n = 64): number {
  const { nodes, weights } = gaussLegendre(n);
  const half = (b - a) / 2;
  const mid = (a + b) / 2;
  let sum = 0;
  for (let i = 0; i < n; i++) sum += weights[i] * f(mid + half * nodes[i]);
  return sum * half;
}

/** ∫_a^b f over `panels` equal sub-intervals, each with an n-point rule (for peaked integrands). */
export function integratePanels(f: (x: number) => number, a: number, b: number, panels: number, n = 32): number {
  const h = (b - a) / panels;
  let sum = 0;
  for (let k = 0; k < panels; k++) sum += integrate(f, a + k * h, a + (k + 1) * h, n);
  return sum;
}

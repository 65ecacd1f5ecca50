import { describe, expect, it } from 'vitest';
import { huckelChain, huckelGraph, huckelRing, STREITWIESER_PARAMETERS, type HuckelGraphInput } from '@shared/chemistry/huckel';

const TOL = 1e-12; // dimensionless x (units of β); double-precision eigenvalues of small matrices

const ring = (n: number, types: string[] = []): HuckelGraphInput => ({
  atoms: Array.from({ length: n }, (_, i) => ({ type: types[i] ?? 'C' })),
  bonds: Array.from({ length: n }, (_, i) => ({ from: i, to: (i + 1) % n })),
});

/** naphthalene: ring 0-1-2-3-4-9 and ring 4-5-6-7-8-9, fusion bond 4–9 */
const naphthalene: HuckelGraphInput = {
  atoms: Array.from({ length: 10 }, () => ({})),
  bonds: [[0, 1], [1, 2], [2, 3], [3, 4], [4, 9], [9, 0], [4, 5], [5, 6], [6, 7], [7, 8], [8, 9]].map(([from, to]) => ({ from, to })),
};

describe('closed forms', () => {
  it('chains N = 2 … 30: x_k = 2cos(kπ/(N+1)) (Coulson 1939)', () => {
    for (let n = 2; n <= 30; n++) {
      const expected = Array.from({ length: n }, (_, k) => 2 * Math.cos(((k + 1) * Math.PI) / (n + 1)));
      const x = huckelChain(n).xValues;
      expect(x).toHaveLength(n);
      x.forEach((value, k) => expect(Math.abs(value - expected[k]), `N=${n} k=${k + 1}`).toBeLessThan(TOL));
    }
  });

  it('chain coefficients c_rk = √(2/(N+1))·sin(rkπ/(N+1)) with the first one positive (Coulson 1939)', () => {
    for (const n of [2, 3, 5, 8, 13, 30]) {
      const { orbitals } = huckelChain(n);
      orbitals.forEach((o, i) => {
        const k = i + 1;
        o.coefficients.forEach((c, r) => {
          const expected = Math.sqrt(2 / (n + 1)) * Math.sin(((r + 1) * k * Math.PI) / (n + 1));
          expect(Math.abs(c - expected), `N=${n} k=${k} r=${r + 1}`).toBeLessThan(1e-10);
        });
      });
    }
  });

  it('rings N = 3 … 30: x = 2cos(2πk/N), with the degeneracies of the closed form (Hückel 1931)', () => {
    for (let n = 3; n <= 30; n++) {
      const expected = Array.from({ length: n }, (_, k) => 2 * Math.cos((2 * Math.PI * k) / n)).sort((a, b) => b - a);
      const result = huckelRing(n);
      result.xValues.forEach((value, k) => expect(Math.abs(value - expected[k]), `N=${n} #${k}`).toBeLessThan(TOL));
      // pairs k and N−k are degenerate: ⌊(N−1)/2⌋ pairs
      const pairs = result.degenerateSets.filter((s) => s.indices.length === 2).length;
      expect(pairs, `N=${n}`).toBe(Math.floor((n - 1) / 2));
      expect(result.degenerateSets.every((s) => s.indices.length <= 2)).toBe(true);
    }
  });

  it('orbitals are orthonormal for chains and rings (computed: property of the eigenvectors)', () => {
    for (const result of [huckelChain(7), huckelRing(12), huckelGraph(naphthalene)]) {
      const c = result.orbitals.map((o) => o.coefficients);
      for (let i = 0; i < c.length; i++)
        for (let j = 0; j < c.length; j++) {
          const dot = c[i].reduce((s, v, r) => s + v * c[j][r], 0);
          expect(Math.abs(dot - (i === j ? 1 : 0))).toBeLessThan(1e-12);
        }
    }
  });
});

describe('textbook molecules (values from memory: e.g. Streitwieser 1961, Yates 1978, Atkins)', () => {
  it('butadiene: x = ±1.618, ±0.618; E_π = 4α + 4.472β; DE 0.472β; p12 = 0.894, p23 = 0.447', () => {
    const r = huckelChain(4);
    expect(r.xValues.map((x) => +x.toFixed(3))).toEqual([1.618, 0.618, -0.618, -1.618]);
    expect(r.totalPiEnergyBeta).toBeCloseTo(2 * (1.6180339887 + 0.6180339887), 9); // = 2√5, closed form
    expect(r.delocalizationEnergyBeta).toBeCloseTo(0.472, 3);
    expect(r.bondOrders.map((b) => +b.order.toFixed(3))).toEqual([0.894, 0.447, 0.894]);
    expect(r.homoLumoGapBeta).toBeCloseTo(1.236, 3);
    expect(r.orbitals[r.homoIndex!].x).toBeCloseTo(0.618, 3);
    expect(r.orbitals[r.lumoIndex!].x).toBeCloseTo(-0.618, 3);
  });

  it('benzene: x = 2, 1, 1, −1, −1, −2; E_π = 6α + 8β; DE 2β; p = 2/3; gap 2β', () => {
    const r = huckelRing(6);
    const expected = [2, 1, 1, -1, -1, -2];
    r.xValues.forEach((x, i) => expect(Math.abs(x - expected[i])).toBeLessThan(TOL));
    expect(r.degenerateSets.map((s) => s.indices.length)).toEqual([1, 2, 2, 1]);
    expect(r.totalPiEnergyBeta).toBeCloseTo(8, 12);
    expect(r.delocalizationEnergyBeta).toBeCloseTo(2, 12);
    for (const b of r.bondOrders) expect(b.order).toBeCloseTo(2 / 3, 12);
    expect(r.homoLumoGapBeta).toBeCloseTo(2, 12);
    expect(r.localizedReference.doubleBonds).toHaveLength(3);
  });

  it('benzene degenerate orbitals get the textbook real basis: (2,1,−1,−2,−1,1)/√12 and (0,1,1,0,−1,−1)/2', () => {
    const r = huckelRing(6);
    const s12 = Math.sqrt(12);
    const e1 = [2, 1, -1, -2, -1, 1].map((v) => v / s12);
    const e2 = [0, 1, 1, 0, -1, -1].map((v) => v / 2);
    r.orbitals[1].coefficients.forEach((c, i) => expect(c).toBeCloseTo(e1[i], 12));
    r.orbitals[2].coefficients.forEach((c, i) => expect(c).toBeCloseTo(e2[i], 12));
  });

  it('allyl: x = √2, 0, −√2; DE 0.828β for cation, radical and anion; charges of the ions', () => {
    for (const charge of [1, 0, -1]) {
      const r = huckelChain(3, { charge });
      expect(r.xValues[0]).toBeCloseTo(Math.SQRT2, 12);
      expect(Math.abs(r.xValues[1])).toBeLessThan(TOL);
      expect(r.xValues[2]).toBeCloseTo(-Math.SQRT2, 12);
      expect(r.electronCount).toBe(3 - charge);
      expect(r.delocalizationEnergyBeta).toBeCloseTo(2 * Math.SQRT2 - 2, 12);
      for (const b of r.bondOrders) expect(b.order).toBeCloseTo(Math.SQRT1_2, 12);
    }
    const cation = huckelChain(3, { charge: 1 });
    expect(cation.netCharges.map((q) => +q.toFixed(6))).toEqual([0.5, 0, 0.5]);
    const anion = huckelChain(3, { electrons: 4 });
    expect(anion.charge).toBe(-1);
    expect(anion.netCharges.map((q) => +q.toFixed(6))).toEqual([-0.5, 0, -0.5]);
    const radical = huckelChain(3);
    expect(radical.unpairedElectrons).toBe(1);
    expect(radical.openShell).toBe(true);
    expect(radical.homoLumoGapBeta).toBe(0);
    expect(radical.orbitals[radical.homoIndex!].x).toBeCloseTo(0, 12);
  });

  it('cyclobutadiene: degenerate nonbonding pair half filled, two unpaired electrons, gap 0, DE 0', () => {
    const r = huckelRing(4);
    expect(r.unpairedElectrons).toBe(2);
    expect(r.openShell).toBe(true);
    expect(r.homoLumoGapBeta).toBe(0);
    expect(r.orbitals[1].occupancy).toBe(1);
    expect(r.orbitals[2].occupancy).toBe(1);
    expect(r.orbitals[r.homoIndex!].degenerateSet).toBe(r.orbitals[r.lumoIndex!].degenerateSet);
    expect(r.delocalizationEnergyBeta).toBeCloseTo(0, 12);
    // equal sharing keeps the density symmetric whatever basis the degenerate pair has
    for (const q of r.piElectronDensity) expect(q).toBeCloseTo(1, 12);
    for (const b of r.bondOrders) expect(b.order).toBeCloseTo(0.5, 12);
  });

  it('benzene radical anion: 7 electrons share the e2u pair equally, one unpaired, symmetric charges', () => {
    const r = huckelRing(6, { charge: -1 });
    expect(r.orbitals[3].occupancy).toBe(0.5);
    expect(r.orbitals[4].occupancy).toBe(0.5);
    expect(r.unpairedElectrons).toBe(1);
    for (const q of r.netCharges) expect(q).toBeCloseTo(-1 / 6, 12);
  });

  it('cyclopentadienyl anion DE 2.47β and tropylium cation DE 2.99β', () => {
    expect(huckelRing(5, { charge: -1 }).delocalizationEnergyBeta).toBeCloseTo(2.472, 3);
    expect(huckelRing(7, { charge: 1 }).delocalizationEnergyBeta).toBeCloseTo(2.988, 3);
  });

  it('naphthalene: E_π = 10α + 13.683β, DE 3.683β, HOMO x = 0.618', () => {
    const r = huckelGraph(naphthalene);
    expect(r.totalPiEnergyBeta).toBeCloseTo(13.683, 3);
    expect(r.delocalizationEnergyBeta).toBeCloseTo(3.683, 3);
    expect(r.orbitals[r.homoIndex!].x).toBeCloseTo(0.618, 3);
    expect(r.bondOrders[0].order).toBeCloseTo(0.725, 3); // C1–C2 bond order 0.725
  });

  it('alternant hydrocarbons have uniform π densities of 1 (Coulson–Rushbrooke pairing theorem)', () => {
    for (const r of [huckelChain(5), huckelChain(8), huckelRing(10), huckelGraph(naphthalene)]) {
      for (const q of r.piElectronDensity) expect(q).toBeCloseTo(1, 12);
      // paired x values ±x
      const x = r.xValues;
      x.forEach((v, i) => expect(v + x[x.length - 1 - i]).toBeCloseTo(0, 12));
    }
  });

  it('trimethylenemethane (non-Kekulé): the matching has one double bond only, DE = 2√3 − 2', () => {
    const r = huckelGraph({ atoms: [{}, {}, {}, {}], bonds: [{ from: 0, to: 1 }, { from: 0, to: 2 }, { from: 0, to: 3 }] });
    expect(r.localizedReference.doubleBonds).toHaveLength(1);
    expect(r.totalPiEnergyBeta).toBeCloseTo(2 * Math.sqrt(3), 12);
    expect(r.delocalizationEnergyBeta).toBeCloseTo(2 * Math.sqrt(3) - 2, 12);
    expect(r.unpairedElectrons).toBe(2);
  });
});

describe('heteroatoms', () => {
  it('exports the Streitwieser table with its source', () => {
    expect(STREITWIESER_PARAMETERS.source).toMatch(/Streitwieser/);
    expect(STREITWIESER_PARAMETERS.atomTypes['N-pyridine']).toMatchObject({ h: 0.5, k: 1, piElectrons: 1 }); // Streitwieser 1961, from memory
    expect(STREITWIESER_PARAMETERS.atomTypes['N-pyrrole']).toMatchObject({ h: 1.5, k: 0.8, piElectrons: 2 }); // Streitwieser 1961, from memory
    expect(STREITWIESER_PARAMETERS.atomTypes['O-carbonyl']).toMatchObject({ h: 1, k: 1, piElectrons: 1 }); // Streitwieser 1961, from memory
  });

  it('formaldehyde C=O (h_O = 1, k = 1): x = (1 ± √5)/2 = 1.618, −0.618 (closed form of the 2×2 problem)', () => {
    const r = huckelGraph({ atoms: [{ type: 'C' }, { type: 'O-carbonyl' }], bonds: [{ from: 0, to: 1 }] });
    expect(r.xValues[0]).toBeCloseTo((1 + Math.sqrt(5)) / 2, 12);
    expect(r.xValues[1]).toBeCloseTo((1 - Math.sqrt(5)) / 2, 12);
    // q_O = 2c_O² with c_O² = x²/(1 + x²) at x = 1.618 (closed form): O carries negative π charge
    const x = (1 + Math.sqrt(5)) / 2;
    expect(r.piElectronDensity[1]).toBeCloseTo((2 * x * x) / (1 + x * x), 12);
    expect(r.netCharges[1]).toBeLessThan(0);
    expect(r.delocalizationEnergyBeta).toBeCloseTo(0, 12); // a single localized bond is the whole system
  });

  it('pyridine (h_N = 0.5, k_CN = 1): eigenvalues checked against an independent symmetry factorisation (computed)', () => {
    const r = huckelGraph(ring(6, ['N-pyridine']));
    // computed (regression): x values of this implementation
    const regression = [2.1074, 1.1672, 1.0, -0.841, -1.0, -1.9337];
    r.xValues.forEach((x, i) => expect(x).toBeCloseTo(regression[i], 4));
    // independent check: under the mirror through N1 and C4 the matrix splits into an
    // antisymmetric block [[0,1],[1,0]] (x = ±1 exactly) and a symmetric tridiagonal block
    // with diagonal (0.5, 0, 0, 0) and off-diagonal (√2, 1, √2); its characteristic
    // polynomial by the three-term recurrence must vanish at the other four x.
    const diag = [0.5, 0, 0, 0];
    const off = [Math.SQRT2, 1, Math.SQRT2];
    const charPoly = (x: number) => {
      let p0 = 1;
      let p1 = diag[0] - x;
      for (let k = 1; k < 4; k++) [p0, p1] = [p1, (diag[k] - x) * p1 - off[k - 1] ** 2 * p0];
      return p1;
    };
    const symmetric = r.xValues.filter((x) => Math.abs(Math.abs(x) - 1) > 1e-9);
    expect(symmetric).toHaveLength(4);
    for (const x of symmetric) expect(Math.abs(charPoly(x))).toBeLessThan(1e-12);
    expect(r.xValues.filter((x) => Math.abs(Math.abs(x) - 1) < 1e-12)).toHaveLength(2);
    // invariants: Σx = trace = h_N; Σx² = trace(M²) = h_N² + 2·Σk²
    expect(r.xValues.reduce((s, x) => s + x, 0)).toBeCloseTo(0.5, 12);
    expect(r.xValues.reduce((s, x) => s + x * x, 0)).toBeCloseTo(0.25 + 12, 12);
    // N attracts π density; total density = 6 electrons
    expect(r.piElectronDensity[0]).toBeGreaterThan(1);
    expect(r.piElectronDensity.reduce((s, q) => s + q, 0)).toBeCloseTo(6, 12);
    expect(r.electronCount).toBe(6);
  });

  it('pyrrole: N gives two π electrons and ends with positive net π charge; the N stays out of the localized double bonds', () => {
    const r = huckelGraph(ring(5, ['N-pyrrole']));
    expect(r.electronCount).toBe(6);
    expect(r.bonds[0].k).toBe(0.8); // C–N(pyrrole) k from the table
    expect(r.netCharges[0]).toBeGreaterThan(0);
    expect(r.netCharges.reduce((s, q) => s + q, 0)).toBeCloseTo(0, 12);
    expect(r.localizedReference.doubleBonds.flat()).not.toContain(0);
    // localized: two C=C (x = 1) and the N lone pair (x = h = 1.5): 2·2·1 + 2·1.5 = 7
    expect(r.localizedReference.energyBeta).toBeCloseTo(7, 12);
  });

  it('explicit h, k and edited parameter tables change the matrix', () => {
    const edited = huckelGraph({ ...ring(6, ['N-pyridine']), parameters: { atomTypes: { 'N-pyridine': { h: 0.6 } } } });
    expect(edited.matrix[0][0]).toBe(0.6);
    expect(edited.parametersSource).toMatch(/edited/);
    const perAtom = huckelGraph({ atoms: [{ h: 0.3 }, {}], bonds: [{ from: 0, to: 1, k: 1.2 }] });
    expect(perAtom.matrix).toEqual([[0.3, 1.2], [1.2, 0]]);
    const custom = huckelGraph({
      atoms: [{ type: 'Me' }, {}],
      bonds: [{ from: 0, to: 1 }],
      parameters: { atomTypes: { Me: { h: 2, k: 0.7, piElectrons: 2 } } },
    });
    expect(custom.matrix).toEqual([[2, 0.7], [0.7, 0]]);
    expect(custom.electronCount).toBe(3);
  });

  it('hetero–hetero bonds without a table entry use k = 1 with a note; bondK sets them', () => {
    const pyridazine = ring(6, ['N-pyridine', 'N-pyridine']);
    const plain = huckelGraph(pyridazine);
    expect(plain.bonds[0].k).toBe(1);
    expect(plain.notes.join(' ')).toMatch(/bonds\[0\].*k = 1 used/);
    const set = huckelGraph({ ...pyridazine, parameters: { bondK: { 'N-pyridine|N-pyridine': 1.1 } } });
    expect(set.bonds[0].k).toBe(1.1);
    expect(set.notes).toHaveLength(0);
  });

  it('bonds typed double define the localized reference', () => {
    // butadiene with the Kekulé structure marked: same result as the automatic matching
    const marked = huckelGraph({
      atoms: [{}, {}, {}, {}],
      bonds: [{ from: 0, to: 1, type: 'double' }, { from: 1, to: 2, type: 'single' }, { from: 2, to: 3, type: 'double' }],
    });
    expect(marked.localizedReference.method).toBe('marked');
    expect(marked.delocalizationEnergyBeta).toBeCloseTo(huckelChain(4).delocalizationEnergyBeta, 12);
    // a deliberately poor structure (one double bond) gives a larger DE
    const poor = huckelGraph({ atoms: [{}, {}, {}, {}], bonds: [{ from: 0, to: 1 }, { from: 1, to: 2, type: 'double' }, { from: 2, to: 3 }] });
    expect(poor.localizedReference.doubleBonds).toEqual([[1, 2]]);
    expect(poor.localizedReference.energyBeta).toBeCloseTo(2, 12); // 2 electrons at x = 1, 2 at x = 0
  });
});

describe('general behaviour', () => {
  it('sorts x descending (lowest energy first, β < 0) and labels character', () => {
    const r = huckelChain(5);
    for (let i = 1; i < r.xValues.length; i++) expect(r.xValues[i]).toBeLessThan(r.xValues[i - 1]);
    expect(r.orbitals.map((o) => o.character)).toEqual(['bonding', 'bonding', 'nonbonding', 'antibonding', 'antibonding']);
  });

  it('fixes degenerate bases canonically: the first member carries atom 0, the second is zero there (rings N = 5 … 12)', () => {
    for (let n = 5; n <= 12; n++) {
      const r = huckelRing(n);
      for (const set of r.degenerateSets.filter((s) => s.indices.length === 2)) {
        const [first, second] = set.indices.map((i) => r.orbitals[i].coefficients);
        expect(first[0], `N=${n}`).toBeGreaterThan(0);
        expect(Math.abs(second[0]), `N=${n}`).toBeLessThan(1e-12);
        expect(second.find((c) => Math.abs(c) > 1e-8)!, `N=${n}`).toBeGreaterThan(0);
      }
      // repeated runs give identical numbers
      expect(huckelRing(n).orbitals.map((o) => o.coefficients)).toEqual(r.orbitals.map((o) => o.coefficients));
    }
  });

  it('handles empty and full π systems', () => {
    const empty = huckelChain(2, { electrons: 0 });
    expect(empty.homoIndex).toBeNull();
    expect(empty.homoLumoGapBeta).toBeNull();
    expect(empty.totalPiEnergyBeta).toBe(0);
    const full = huckelChain(2, { electrons: 4 });
    expect(full.lumoIndex).toBeNull();
    expect(full.totalPiEnergyBeta).toBeCloseTo(0, 12);
  });

  it('density matrix diagonal equals the π densities and sums to the electron count', () => {
    const r = huckelGraph(ring(6, ['O-pyrylium']));
    r.piElectronDensity.forEach((q, i) => expect(r.densityMatrix[i][i]).toBe(q));
    expect(r.piElectronDensity.reduce((s, q) => s + q, 0)).toBeCloseTo(r.electronCount, 12);
  });

  it('rejects bad chain and ring sizes', () => {
    expect(() => huckelChain(0)).toThrow(RangeError);
    expect(() => huckelRing(2)).toThrow(RangeError);
    expect(() => huckelRing(4.5)).toThrow(RangeError);
  });
});

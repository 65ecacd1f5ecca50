import { describe, expect, it } from 'vitest';
import { huckelGraph, HuckelInputError, maximumMatching, parseHuckelGraph } from '@shared/chemistry/huckel';

function issuesOf(input: unknown): string[] {
  try {
    parseHuckelGraph(input);
  } catch (error) {
    expect(error).toBeInstanceOf(HuckelInputError);
    return (error as HuckelInputError).issues.map((i) => `${i.path}: ${i.message}`);
  }
  throw new Error('expected the input to be rejected');
}

describe('parseHuckelGraph', () => {
  it('reads JSON text with shorthand atoms and bonds', () => {
    const graph = parseHuckelGraph('{"name":"acrolein","atoms":["C","C","C","O-carbonyl"],"bonds":[[0,1],[1,2],[2,3,1.1]]}');
    expect(graph.atoms).toEqual([{ type: 'C' }, { type: 'C' }, { type: 'C' }, { type: 'O-carbonyl' }]);
    expect(graph.bonds).toEqual([{ from: 0, to: 1 }, { from: 1, to: 2 }, { from: 2, to: 3, k: 1.1 }]);
    const r = huckelGraph(graph);
    expect(r.name).toBe('acrolein');
    expect(r.matrix[2][3]).toBe(1.1);
    expect(r.electronCount).toBe(4);
  });

  it('accepts full objects with charge, electrons and parameter edits', () => {
    const graph = parseHuckelGraph({
      atoms: [{ type: 'C', label: 'C1' }, { h: 0.2, piElectrons: 1 }, {}],
      bonds: [{ from: 0, to: 1, type: 'double' }, { from: 1, to: 2, k: 0.9, type: 'single' }],
      charge: 1,
      electrons: 2,
      parameters: { atomTypes: { C: { h: 0 } }, bondK: { 'C|C': 1 } },
    });
    expect(graph.charge).toBe(1);
  });

  it('names the atom index for unknown or ambiguous types', () => {
    expect(issuesOf({ atoms: ['C', 'C', 'N'], bonds: [[0, 1], [1, 2]] })).toEqual([
      expect.stringMatching(/^atoms\[2\]\.type: unknown atom type 'N' \('N' is ambiguous: use 'N-pyridine'/),
    ]);
    expect(issuesOf({ atoms: ['C', 'O'], bonds: [[0, 1]] })[0]).toMatch(/^atoms\[1\]\.type: .*'O-carbonyl'/);
    expect(issuesOf({ atoms: ['C', 'Xx'], bonds: [] })[0]).toMatch(/^atoms\[1\]\.type: unknown atom type 'Xx'; known types: C, N-pyridine/);
  });

  it('names the bond index for out-of-range, self and repeated bonds', () => {
    const issues = issuesOf({ atoms: ['C', 'C', 'C'], bonds: [[0, 1], [1, 3], [2, 2], [1, 0]] });
    expect(issues).toContain('bonds[1].to: atom index 3 is out of range (3 atoms, indices 0…2)');
    expect(issues).toContain('bonds[2]: bond joins atom 2 to itself');
    expect(issues).toContain('bonds[3]: repeats bonds[0] (atoms 0-1)');
  });

  it('reports shape errors with their path', () => {
    expect(issuesOf({ atoms: ['C', 'C'], bonds: [[0, 1.5]] })).toEqual(['bonds[0].to: atom index must be an integer']);
    expect(issuesOf({ atoms: ['C', 'C'], bonds: [{ from: 0, to: 1, type: 'triple' }] })).toEqual([
      "bonds[0].type: bond type must be 'single' or 'double'",
    ]);
    expect(issuesOf({ atoms: ['C', 'C'], bonds: [[0]] })[0]).toMatch(/^bonds\[0\]: a bond is \[from, to\]/);
    expect(issuesOf({ atoms: ['C', 'C'], bonds: [{ from: 0, to: 1, kk: 1 }] })[0]).toMatch(/^bonds\[0\]: .*"kk"/);
    expect(issuesOf({ atoms: [{ type: 'C', h: 'big' }], bonds: [] })).toEqual(['atoms[0].h: must be a number']);
    expect(issuesOf({ atoms: [{ type: 'C', piElectrons: 3 }], bonds: [] })).toEqual(['atoms[0].piElectrons: piElectrons must be 0, 1 or 2']);
    expect(issuesOf({ atoms: ['C', 5], bonds: [] })[0]).toMatch(/^atoms\[1\]: an atom is a type name/);
    expect(issuesOf({ atoms: [], bonds: [] })[0]).toMatch(/^atoms: at least one atom/);
    expect(issuesOf({ atoms: ['C'] })[0]).toMatch(/^bonds/);
    expect(issuesOf({ atoms: ['C'], bonds: [], colour: 'red' })[0]).toMatch(/colour/);
    expect(issuesOf('{"atoms": [')[0]).toMatch(/not valid JSON/);
    expect(issuesOf({ atoms: ['C', 'C'], bonds: [], charge: 0.5 })[0]).toMatch(/^charge: charge must be an integer/);
  });

  it('checks the electron count against the atoms', () => {
    expect(issuesOf({ atoms: ['C', 'C'], bonds: [[0, 1]], charge: -3 })[0]).toMatch(/^charge: 5 π electrons do not fit 2 orbitals/);
    expect(issuesOf({ atoms: ['C', 'C'], bonds: [[0, 1]], electrons: 5 })[0]).toMatch(/^electrons: 5 π electrons do not fit/);
    expect(issuesOf({ atoms: ['C', 'C'], bonds: [[0, 1]], charge: 1, electrons: 2 })[0]).toMatch(/^electrons: electrons 2 and charge 1 disagree/);
  });

  it('rejects two double bonds on one atom', () => {
    const issues = issuesOf({
      atoms: ['C', 'C', 'C'],
      bonds: [{ from: 0, to: 1, type: 'double' }, { from: 1, to: 2, type: 'double' }],
    });
    expect(issues).toEqual(['bonds[1].type: atom 1 is already in the double bond bonds[0]']);
  });

  it('rejects incomplete new atom types', () => {
    expect(issuesOf({ atoms: [{ type: 'Q' }], bonds: [], parameters: { atomTypes: { Q: { h: 1 } } } })[0]).toMatch(
      /^parameters: new atom type 'Q' needs h, k and piElectrons/,
    );
  });

  it('huckelGraph validates typed input the same way', () => {
    expect(() => huckelGraph({ atoms: [{}, {}], bonds: [{ from: 0, to: 2 }] })).toThrow(HuckelInputError);
    expect(() => huckelGraph({ atoms: [{}, {}], bonds: [{ from: 0, to: 2 }] })).toThrow(/bonds\[0\]\.to/);
  });
});

describe('maximumMatching (Edmonds 1965)', () => {
  /** size of a maximum matching by exhaustive search (small graphs only) */
  function bruteForceMatchingSize(n: number, edges: Array<[number, number]>): number {
    let best = 0;
    const used = new Array<boolean>(n).fill(false);
    const search = (start: number, size: number) => {
      best = Math.max(best, size);
      for (let e = start; e < edges.length; e++) {
        const [a, b] = edges[e];
        if (used[a] || used[b]) continue;
        used[a] = used[b] = true;
        search(e + 1, size + 1);
        used[a] = used[b] = false;
      }
    };
    search(0, 0);
    return best;
  }

  it('finds maximum matchings equal to exhaustive search on random graphs, including odd cycles (computed)', () => {
    let seed = 12345;
    const random = () => {
      seed = (seed * 1103515245 + 12345) % 2147483648;
      return seed / 2147483648;
    };
    for (let trial = 0; trial < 300; trial++) {
      const n = 2 + Math.floor(random() * 9);
      const edges: Array<[number, number]> = [];
      const adjacency: number[][] = Array.from({ length: n }, () => []);
      for (let a = 0; a < n; a++)
        for (let b = a + 1; b < n; b++)
          if (random() < 0.35) {
            edges.push([a, b]);
            adjacency[a].push(b);
            adjacency[b].push(a);
          }
      const match = maximumMatching(adjacency);
      // a valid matching along existing edges, symmetric
      match.forEach((m, v) => {
        if (m !== -1) {
          expect(match[m]).toBe(v);
          expect(adjacency[v]).toContain(m);
        }
      });
      const size = match.filter((m) => m !== -1).length / 2;
      expect(size, `trial ${trial}`).toBe(bruteForceMatchingSize(n, edges));
    }
  });

  it('matches a 5-ring with a pendant atom perfectly (needs a blossom)', () => {
    // ring 0-1-2-3-4-0 with atom 5 attached to 0: perfect matching 5-0, 1-2, 3-4
    const adjacency = [[1, 4, 5], [0, 2], [1, 3], [2, 4], [3, 0], [0]];
    const match = maximumMatching(adjacency);
    expect(match.every((m) => m !== -1)).toBe(true);
  });
});

import { describe, expect, it } from 'vitest';
import {
  buildMoDiagram,
  EXPERIMENTAL_DIATOMIC_CONSTANTS,
  experimentalConstants,
  parseDiatomicFormula,
  termSymbolsEqual,
} from '@shared/chemistry/diatomics';

const term = (formula: string, order?: 'mixed' | 'unmixed' | 'auto') => buildMoDiagram({ formula, order }).termSymbol.text;
const labels = (formula: string, order?: 'mixed' | 'unmixed' | 'auto') => buildMoDiagram({ formula, order }).levels.map((l) => l.label);

describe('ground term symbols from Aufbau + Hund and microstates', () => {
  // Huber & Herzberg, Constants of Diatomic Molecules (1979); NIST Chemistry WebBook (from memory)
  it.each([
    ['B2', '³Σg⁻'],
    ['C2', '¹Σg⁺'],
    ['N2', '¹Σg⁺'],
    ['N2+', '²Σg⁺'],
    ['O2', '³Σg⁻'],
    ['O2+', '²Πg'],
    ['O2-', '²Πg'],
    ['F2', '¹Σg⁺'],
    ['NO', '²Π'],
    ['CO', '¹Σ⁺'],
  ])('%s has ground term %s', (formula, expected) => {
    expect(term(formula)).toBe(expected);
  });

  // further ground states, Huber & Herzberg (1979), from memory
  it.each([
    ['H2', '¹Σg⁺'],
    ['H2+', '²Σg⁺'],
    ['He2+', '²Σu⁺'],
    ['Li2', '¹Σg⁺'],
    ['O2^2+', '¹Σg⁺'],
    ['CO+', '²Σ⁺'],
    ['CN', '²Σ⁺'],
    ['CN-', '¹Σ⁺'],
    ['NO+', '¹Σ⁺'],
    ['NO-', '³Σ⁻'],
    ['BO', '²Σ⁺'],
    ['CF', '²Π'],
    ['NF', '³Σ⁻'],
    ['BH', '¹Σ⁺'],
    ['CH', '²Π'],
    ['NH', '³Σ⁻'],
    ['OH', '²Π'],
    ['OH+', '³Σ⁻'],
    ['OH-', '¹Σ⁺'],
    ['HF', '¹Σ⁺'],
    ['HF+', '²Π'],
  ])('%s has ground term %s', (formula, expected) => {
    expect(term(formula)).toBe(expected);
  });

  it('gives the ASCII term beside the Unicode one, and structured fields', () => {
    const o2 = buildMoDiagram({ formula: 'O2' });
    expect(o2.termSymbolAscii).toBe('3Sigma_g^-');
    expect(o2.termSymbol).toEqual({ multiplicity: 3, lambda: 'Sigma', parity: 'g', reflection: '-', text: '³Σg⁻' });
    expect(buildMoDiagram({ formula: 'NO' }).termSymbol).toMatchObject({ multiplicity: 2, lambda: 'Pi', parity: null, reflection: null });
    expect(buildMoDiagram({ formula: 'NO' }).termSymbolAscii).toBe('2Pi');
  });

  it('lists every term of the O2 π² ground configuration: ³Σg⁻, ¹Δg, ¹Σg⁺ (Herzberg, Spectra of Diatomic Molecules; from memory)', () => {
    const o2 = buildMoDiagram({ formula: 'O2' });
    expect(o2.terms.map((t) => t.term.text)).toEqual(['³Σg⁻', '¹Δg', '¹Σg⁺']);
    expect(o2.terms.every((t) => t.count === 1)).toBe(true);
  });

  it('closed shells give ¹Σg⁺ (homonuclear) and ¹Σ⁺ (heteronuclear)', () => {
    expect(term('Ne2^2+')).toBe('¹Σg⁺');
    expect(term('CN-')).toBe('¹Σ⁺');
    expect(buildMoDiagram({ formula: 'F2' }).terms).toHaveLength(1);
  });
});

describe('level order: with and without s–p mixing', () => {
  it('mixed order for Li2 … N2 and unmixed for O2, F2, Ne2 (science.md §4)', () => {
    const mixed = ['1σg', '1σu*', '2σg', '2σu*', '1πu', '3σg', '1πg*', '3σu*'];
    const unmixed = ['1σg', '1σu*', '2σg', '2σu*', '3σg', '1πu', '1πg*', '3σu*'];
    for (const f of ['Li2', 'Be2', 'B2', 'C2', 'N2', 'N2-', 'C2^2-']) expect(labels(f)).toEqual(mixed);
    for (const f of ['O2', 'F2', 'Ne2', 'O2^2+', 'F2+']) expect(labels(f)).toEqual(unmixed);
    expect(buildMoDiagram({ formula: 'N2' }).order).toBe('mixed');
    expect(buildMoDiagram({ formula: 'O2' }).order).toBe('unmixed');
  });

  it('an explicit order overrides the automatic one', () => {
    expect(labels('O2', 'mixed')).toEqual(['1σg', '1σu*', '2σg', '2σu*', '1πu', '3σg', '1πg*', '3σu*']);
    expect(buildMoDiagram({ formula: 'N2', order: 'unmixed' }).orderRule).toMatch(/explicitly/);
  });

  it('C2 ¹Σg⁺, B2 ³Σg⁻ and N2⁺ ²Σg⁺ need the mixed order (Huber & Herzberg 1979, from memory)', () => {
    expect(term('C2', 'mixed')).toBe('¹Σg⁺');
    expect(term('C2', 'unmixed')).toBe('³Σg⁻'); // (3σg)²(1πu)² would be a triplet
    expect(term('B2', 'mixed')).toBe('³Σg⁻');
    expect(term('B2', 'unmixed')).toBe('¹Σg⁺');
    expect(term('N2+', 'mixed')).toBe('²Σg⁺');
    expect(term('N2+', 'unmixed')).toBe('²Πu');
    expect(buildMoDiagram({ formula: 'B2', order: 'unmixed' }).magnetism).toBe('diamagnetic');
    expect(buildMoDiagram({ formula: 'B2' }).magnetism).toBe('paramagnetic');
  });

  it('O2 terms do not depend on the order (both fill 3σg and 1πu before 1πg*)', () => {
    expect(term('O2', 'mixed')).toBe('³Σg⁻');
    expect(term('O2+', 'mixed')).toBe('²Πg');
  });

  it('heteronuclear numbering: CO-like 1σ…6σ with 1π, 2π; hydrides 1σ 2σ 3σ 1π 4σ', () => {
    expect(labels('CO')).toEqual(['1σ', '2σ', '3σ', '4σ', '1π', '5σ', '2π', '6σ']);
    expect(labels('NO')).toEqual(['1σ', '2σ', '3σ', '4σ', '5σ', '1π', '2π', '6σ']);
    expect(labels('HF')).toEqual(['1σ', '2σ', '3σ', '1π', '4σ']);
    expect(buildMoDiagram({ formula: 'HF' }).levels.every((l) => l.parity === null)).toBe(true);
  });

  it('H2/He2 and hydrides have one order; an explicit order is noted as having no effect', () => {
    const h2 = buildMoDiagram({ formula: 'H2', order: 'unmixed' });
    expect(h2.order).toBe('fixed');
    expect(h2.levels.map((l) => l.label)).toEqual(['1σg', '1σu*']);
    expect(h2.notes.join(' ')).toMatch(/no effect/);
  });

  it('rejects an unknown order option', () => {
    expect(() => buildMoDiagram({ formula: 'N2', order: 'sideways' as 'auto' })).toThrow(RangeError);
  });
});

describe('bond order, unpaired electrons, magnetism', () => {
  // science.md §4 (textbook values, e.g. Atkins & de Paula; from memory)
  it.each([
    ['N2', 3],
    ['O2', 2],
    ['F2', 1],
    ['O2+', 2.5],
    ['Be2', 0],
    ['H2', 1], // textbook, from memory
    ['H2+', 0.5], // textbook, from memory
    ['He2', 0], // textbook, from memory
    ['He2+', 0.5], // textbook, from memory
    ['O2-', 1.5], // superoxide, textbook, from memory
    ['O2^2-', 1], // peroxide, textbook, from memory
    ['C2', 2], // textbook, from memory
    ['Ne2', 0], // textbook, from memory
    ['CO', 3], // textbook, from memory
    ['NO', 2.5], // textbook, from memory
    ['NO+', 3], // textbook, from memory
    ['CN-', 3], // textbook, from memory
    ['HF', 1], // textbook, from memory
  ])('%s has bond order %s', (formula, bondOrder) => {
    expect(buildMoDiagram({ formula }).bondOrder).toBe(bondOrder);
  });

  it('counts unpaired electrons with Hund’s rule and names the magnetism', () => {
    const o2 = buildMoDiagram({ formula: 'O2' });
    expect(o2.unpairedElectrons).toBe(2);
    expect(o2.magnetism).toBe('paramagnetic'); // liquid O2 is paramagnetic (textbook; from memory)
    const piStar = o2.levels.find((l) => l.label === '1πg*')!;
    expect(piStar.spins).toEqual([['up'], ['up']]);
    const n2 = buildMoDiagram({ formula: 'N2' });
    expect(n2.unpairedElectrons).toBe(0);
    expect(n2.magnetism).toBe('diamagnetic');
    expect(buildMoDiagram({ formula: 'O2-' }).levels.find((l) => l.label === '1πg*')!.spins).toEqual([['up', 'down'], ['up']]);
    expect(buildMoDiagram({ formula: 'NO' }).unpairedElectrons).toBe(1);
  });

  it('unpaired electrons agree with the multiplicity of the ground term for every species', () => {
    for (const f of ['H2+', 'He2+', 'B2', 'C2', 'N2+', 'O2', 'O2+', 'F2+', 'CO+', 'NO', 'NO-', 'CH', 'NH', 'OH', 'HF+']) {
      const d = buildMoDiagram({ formula: f });
      expect(d.termSymbol.multiplicity, f).toBe(d.unpairedElectrons + 1);
    }
  });

  it('electrons are conserved and bonding/antibonding/nonbonding counts add up', () => {
    for (const f of ['Li2', 'N2', 'O2^2-', 'Ne2+', 'CO', 'HF', 'He2']) {
      const d = buildMoDiagram({ formula: f });
      const total = d.levels.reduce((s, l) => s + l.occupancy, 0);
      expect(total, f).toBe(d.electronCount);
      expect(d.bondingElectrons + d.antibondingElectrons + d.nonbondingElectrons, f).toBe(d.electronCount);
    }
    expect(buildMoDiagram({ formula: 'O2' }).electronCount).toBe(16);
    expect(buildMoDiagram({ formula: 'O2', charge: -2 }).electronCount).toBe(18);
  });
});

describe('configuration strings and HOMO/LUMO', () => {
  it('writes the O2 configuration in Unicode, ASCII and valence form', () => {
    const o2 = buildMoDiagram({ formula: 'O2' });
    expect(o2.configuration).toBe('(1σg)²(1σu*)²(2σg)²(2σu*)²(3σg)²(1πu)⁴(1πg*)²');
    expect(o2.configurationAscii).toBe('(1sigma_g)^2(1sigma_u*)^2(2sigma_g)^2(2sigma_u*)^2(3sigma_g)^2(1pi_u)^4(1pi_g*)^2');
    expect(o2.valenceConfiguration).toBe('KK(σ2s)²(σ*2s)²(σ2p)²(π2p)⁴(π*2p)²');
    expect(o2.levels[0]).toMatchObject({ label: '1σg', valenceLabel: 'σ1s', core: true });
  });

  it('writes heteronuclear and 1s-only configurations', () => {
    expect(buildMoDiagram({ formula: 'CO' }).configuration).toBe('(1σ)²(2σ)²(3σ)²(4σ)²(1π)⁴(5σ)²');
    expect(buildMoDiagram({ formula: 'He2+' }).configuration).toBe('(1σg)²(1σu*)¹');
    expect(buildMoDiagram({ formula: 'He2+' }).valenceConfiguration).toBe('(σ1s)²(σ*1s)¹');
    expect(buildMoDiagram({ formula: 'HF' }).valenceConfiguration).toBe('K(2s(F))²(σ)²(2pπ(F))⁴');
  });

  it('marks HOMO and LUMO (LUMO = lowest level with a vacancy)', () => {
    const n2 = buildMoDiagram({ formula: 'N2' });
    expect(n2.levels[n2.homoIndex!].label).toBe('3σg');
    expect(n2.levels[n2.lumoIndex!].label).toBe('1πg*');
    expect(n2.openShellIndices).toEqual([]);
    const o2 = buildMoDiagram({ formula: 'O2' });
    expect(o2.levels[o2.homoIndex!].label).toBe('1πg*');
    expect(o2.levels[o2.lumoIndex!].label).toBe('1πg*');
    expect(o2.levels[o2.lowestEmptyIndex!].label).toBe('3σu*');
    expect(o2.openShellIndices).toEqual([o2.homoIndex]);
    const ne2 = buildMoDiagram({ formula: 'Ne2' });
    expect(ne2.lumoIndex).toBeNull();
    expect(ne2.lowestEmptyIndex).toBeNull();
    const co = buildMoDiagram({ formula: 'CO' });
    expect(co.levels[co.homoIndex!].label).toBe('5σ'); // CO HOMO is 5σ (photoelectron spectrum; from memory)
  });
});

describe('drawing data: energies and correlations', () => {
  it('levels are strictly ascending in energy in the chosen order', () => {
    for (const f of ['H2', 'Li2', 'Be2', 'B2', 'N2', 'O2', 'Ne2', 'CO', 'NO', 'BN', 'HF', 'BH', 'OH']) {
      for (const order of ['mixed', 'unmixed'] as const) {
        const e = buildMoDiagram({ formula: f, order }).levels.map((l) => l.energyEv);
        for (let i = 1; i < e.length; i++) expect(e[i], `${f} ${order} level ${i}`).toBeGreaterThan(e[i - 1]);
      }
    }
  });

  it('bonding levels lie below, antibonding above the atomic levels they come from; nonbonding ones at them', () => {
    for (const f of ['N2', 'O2', 'CO', 'HF', 'Li2']) {
      const d = buildMoDiagram({ formula: f });
      const ao = (side: 'left' | 'right', orbital: string) => d.atoms[side].levels.find((l) => l.orbital === orbital)!.energyEv;
      for (const l of d.levels) {
        const es = l.correlations.map((c) => ao(c.side, c.orbital));
        if (l.character === 'antibonding') expect(l.energyEv, `${f} ${l.label}`).toBeGreaterThan(Math.max(...es));
        if (l.character === 'nonbonding') expect(l.energyEv, `${f} ${l.label}`).toBe(es[0]);
        if (l.character === 'bonding' && !(d.order === 'mixed' && l.symmetry === 'sigma' && l.correlations[0].orbital === '2p')) {
          expect(l.energyEv, `${f} ${l.label}`).toBeLessThan(Math.min(...es));
        }
      }
    }
  });

  it('correlates each level with atomic orbitals on the two sides', () => {
    const co = buildMoDiagram({ formula: 'CO' });
    expect(co.atoms.left.element).toBe('C');
    expect(co.atoms.right.element).toBe('O');
    expect(co.levels.find((l) => l.label === '1σ')!.correlations).toEqual([{ side: 'right', element: 'O', orbital: '1s' }]);
    expect(co.levels.find((l) => l.label === '5σ')!.correlations.map((c) => `${c.element}${c.orbital}`)).toEqual(['C2p', 'O2p']);
    const hf = buildMoDiagram({ formula: 'HF' });
    expect(hf.levels.find((l) => l.label === '3σ')!.correlations.map((c) => `${c.element}${c.orbital}`)).toEqual(['H1s', 'F2p']);
    expect(hf.atoms.left.levels.map((l) => l.orbital)).toEqual(['1s']);
    // neutral-atom ground configurations on the sides: O 2s² 2p⁴, C 2s² 2p²
    expect(co.atoms.right.levels.map((l) => l.electrons)).toEqual([2, 2, 4]);
    expect(co.atoms.left.levels.map((l) => l.electrons)).toEqual([2, 2, 2]);
  });

  it('uses the tabulated valence orbital energies for the atomic levels (Mann, Meek & Allen 2000; from memory)', () => {
    const o2 = buildMoDiagram({ formula: 'O2' });
    expect(o2.atoms.left.levels.find((l) => l.orbital === '2p')!.energyEv).toBe(-15.85); // Mann et al. 2000, from memory
    expect(o2.atoms.left.levels.find((l) => l.orbital === '2s')!.energyEv).toBe(-32.38); // Mann et al. 2000, from memory
  });

  it('degeneracy and capacity: σ 1/2, π 2/4', () => {
    const levels = buildMoDiagram({ formula: 'N2' }).levels;
    expect(levels.find((l) => l.label === '1πu')).toMatchObject({ degeneracy: 2, capacity: 4, symmetry: 'pi', parity: 'u', character: 'bonding' });
    expect(levels.find((l) => l.label === '3σu*')).toMatchObject({ degeneracy: 1, capacity: 2, symmetry: 'sigma', parity: 'u', character: 'antibonding' });
  });
});

describe('formula reading', () => {
  it('accepts charges in the formula or separately', () => {
    expect(parseDiatomicFormula('N2+')).toMatchObject({ formula: 'N2', charge: 1, species: 'N2+', display: 'N₂⁺', electronCount: 13 });
    expect(parseDiatomicFormula('O2', -2)).toMatchObject({ charge: -2, species: 'O2^2-', display: 'O₂²⁻' });
    for (const text of ['O2^2-', 'O₂²⁻', 'O2--', 'O2 2-', 'O2(2-)', 'O2^{2-}', 'O2-2', '[O2]2−']) {
      expect(parseDiatomicFormula(text).charge, text).toBe(-2);
    }
    expect(parseDiatomicFormula('CN−').charge).toBe(-1);
    expect(parseDiatomicFormula('NO+', 1).charge).toBe(1);
    expect(parseDiatomicFormula('OC').formula).toBe('CO');
    expect(parseDiatomicFormula('HO-')).toMatchObject({ formula: 'OH', charge: -1, left: 'H', right: 'O' });
  });

  it('rejects unknown formulas with a message naming what is drawn', () => {
    expect(() => buildMoDiagram({ formula: 'Xy2' })).toThrow(RangeError);
    expect(() => buildMoDiagram({ formula: 'Xy2' })).toThrow(/^unknown formula 'Xy2': Bondmark draws/);
    for (const f of ['', 'O3', 'Na2', 'co', 'CO3+', 'LiF']) expect(() => buildMoDiagram({ formula: f }), f).toThrow(RangeError);
  });

  it('rejects conflicting, out-of-range and unphysical charges', () => {
    expect(() => buildMoDiagram({ formula: 'O2+', charge: 0 })).toThrow(/charge given twice/);
    expect(() => buildMoDiagram({ formula: 'O2', charge: 3 })).toThrow(RangeError);
    expect(() => buildMoDiagram({ formula: 'He2-' })).toThrow(/more than the 4/);
    expect(() => buildMoDiagram({ formula: 'Ne2-' })).toThrow(RangeError);
    expect(() => buildMoDiagram({ formula: 'H2^2+' })).toThrow(/no electrons/);
    expect(() => buildMoDiagram({ formula: 'HF-' })).toThrow(/allowed charges/);
    expect(() => buildMoDiagram({ formula: 'O2', charge: 0.5 })).toThrow(RangeError);
  });

  it('carries a caveat for BN, whose observed ground state is X³Π (Huber & Herzberg 1979; from memory)', () => {
    const bn = buildMoDiagram({ formula: 'BN' });
    expect(bn.termSymbol.text).toBe('¹Σ⁺'); // what the single-configuration diagram gives
    expect(bn.notes.join(' ')).toMatch(/X³Π/);
    expect(termSymbolsEqual(bn.termSymbol, '3Π')).toBe(false);
  });
});

describe('experimental constants table', () => {
  it('holds re and ωe with their source (Huber & Herzberg 1979, from memory)', () => {
    expect(experimentalConstants('H2')).toMatchObject({ reAngstrom: 0.7414, omegaEWavenumber: 4401.2 }); // Huber & Herzberg, from memory
    expect(experimentalConstants('N2')).toMatchObject({ reAngstrom: 1.0977, omegaEWavenumber: 2358.6 }); // Huber & Herzberg, from memory
    expect(experimentalConstants('O2')).toMatchObject({ reAngstrom: 1.2075, omegaEWavenumber: 1580.2 }); // Huber & Herzberg, from memory
    expect(experimentalConstants('F2')).toMatchObject({ reAngstrom: 1.4119, omegaEWavenumber: 916.6 }); // Huber & Herzberg, from memory
    expect(experimentalConstants('Xe2')).toBeNull();
    for (const row of EXPERIMENTAL_DIATOMIC_CONSTANTS) expect(row.source).toMatch(/Huber & Herzberg/);
  });
});

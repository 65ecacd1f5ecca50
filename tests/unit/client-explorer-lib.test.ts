import { describe, expect, it } from 'vitest';
import { buildMoDiagram } from '@shared/chemistry/diatomics';
import { huckelRing } from '@shared/chemistry/huckel';
import { BOHR_ANGSTROM, HARTREE_EV, HARTREE_WAVENUMBER } from '@shared/chemistry/units';
import { buildCsv, csvCell, fileSlug, formatCsvNumber, guardFormula, seriesCsv } from '@client/features/explorer/lib/csv';
import {
  distanceAxisLabel,
  distanceQuantity,
  energyAxisLabel,
  energyQuantity,
  formatFixed,
  formatTick,
  isDistanceUnit,
  isEnergyUnit,
} from '@client/features/explorer/lib/units';
import { curveEnergyDomain, niceTicks, plainDomain } from '@client/features/explorer/lib/plot-domain';
import { assignSeriesColors, seriesColor } from '@client/features/explorer/lib/plot-colors';
import { hundFill, layoutMoDiagram, splitMoLabel, spreadPositions, MO_GEOMETRY } from '@client/features/explorer/lib/mo-layout';
import { formatAlphaBeta, layoutHuckel } from '@client/features/explorer/lib/huckel-layout';
import { densityAtScale, densityColor, densityPixels, densityScale } from '@client/features/explorer/lib/density-palette';

describe('formula guard and CSV text', () => {
  it('prefixes an apostrophe to text cells a spreadsheet would run as a formula', () => {
    expect(guardFormula('=SUM(A1:A9)')).toBe("'=SUM(A1:A9)");
    expect(guardFormula('+cmd')).toBe("'+cmd");
    expect(guardFormula('-2+3')).toBe("'-2+3");
    expect(guardFormula('@SUM(1)')).toBe("'@SUM(1)");
    expect(guardFormula('\t=1')).toBe("'\t=1");
    expect(guardFormula('E LCAO σg / hartree')).toBe('E LCAO σg / hartree');
    expect(guardFormula('')).toBe('');
  });

  it('writes numbers as numbers, negative ones included, and never guards them', () => {
    expect(csvCell(-0.5648)).toBe('-0.5648');
    expect(csvCell(0.1 + 0.2)).toBe('0.3');
    expect(formatCsvNumber(Number.NaN)).toBe('');
    expect(csvCell(null)).toBe('');
    expect(csvCell(undefined)).toBe('');
  });

  it('quotes fields with commas, quotes or line breaks (RFC 4180), after guarding', () => {
    expect(csvCell('a,b')).toBe('"a,b"');
    expect(csvCell('say "hi"')).toBe('"say ""hi"""');
    expect(csvCell('two\nlines')).toBe('"two\nlines"');
    expect(csvCell('=1,2')).toBe(`"'=1,2"`);
  });

  it('builds a header line and rows with CRLF line ends', () => {
    expect(buildCsv(['R / bohr', 'note'], [[1, 'ok'], [2, '=evil()']])).toBe("R / bohr,note\r\n1,ok\r\n2,'=evil()\r\n");
  });

  it('merges series on different grids by their x values, leaving gaps empty', () => {
    const text = seriesCsv('R / bohr', [
      { header: 'E a / hartree', x: [1, 2, 3], y: [-0.1, -0.2, -0.3] },
      { header: 'E b / hartree', x: [2, 4], y: [-1, -2] },
    ]);
    expect(text.split('\r\n')).toEqual(['R / bohr,E a / hartree,E b / hartree', '1,-0.1,', '2,-0.2,-1', '3,-0.3,', '4,,-2', '']);
  });

  it('makes file names from titles', () => {
    expect(fileSlug('Bonding and antibonding curves')).toBe('bonding-and-antibonding-curves');
    expect(fileSlug('MO diagram of O₂')).toBe('mo-diagram-of-o2');
    expect(fileSlug('Hückel levels of ring of 6')).toBe('huckel-levels-of-ring-of-6');
    expect(fileSlug('***')).toBe('plot');
  });
});

describe('unit formatting', () => {
  it('writes fixed decimals with a true minus sign and no negative zero', () => {
    expect(formatFixed(-0.56483, 4)).toBe('\u22120.5648');
    expect(formatFixed(-0.00001, 3)).toBe('0.000');
    expect(formatFixed(2.5, 1)).toBe('2.5');
    expect(formatFixed(null, 3)).toBe('—');
    expect(formatFixed(Number.POSITIVE_INFINITY, 3)).toBe('—');
  });

  it('converts distances and energies with their unit symbols', () => {
    // 2.4928304 a0, the ζ = 1 LCAO Re (science.md §1, computed), in Å with the CODATA 2018 bohr
    expect(distanceQuantity(2.4928304, 'angstrom')).toEqual({ value: 2.4928304 * BOHR_ANGSTROM, text: '1.3191', unit: 'Å' });
    expect(distanceQuantity(2, 'pm').text).toBe('105.84'); // 2 × 52.9177 pm (CODATA 2018)
    expect(distanceQuantity(2, 'bohr').unit).toBe('a₀');
    // −0.5 Eh = −13.6057 eV (CODATA 2018: 1 Eh = 27.211386245988 eV)
    expect(energyQuantity(-0.5, 'ev')).toEqual({ value: -0.5 * HARTREE_EV, text: '\u221213.6057', unit: 'eV' });
    expect(energyQuantity(1, 'cm-1').text).toBe(HARTREE_WAVENUMBER.toFixed(1));
    expect(energyQuantity(1, 'kj/mol').text).toBe('2625.50'); // CODATA 2018
    expect(energyQuantity(1, 'kj/mol').unit).toBe('kJ mol⁻¹');
    expect(energyQuantity(null, 'hartree').text).toBe('—');
  });

  it('writes axis titles as quantity / unit and ticks compactly', () => {
    expect(distanceAxisLabel('angstrom')).toBe('R / Å');
    expect(energyAxisLabel('kcal/mol')).toBe('E / kcal mol⁻¹');
    expect(formatTick(-0.25)).toBe('\u22120.25');
    expect(formatTick(0.30000000000000004)).toBe('0.3');
    expect(formatTick(2.5e-7)).toBe('2.5e\u22127');
    expect(formatTick(0)).toBe('0');
  });

  it('recognizes the unit names of the engine only', () => {
    expect(isDistanceUnit('angstrom')).toBe(true);
    expect(isDistanceUnit('nm')).toBe(false);
    expect(isEnergyUnit('cm-1')).toBe(true);
    expect(isEnergyUnit('Eh')).toBe(false);
  });
});

describe('plot ranges and colours', () => {
  it('round ticks in steps of 1, 2, 2.5 or 5 × 10ⁿ', () => {
    expect(niceTicks(0.6, 8, 8)).toEqual([1, 2, 3, 4, 5, 6, 7, 8]);
    expect(niceTicks(-0.62, -0.3, 6)).toEqual([-0.6, -0.5, -0.4, -0.3]); // raw step 0.053 rounds up to 0.1
    expect(niceTicks(-0.62, -0.3, 8)).toEqual([-0.6, -0.55, -0.5, -0.45, -0.4, -0.35, -0.3]); // raw step 0.04 rounds up to 0.05
    expect(niceTicks(0, 1, 4)).toEqual([0, 0.25, 0.5, 0.75, 1]);
  });

  it('keeps the well in view and lets the repulsive wall leave the frame', () => {
    // a well of depth 0.1 under a limit of −0.5, and a wall up to +5 at short range
    const bonding = { x: [0.5, 1, 2, 4, 8], y: [5, -0.4, -0.6, -0.55, -0.5] };
    const [lo, hi] = curveEnergyDomain([bonding]);
    expect(lo).toBeLessThan(-0.6);
    expect(lo).toBeGreaterThan(-0.65);
    // headroom of two well depths above the long-range end: −0.5 + 0.2, padded by 5 %
    expect(hi).toBeCloseTo(-0.3 + 0.3 * 0.05, 12);
    // a purely repulsive curve uses its own range
    const [lo2, hi2] = curveEnergyDomain([{ x: [1, 2, 3], y: [3, 2, 1] }]);
    expect(lo2).toBeLessThan(1);
    expect(hi2).toBeGreaterThan(3);
  });

  it('starts non-negative quantities at zero', () => {
    expect(plainDomain([{ x: [0, 1], y: [0.2, 0.9] }])[0]).toBe(0);
    expect(plainDomain([{ x: [0, 1], y: [-1, 1] }])[0]).toBeLessThan(-1);
  });

  it('gives each kind its token and further series of a kind other shades', () => {
    expect(seriesColor('reference')).toBe('#2b4fb3');
    expect(seriesColor('student')).toBe('#7a3fa0');
    expect(seriesColor('bonding')).toBe('#0e7679');
    expect(seriesColor('antibonding')).toBe('#b0462a');
    const colors = assignSeriesColors(['bonding', 'reference', 'reference', 'antibonding']);
    expect(colors[1]).toBe('#2b4fb3');
    expect(colors[2]).not.toBe(colors[1]);
  });
});

describe('MO diagram layout', () => {
  it('fills degenerate boxes by Hund’s rule', () => {
    expect(hundFill(2, 2)).toEqual([['up'], ['up']]);
    expect(hundFill(4, 3)).toEqual([['up', 'down'], ['up'], ['up']]);
    expect(hundFill(1, 1)).toEqual([['up']]);
  });

  it('pushes levels apart keeping their order', () => {
    // three levels wanting y = 100, 98, 97 (lowest energy first)
    const y = spreadPositions([100, 98, 97], [0, 1, 2], 20, 0, 200);
    expect(y).toEqual([100, 80, 60]);
  });

  it('lays out O2: π pairs side by side, levels in energy order, core below a break, lines to each atomic orbital', () => {
    const d = buildMoDiagram({ formula: 'O2' });
    const layout = layoutMoDiagram(d);
    const pi = layout.levels.filter((l) => l.level.symmetry === 'pi');
    expect(pi.length).toBe(2);
    for (const l of pi) expect(l.bars.length).toBe(2);
    // higher energy is higher up (smaller y), and no two levels of the column crowd each other
    const byEnergy = [...layout.levels].sort((a, b) => a.level.energyEv - b.level.energyEv);
    for (let k = 1; k < byEnergy.length; k++) {
      const gap = byEnergy[k - 1].y - byEnergy[k].y;
      expect(gap).toBeGreaterThanOrEqual((byEnergy[k].core ? MO_GEOMETRY.coreGap : MO_GEOMETRY.levelGap) - 1e-9);
    }
    expect(layout.coreBand).not.toBeNull();
    for (const l of layout.levels.filter((x) => x.core)) expect(l.y).toBeGreaterThan(layout.coreBand!.top - 1e-9);
    for (const l of layout.levels.filter((x) => !x.core)) expect(l.y).toBeLessThanOrEqual(layout.valence.bottom);
    expect(layout.lines.length).toBe(d.levels.reduce((n, l) => n + l.correlations.length, 0));
    // an O atom's 2p holds 4 electrons: one pair and two singles
    const p = layout.atomLevels.find((a) => a.side === 'left' && a.orbital === '2p')!;
    expect(p.bars.length).toBe(3);
    expect(p.spins).toEqual([['up', 'down'], ['up'], ['up']]);
    // the 1πg* pair holds one electron on each bar (science.md §4: O2 ³Σg⁻)
    const piStar = layout.levels.find((l) => l.level.label === '1πg*')!;
    expect(piStar.spins.map((s) => s.length)).toEqual([1, 1]);
  });

  it('draws H2 without a core band', () => {
    const layout = layoutMoDiagram(buildMoDiagram({ formula: 'H2' }));
    expect(layout.coreBand).toBeNull();
    expect(layout.levels.length).toBe(2);
  });

  it('splits MO labels for the lowered g/u', () => {
    expect(splitMoLabel('1πg*')).toEqual({ number: '1', symbol: 'π', parity: 'g', star: true });
    expect(splitMoLabel('3σg')).toEqual({ number: '3', symbol: 'σ', parity: 'g', star: false });
    expect(splitMoLabel('5σ')).toEqual({ number: '5', symbol: 'σ', parity: '', star: false });
  });
});

describe('Hückel level layout', () => {
  it('writes energies as α + xβ', () => {
    expect(formatAlphaBeta(1.6180339887)).toBe('α + 1.618β');
    expect(formatAlphaBeta(-0.6180339887)).toBe('α \u2212 0.618β');
    expect(formatAlphaBeta(-1)).toBe('α \u2212 β');
    expect(formatAlphaBeta(2)).toBe('α + 2β');
    expect(formatAlphaBeta(1e-12)).toBe('α');
  });

  it('draws benzene as four rows, degenerate pairs side by side, lowest energy lowest', () => {
    const layout = layoutHuckel(huckelRing(6));
    // benzene x = 2, 1 (×2), −1 (×2), −2 (science.md §5)
    expect(layout.sets.map((s) => [Number(s.x.toFixed(6)), s.bars.length, s.electrons])).toEqual([
      [2, 1, 2],
      [1, 2, 4],
      [-1, 2, 0],
      [-2, 1, 0],
    ]);
    const [a, b, c, d] = layout.sets.map((s) => s.y);
    expect(a).toBeGreaterThan(b);
    expect(b).toBeGreaterThan(c);
    expect(c).toBeGreaterThan(d);
    expect(layout.sets[1].homo).toBe(true);
    expect(layout.sets[2].lumo).toBe(true);
  });
});

describe('density palette', () => {
  it('runs from paper to ink, darker all the way', () => {
    expect(densityColor(0)).toEqual([247, 246, 242]);
    expect(densityColor(1)).toEqual([29, 36, 51]);
    // relative luminance (WCAG 2.x) falls monotonically along the scale
    const lum = ([r, g, b]: number[]) => {
      const c = (v: number) => ((v /= 255) <= 0.03928 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4);
      return 0.2126 * c(r) + 0.7152 * c(g) + 0.0722 * c(b);
    };
    let previous = Infinity;
    for (let t = 0; t <= 1.0001; t += 0.02) {
      const l = lum(densityColor(t));
      expect(l).toBeLessThanOrEqual(previous + 1e-12);
      previous = l;
    }
  });

  it('uses a square-root scale and puts the largest y on the top row', () => {
    expect(densityScale(0.25, 1)).toBe(0.5);
    expect(densityAtScale(0.5, 1)).toBe(0.25);
    expect(densityScale(-1, 1)).toBe(0);
    const pixels = densityPixels(
      [
        [0, 0],
        [1, 1],
      ],
      1,
    );
    // row j = 1 (largest y) is the first image row: full density, ink
    expect([...pixels.slice(0, 4)]).toEqual([29, 36, 51, 255]);
    expect([...pixels.slice(8, 12)]).toEqual([247, 246, 242, 255]);
  });
});

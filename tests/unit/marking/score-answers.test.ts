/**
 * markReport on typed answers: MO configuration, bond order, unpaired electrons, term symbols in
 * the notations people type, and Hückel orbital energies. Expected answers come from the engine
 * (computeReference); the outside values are in the comments.
 */
import { describe, expect, it } from 'vitest';
import { computeReference, type DiagramReference, type HuckelReference } from '@shared/exercises/reference';
import { markingSchemeSchema, modelSpecSchema } from '@shared/exercises/spec';
import { drawVariant } from '@shared/exercises/variants';
import { compareConfiguration, markReport, parseAnswerNumber, parseHuckelEnergies, type ReportAnswers } from '@shared/marking/score';

function diagram(species: string): DiagramReference {
  const model = modelSpecSchema.parse({ family: 'diatomic', species: [species], order: 'auto' });
  return computeReference(model, drawVariant(model, 's', 'k')) as DiagramReference;
}
function huckel(system: { kind: 'chain' | 'ring'; n: number }): HuckelReference {
  const model = modelSpecSchema.parse({ family: 'huckel', systems: [system] });
  return computeReference(model, drawVariant(model, 's', 'k')) as HuckelReference;
}

const moScheme = markingSchemeSchema.parse({
  checks: [
    { kind: 'configuration', id: 'configuration', label: 'Configuration', weight: 2 },
    { kind: 'bond-order', id: 'bond-order', label: 'Bond order', weight: 1 },
    { kind: 'unpaired-electrons', id: 'unpaired', label: 'Unpaired electrons', weight: 1 },
    { kind: 'term-symbol', id: 'term', label: 'Term symbol', weight: 2 },
  ],
});
const o2 = diagram('O2');
const markO2 = (answers: ReportAnswers) => markReport({ spec: { scheme: moScheme }, reference: o2, answers });

describe('term symbols', () => {
  // O2 ground state ³Σg⁻ (Huber & Herzberg 1979, from memory; science.md §4)
  it.each(['3Σg-', '^3\\Sigma_g^-', 'triplet sigma g minus', '³Σg⁻', '3Sigma_g^-', '$^{3}\\Sigma_{g}^{-}$', 'X 3Σg−'])('O2: "%s" is right', (typed) => {
    const check = markO2({ 'term-symbol': typed }).checks[3];
    expect(check.points).toBe(2);
    expect(check.found).toBe('³Σg⁻');
  });
  it.each(['3Σg+', '1Δg', '3Σu-', '1Σg+'])('O2: "%s" is wrong', (typed) => {
    const check = markO2({ 'term-symbol': typed }).checks[3];
    expect(check.points).toBe(0);
    expect(check.evaluated).toBe(true);
    expect(check.message).toMatch(/^Term symbol found .*, expected ³Σg⁻: 0 of 2 points\.$/);
  });
  it('an unreadable term symbol gets 0 and the reader’s reason', () => {
    const check = markO2({ 'term-symbol': 'sigma' }).checks[3];
    expect(check).toMatchObject({ points: 0, evaluated: false });
    expect(check.message).toBe("The term symbol 'sigma' could not be read (no spin multiplicity (2S + 1) in front of the Λ symbol); expected ³Σg⁻: 0 of 2 points.");
  });
  it('other species: N2 ¹Σg⁺, O2⁺ ²Πg, NO ²Π (Huber & Herzberg 1979, from memory)', () => {
    const mark = (species: string, typed: string) => markReport({ spec: { scheme: moScheme }, reference: diagram(species), answers: { 'term-symbol': typed } }).checks[3].points;
    expect(mark('N2', '1Σg+')).toBe(2);
    expect(mark('O2+', '2Πg')).toBe(2);
    expect(mark('O2+', 'doublet pi u')).toBe(0);
    expect(mark('NO', '2Π')).toBe(2);
  });
});

describe('configurations', () => {
  it.each([
    ['full, superscripts', '(1σg)²(1σu*)²(2σg)²(2σu*)²(3σg)²(1πu)⁴(1πg*)²'],
    ['ASCII with ^', '(1sigma_g)^2(1sigma_u*)^2(2sigma_g)^2(2sigma_u*)^2(3sigma_g)^2(1pi_u)^4(1pi_g*)^2'],
    ['KK core, no stars, plain digits', 'KK 2σg2 2σu2 3σg2 1πu4 1πg2'],
    ['core left out, terms in another order', '(1πg*)² (1πu)⁴ (3σg)² (2σu*)² (2σg)²'],
    ['valence-shell numbering', '1σg² 1σu*² 2σg² 1πu⁴ 1πg*²'],
    ['valence labels', 'σ2s² σ*2s² σ2p² π2p⁴ π*2p²'],
    ['LaTeX', '$(1\\sigma_g)^2(1\\sigma_u^*)^2(2\\sigma_g)^2(2\\sigma_u^*)^2(3\\sigma_g)^2(1\\pi_u)^4(1\\pi_g^*)^2$'],
  ])('O2 %s is right', (_what, typed) => {
    expect(compareConfiguration(typed, o2.diagram)).toMatchObject({ ok: true, matches: true });
    expect(markO2({ configuration: typed }).checks[0].points).toBe(2);
  });
  it.each([
    ['π* filled', 'KK (2σg)² (2σu*)² (3σg)² (1πu)⁴ (1πg*)⁴'],
    ['N2 order with one electron short', 'KK (2σg)² (2σu*)² (1πu)⁴ (3σg)² (1πg*)¹'],
    ['σ*2s written without its star', 'σ2s² σ2s² σ2p² π2p⁴ π*2p²'],
  ])('O2 %s is wrong or unreadable', (_what, typed) => {
    expect(markO2({ configuration: typed }).checks[0].points).toBe(0);
  });
  it('a heteronuclear configuration (CO, no g/u): "KK 3σ² 4σ² 1π⁴ 5σ²"', () => {
    expect(compareConfiguration('KK 3σ² 4σ² 1π⁴ 5σ²', diagram('CO').diagram)).toMatchObject({ ok: true, matches: true });
    expect(compareConfiguration('KK 3σ² 4σ² 1π⁴ 5σ¹ 2π¹', diagram('CO').diagram)).toMatchObject({ ok: true, matches: false });
  });
  it('text that is not a configuration is unreadable, with the place named', () => {
    const check = markO2({ configuration: 'two in each bonding orbital' }).checks[0];
    expect(check).toMatchObject({ points: 0, evaluated: false });
    expect(check.message).toMatch(/^The configuration 'two in each bonding orbital' could not be read \('two in each bonding …' is not an orbital with its electron count\); expected \(1σg\)²/);
  });
});

describe('bond order and unpaired electrons', () => {
  it('O2: bond order 2 and 2 unpaired electrons (science.md §4), in the forms people type', () => {
    for (const typed of ['2', 2, '2.0', 'bond order = 2', '4/2']) expect(markO2({ 'bond-order': typed }).checks[1].points, String(typed)).toBe(1);
    for (const typed of ['2', 2, 'two']) expect(markO2({ unpaired: typed }).checks[2].points, String(typed)).toBe(1);
    expect(markO2({ 'bond-order': '2.5' }).checks[1].message).toBe('Bond order found 2.5, expected 2: 0 of 1 point.');
    expect(markO2({ unpaired: '0' }).checks[2].message).toBe('Unpaired electrons found 0, expected 2: 0 of 1 point.');
  });
  it('O2⁺: bond order 2.5 typed as 2.5, 2,5, 5/2 or 2½ (science.md §4)', () => {
    const o2plus = diagram('O2+');
    for (const typed of ['2.5', '2,5', '5/2', '2½']) {
      expect(parseAnswerNumber(typed)).toBe(2.5);
      expect(markReport({ spec: { scheme: moScheme }, reference: o2plus, answers: { 'bond-order': typed } }).checks[1].points).toBe(1);
    }
  });
  it('answers are looked up by check id first, then by check kind; missing ones say what was expected', () => {
    const result = markO2({ unpaired: '2', 'unpaired-electrons': '0' });
    expect(result.checks[2].points).toBe(1);
    expect(result.checks[1].message).toBe('No bond order was given; expected 2: 0 of 1 point.');
    expect(result.checks[1].evaluated).toBe(false);
    expect(result.total).toBe(1);
  });
  it('all four right: 6 of 6', () => {
    const result = markO2({ configuration: 'KK σ2s² σ*2s² σ2p² π2p⁴ π*2p²', 'bond-order': 2, 'unpaired-electrons': 2, 'term-symbol': 'triplet sigma g minus' });
    expect(result).toMatchObject({ points: 6, max: 6, total: 6 });
  });
});

describe('Hückel energies', () => {
  const scheme = markingSchemeSchema.parse({ checks: [{ kind: 'huckel-energies', id: 'x', label: 'energies', weight: 4, full: 0.01, zero: 0.1 }] });
  const butadiene = huckel({ kind: 'chain', n: 4 });
  const benzene = huckel({ kind: 'ring', n: 6 });
  const mark = (reference: HuckelReference, typed: string | number) => markReport({ spec: { scheme }, reference, answers: { 'huckel-energies': typed } }).checks[0];

  // butadiene x = ±1.618, ±0.618; benzene x = 2, 1, 1, −1, −1, −2 (science.md §5: 2cos(kπ/(N+1)), 2cos(2πk/N))
  it.each([
    'α + 1.618β, α + 0.618β, α − 0.618β, α − 1.618β',
    'alpha + 1.618 beta, alpha + 0.618 beta, alpha - 0.618 beta, alpha - 1.618 beta',
    '1.618 0.618 -0.618 -1.618',
    '-1.618, -0.618, 0.618, 1.618',
    '1,618; 0,618; -0,618; -1,618',
    'a+1.618b, a+0.618b, a-0.618b, a-1.618b',
  ])('butadiene: "%s" is right', (typed) => {
    expect(parseHuckelEnergies(typed)).toMatchObject({ ok: true });
    expect(mark(butadiene, typed).points).toBe(4);
  });
  it('benzene: every orbital, or each degenerate level once (said so)', () => {
    expect(mark(benzene, 'α+2β, α+β, α+β, α−β, α−β, α−2β').points).toBe(4);
    const once = mark(benzene, 'α + 2β; α + β; α − β; α − 2β');
    expect(once.points).toBe(4);
    expect(once.message).toContain('(degenerate levels given once)');
  });
  it('allyl with √2: "α + √2β, α, α − √2β" (x = 0, ±√2)', () => {
    expect(mark(huckel({ kind: 'chain', n: 3 }), 'α + √2β, α, α − √2β').points).toBe(4);
  });
  it('partial credit by the largest deviation in |β|; a wrong count gets 0 with the expected list', () => {
    const close = mark(butadiene, '1.6, 0.6, -0.6, -1.6'); // largest deviation 0.018 → 4 × (0.1 − 0.018)/0.09
    expect(close.deviation).toBeCloseTo(0.0180340, 6);
    expect(close.points).toBe(3.64);
    const short = mark(butadiene, '1.618, 0.618');
    expect(short.points).toBe(0);
    expect(short.message).toBe('2 energies were given (1.618, 0.618), expected 4, one per orbital: x = 1.618, 0.618, −0.618, −1.618: 0 of 4 points.');
    expect(mark(butadiene, 'about one and a half').evaluated).toBe(false);
  });
});

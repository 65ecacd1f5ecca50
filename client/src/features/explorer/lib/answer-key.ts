/**
 * One row of the answer-key table per variant: the numbers and words a
 * student's report is marked against, in the chosen units (pure).
 */
import type { Reference } from '@shared/exercises/reference';
import type { ModelSpec } from '@shared/exercises/spec';
import type { Variant } from '@shared/exercises/variants';
import { distanceFromBohr, energyFromHartree } from '@shared/chemistry/units';
import { buildCsv, type CsvCell } from './csv';
import { formatAlphaBeta } from './huckel-layout';
import { distanceQuantity, distanceUnitCsv, energyQuantity, energyUnitCsv, formatFixed, type PlotUnits } from './units';
import { distanceUnitLabel, energyUnitLabel } from '@shared/chemistry/units';

export interface AnswerColumn {
  id: string;
  /** column head with its unit, e.g. "Re / Å" */
  header: string;
  csvHeader: string;
  numeric: boolean;
}

export interface AnswerCell {
  text: string;
  /** the value for CSV (number in the chosen unit, or text) */
  raw: CsvCell;
}

export function answerColumns(family: ModelSpec['family'], units: PlotUnits): AnswerColumn[] {
  const d = distanceUnitLabel[units.distance];
  const e = energyUnitLabel[units.energy];
  const dc = distanceUnitCsv[units.distance];
  const ec = energyUnitCsv[units.energy];
  switch (family) {
    case 'one-electron':
    case 'two-electron':
      return [
        { id: 're', header: `Rₑ / ${d}`, csvHeader: `Re / ${dc}`, numeric: true },
        { id: 'ere', header: `E(Rₑ) / ${e}`, csvHeader: `E(Re) / ${ec}`, numeric: true },
        { id: 'de', header: `Dₑ / ${e}`, csvHeader: `De / ${ec}`, numeric: true },
        { id: 'omega', header: 'ωₑ / cm⁻¹', csvHeader: 'omega_e / cm-1', numeric: true },
        ...(family === 'one-electron' ? [{ id: 'repulsive', header: 'Antibonding repulsive', csvHeader: 'antibonding repulsive', numeric: false }] : []),
      ];
    case 'diatomic':
      return [
        { id: 'configuration', header: 'Configuration', csvHeader: 'configuration', numeric: false },
        { id: 'bondOrder', header: 'Bond order', csvHeader: 'bond order', numeric: true },
        { id: 'unpaired', header: 'Unpaired', csvHeader: 'unpaired electrons', numeric: true },
        { id: 'term', header: 'Ground term', csvHeader: 'ground term', numeric: false },
        { id: 'magnetism', header: 'Magnetism', csvHeader: 'magnetism', numeric: false },
      ];
    case 'huckel':
      return [
        { id: 'levels', header: 'Levels (α + xβ)', csvHeader: 'x values', numeric: false },
        { id: 'piEnergy', header: 'E_π − nα / β', csvHeader: 'pi energy / beta', numeric: true },
        { id: 'deloc', header: 'Delocalization / β', csvHeader: 'delocalization / beta', numeric: true },
        { id: 'gap', header: 'HOMO–LUMO gap / |β|', csvHeader: 'HOMO-LUMO gap / |beta|', numeric: true },
      ];
  }
}

const cell = (text: string, raw: CsvCell): AnswerCell => ({ text, raw });

/** The cells of one reference, in the order of answerColumns. */
export function answerCells(reference: Reference, units: PlotUnits): AnswerCell[] {
  if (reference.kind === 'curve') {
    const m = reference.minimum;
    const re = distanceQuantity(m?.reBohr, units.distance);
    const ere = energyQuantity(m?.energyHartree, units.energy);
    const de = energyQuantity(m?.deHartree, units.energy);
    const omega = reference.harmonicWavenumberCm1;
    const cells = [
      cell(re.text, m ? distanceFromBohr(m.reBohr, units.distance) : null),
      cell(ere.text, m ? energyFromHartree(m.energyHartree, units.energy) : null),
      cell(de.text, m ? energyFromHartree(m.deHartree, units.energy) : null),
      cell(formatFixed(omega, 1), omega),
    ];
    if (reference.model === 'lcao' || reference.model === 'exact') {
      const r = reference.antibondingRepulsive;
      cells.push(cell(r === null ? '—' : r ? 'yes' : 'no', r === null ? null : r ? 'yes' : 'no'));
    }
    return cells;
  }
  if (reference.kind === 'diagram') {
    const a = reference.answers;
    return [
      cell(a.configuration, a.configuration),
      cell(Number.isInteger(a.bondOrder) ? String(a.bondOrder) : a.bondOrder.toFixed(1), a.bondOrder),
      cell(String(a.unpairedElectrons), a.unpairedElectrons),
      cell(a.termSymbol, a.termSymbol),
      cell(a.magnetism, a.magnetism),
    ];
  }
  const a = reference.answers;
  return [
    cell(a.x.map((x) => formatAlphaBeta(x)).join(', '), a.x.map((x) => Number(x.toPrecision(8))).join('; ')),
    cell(formatFixed(a.piEnergyBeta, 4), a.piEnergyBeta),
    cell(formatFixed(a.delocalizationBeta, 4), a.delocalizationBeta),
    cell(formatFixed(a.homoLumoGapBeta, 4), a.homoLumoGapBeta),
  ];
}

/** A short name of a variant for the first column, e.g. "Za = 1, Zb = 2, ζ = 1.2", "O2+", "ring of 6". */
export function variantLabel(v: Variant): string {
  switch (v.family) {
    case 'one-electron':
      return `Za = ${v.za}, Zb = ${v.zb}, ${v.zeta === 'optimized' ? 'ζ optimized' : `ζ = ${v.zeta}`}`;
    case 'two-electron':
      return v.zeta === 'optimized' ? 'ζ optimized' : `ζ = ${v.zeta}`;
    case 'diatomic':
      return v.species;
    case 'huckel':
      return v.system.kind === 'graph' ? v.system.name : `${v.system.kind} of ${v.system.n}`;
  }
}

export type AnswerRow = { variant: Variant; cells: AnswerCell[] | null; error: string | null };

export function answerKeyCsv(family: ModelSpec['family'], units: PlotUnits, rows: readonly AnswerRow[]): string {
  const columns = answerColumns(family, units);
  return buildCsv(
    ['variant', ...columns.map((c) => c.csvHeader), 'problem'],
    rows.map((r) => [variantLabel(r.variant), ...(r.cells ? r.cells.map((c) => c.raw) : columns.map(() => null)), r.error ?? '']),
  );
}

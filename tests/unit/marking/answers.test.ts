/**
 * Typed answers from a personal template's answer cells (hidden "bondmark-meta" sheet) or from a
 * two-column "question,answer" CSV, and marking O2 with them.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import { computeReference } from '@shared/exercises/reference';
import { markingSchemeSchema, modelSpecSchema } from '@shared/exercises/spec';
import { drawVariant } from '@shared/exercises/variants';
import { answersFromTemplateInfo, readAnswerFile, readTemplateAnswers } from '@shared/marking/answers';
import { markReport } from '@shared/marking/score';
import { FIXTURE_DIR } from '../../fixtures/marking/make-fixtures';

const fixture = (name: string) => new Uint8Array(readFileSync(join(FIXTURE_DIR, name)));
const text = (s: string) => new TextEncoder().encode(s);

const o2Model = modelSpecSchema.parse({ family: 'diatomic', species: ['O2'], order: 'auto' });
const o2 = computeReference(o2Model, drawVariant(o2Model, 's', 'k'));
const moScheme = markingSchemeSchema.parse({
  checks: ['configuration', 'bond-order', 'unpaired-electrons', 'term-symbol'].map((kind) => ({ kind, id: kind, label: kind, weight: 1 })),
});

describe('readTemplateAnswers', () => {
  it('reads the cells the template meta sheet names (answers-o2.xlsx), numbers as numbers', async () => {
    const reading = await readAnswerFile(fixture('answers-o2.xlsx'));
    expect(reading.source).toBe('template');
    expect(reading.answers).toEqual({
      configuration: 'KK (2σg)² (2σu*)² (3σg)² (1πu)⁴ (1πg*)²',
      'bond-order': 2,
      'unpaired-electrons': '2',
      'term-symbol': '3Σg-',
    });
    // O2: configuration, bond order 2, 2 unpaired, ³Σg⁻ (science.md §4)
    expect(markReport({ spec: { scheme: moScheme }, reference: o2, answers: reading.answers }).total).toBe(4);
  });

  it('reads a two-column question,answer CSV (answers-o2.csv) with the same marks', async () => {
    const answers = await readTemplateAnswers(fixture('answers-o2.csv'));
    expect(answers).toEqual({
      configuration: '(1σg)²(1σu*)²(2σg)²(2σu*)²(3σg)²(1πu)⁴(1πg*)²',
      'bond-order': '2',
      'unpaired-electrons': '2',
      'term-symbol': '^3\\Sigma_g^-',
    });
    expect(markReport({ spec: { scheme: moScheme }, reference: o2, answers }).total).toBe(4);
  });

  it('CSV: no header, semicolons, names with spaces, unquoted extra fields joined, empty answers null', async () => {
    const answers = await readTemplateAnswers(text('Term symbol;3Σg-\nbond order;2,5\nhuckel_energies;1.618;0.618;-0.618;-1.618\nunpaired-electrons;\n'));
    expect(answers).toEqual({ 'term-symbol': '3Σg-', 'bond-order': '2,5', 'huckel-energies': '1.618, 0.618, -0.618, -1.618', 'unpaired-electrons': null });
  });

  it('a formula cell gives its saved result; a cell on the data sheet is found without a sheet name', async () => {
    const workbook = new ExcelJS.Workbook();
    const data = workbook.addWorksheet('Curve');
    data.getCell('F2').value = { formula: '1+1', result: 2 } as ExcelJS.CellFormulaValue;
    data.getCell('F3').value = { richText: [{ text: '3Σ' }, { text: 'g-' }] };
    const meta = workbook.addWorksheet('bondmark-meta', { state: 'hidden' });
    meta.addRows([
      ['format', 'bondmark-template'],
      ['dataSheet', 'Curve'],
      ['answer:bond-order', 'F2'],
      ['answer:term-symbol', 'F3'],
      ['answer:configuration', 'F4'],
      ['answer:unpaired-electrons', 'Missing!A1'],
    ]);
    const reading = await readAnswerFile(new Uint8Array(await workbook.xlsx.writeBuffer()));
    expect(reading.answers).toEqual({ 'bond-order': 2, 'term-symbol': '3Σg-', configuration: null });
    expect(reading.warnings).toEqual(['The template\'s answer cell for unpaired-electrons is on a sheet "Missing" the workbook does not have.']);
  });

  it('never throws: empty, damaged zip, text without answers', async () => {
    expect(await readAnswerFile(new Uint8Array())).toMatchObject({ answers: {}, source: 'none' });
    const broken = new Uint8Array([0x50, 0x4b, 0x03, 0x04, 1, 2, 3, 4, 5]);
    const reading = await readAnswerFile(broken);
    expect(reading.answers).toEqual({});
    expect(reading.warnings[0]).toMatch(/^The answer file could not be read/);
    expect(await readAnswerFile(text('just one column\nof words\n'))).toMatchObject({ answers: {}, source: 'none' });
  });

  it('answersFromTemplateInfo turns the reader’s template answers into the same record', () => {
    expect(answersFromTemplateInfo({ answers: { 'Term symbol': { value: ' 3Σg- ' }, 'bond-order': { value: 2 }, configuration: { value: '' } } })).toEqual({
      'term-symbol': '3Σg-',
      'bond-order': 2,
      configuration: null,
    });
    expect(answersFromTemplateInfo(undefined)).toEqual({});
  });
});

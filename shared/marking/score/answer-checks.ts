/**
 * The checks on typed answers: MO configuration, bond order, unpaired electrons and ground term
 * symbol (diatomic exercises), orbital energies (Hückel exercises). What each accepts is written
 * in parse-configuration.ts, parse-count.ts, parse-huckel-energies.ts and, for term symbols,
 * shared/chemistry/diatomics/parse-term-symbol.ts.
 */
import { formatTermSymbol, parseTermSymbol, termSymbolsEqual } from '@shared/chemistry/diatomics';
import type { Check } from '@shared/exercises/spec';
import { creditFraction } from './credit';
import { MarkContext, notEvaluated, type Outcome } from './context';
import { decimalsFor, formatFixed, formatSmall, formatTolerance } from './format';
import { compareConfiguration } from './parse-configuration';
import { parseAnswerCount, parseAnswerNumber } from './parse-count';
import { parseHuckelEnergies } from './parse-huckel-energies';

const quoted = (value: string | number) => {
  const text = String(value).trim();
  return `'${text.length > 80 ? `${text.slice(0, 80)}…` : text}'`;
};

function diagramOf(check: Check, ctx: MarkContext) {
  return ctx.reference.kind === 'diagram' ? ctx.reference : null;
}

function wrongReference(check: Check, ctx: MarkContext): Outcome {
  return notEvaluated(`A ${check.kind} check does not apply to this exercise's reference (a ${ctx.reference.kind})`);
}

export function configuration(check: Extract<Check, { kind: 'configuration' }>, ctx: MarkContext): Outcome {
  const reference = diagramOf(check, ctx);
  if (!reference) return wrongReference(check, ctx);
  const expected = reference.answers.configuration;
  const answer = ctx.answerFor(check);
  if (answer === null) return notEvaluated(`No configuration was given; expected ${expected}`, expected);
  const text = String(answer);
  const reading = compareConfiguration(text, reference.diagram);
  if (!reading.ok) {
    return { fraction: 0, text: `The configuration ${quoted(text)} could not be read (${reading.reason}); expected ${expected}`, expected, found: text, unit: null, deviation: null, evaluated: false };
  }
  return {
    fraction: reading.matches ? 1 : 0,
    text: reading.matches
      ? `Configuration ${quoted(text)} gives every level of ${reference.diagram.display} its electrons, as expected (${expected})`
      : `Configuration ${quoted(text)} does not fill the levels as expected: ${expected}`,
    expected,
    found: text,
    unit: null,
    deviation: null,
    evaluated: true,
  };
}

export function bondOrder(check: Extract<Check, { kind: 'bond-order' }>, ctx: MarkContext): Outcome {
  const reference = diagramOf(check, ctx);
  if (!reference) return wrongReference(check, ctx);
  const expected = reference.answers.bondOrder;
  const answer = ctx.answerFor(check);
  if (answer === null) return notEvaluated(`No bond order was given; expected ${expected}`, expected);
  const found = parseAnswerNumber(answer);
  if (found === null) return { ...notEvaluated(`The bond order ${quoted(answer)} is not a number; expected ${expected}`, expected), found: String(answer) };
  // bond orders come in steps of ½: the answer must be that same half-step value
  const right = Math.abs(found - expected) < 1e-6;
  return {
    fraction: right ? 1 : 0,
    text: right ? `Bond order ${found}, as expected` : `Bond order found ${found}, expected ${expected}`,
    expected,
    found,
    unit: null,
    deviation: Math.abs(found - expected),
    evaluated: true,
  };
}

export function unpairedElectrons(check: Extract<Check, { kind: 'unpaired-electrons' }>, ctx: MarkContext): Outcome {
  const reference = diagramOf(check, ctx);
  if (!reference) return wrongReference(check, ctx);
  const expected = reference.answers.unpairedElectrons;
  const answer = ctx.answerFor(check);
  if (answer === null) return notEvaluated(`No number of unpaired electrons was given; expected ${expected}`, expected);
  const found = parseAnswerCount(answer);
  if (found === null) return { ...notEvaluated(`The number of unpaired electrons ${quoted(answer)} is not a whole number; expected ${expected}`, expected), found: String(answer) };
  const right = found === expected;
  return {
    fraction: right ? 1 : 0,
    text: right ? `${found} unpaired electron${found === 1 ? '' : 's'}, as expected` : `Unpaired electrons found ${found}, expected ${expected}`,
    expected,
    found,
    unit: null,
    deviation: Math.abs(found - expected),
    evaluated: true,
  };
}

export function termSymbol(check: Extract<Check, { kind: 'term-symbol' }>, ctx: MarkContext): Outcome {
  const reference = diagramOf(check, ctx);
  if (!reference) return wrongReference(check, ctx);
  const expected = reference.answers.termSymbol;
  const answer = ctx.answerFor(check);
  if (answer === null) return notEvaluated(`No term symbol was given; expected ${expected}`, expected);
  const text = String(answer);
  const parsed = parseTermSymbol(text);
  if (!parsed.ok) {
    return { fraction: 0, text: `The term symbol ${quoted(text)} could not be read (${parsed.reason}); expected ${expected}`, expected, found: text, unit: null, deviation: null, evaluated: false };
  }
  const shown = formatTermSymbol(parsed.term);
  const right = termSymbolsEqual(parsed.term, reference.diagram.termSymbol);
  const readAs = shown === text.trim() ? '' : ` (${quoted(text)} read as ${shown})`;
  return {
    fraction: right ? 1 : 0,
    text: right ? `Term symbol ${shown}${readAs}, as expected` : `Term symbol found ${shown}${readAs}, expected ${expected}`,
    expected,
    found: shown,
    unit: null,
    deviation: null,
    evaluated: true,
  };
}

/** Distinct values of a sorted list (within 1e−6). */
function distinct(sorted: number[]): number[] {
  const out: number[] = [];
  for (const v of sorted) if (out.length === 0 || Math.abs(out[out.length - 1] - v) > 1e-6) out.push(v);
  return out;
}

export function huckelEnergies(check: Extract<Check, { kind: 'huckel-energies' }>, ctx: MarkContext): Outcome {
  if (ctx.reference.kind !== 'huckel') return wrongReference(check, ctx);
  const unit = '|β|';
  const decimals = Math.max(3, decimalsFor(check.full > 0 ? check.full : check.zero / 10));
  const show = (xs: number[]) => xs.map((x) => formatFixed(x, decimals)).join(', ');
  const expectedAll = [...ctx.reference.answers.x].sort((a, b) => b - a);
  const expectedText = `x = ${show(expectedAll)}`;
  const answer = ctx.answerFor(check);
  if (answer === null) return notEvaluated(`No orbital energies were given; expected ${expectedText}`, show(expectedAll), unit);
  const parsed = parseHuckelEnergies(answer);
  if (!parsed.ok) {
    return { fraction: 0, text: `The energies ${quoted(answer)} could not be read (${parsed.reason}); expected ${expectedText}`, expected: show(expectedAll), found: String(answer), unit, deviation: null, evaluated: false };
  }
  const found = [...parsed.x].sort((a, b) => b - a);
  let expected = expectedAll;
  let note = '';
  if (found.length !== expectedAll.length) {
    const levels = distinct(expectedAll);
    if (found.length === levels.length && levels.length < expectedAll.length) {
      expected = levels;
      note = ' (degenerate levels given once)';
    } else {
      return {
        fraction: 0,
        text: `${found.length} energies were given (${show(found)}), expected ${expectedAll.length}, one per orbital: ${expectedText}`,
        expected: show(expectedAll),
        found: show(found),
        unit,
        deviation: null,
        evaluated: true,
      };
    }
  }
  let deviation = 0;
  found.forEach((x, i) => (deviation = Math.max(deviation, Math.abs(x - expected[i]))));
  const tolerance = check.credit === 'all-or-nothing' ? `±${formatTolerance(check.full)} ${unit}, all or nothing` : `±${formatTolerance(check.full)} ${unit} for full points`;
  return {
    fraction: creditFraction(deviation, check),
    text: `Orbital energies found x = ${show(found)}${note}, expected ${expectedText}, largest deviation ${formatSmall(deviation)} ${unit} (${tolerance})`,
    expected: show(expected),
    found: show(found),
    unit,
    deviation,
    evaluated: true,
  };
}

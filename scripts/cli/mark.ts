/**
 * `mark`: marks a report file against a curve model, as the web marking does, and prints JSON
 * {"units":{"distance","energy"},"points","re_bohr","de_ev","rmsd_hartree","checks":[{"id","points","max","message"}],"total","max"}.
 * The reference is the model computed at the file's own distances (curveReferenceAt). An
 * unreadable report exits 2 with the reader's message (the one the upload page shows) on one line.
 */
import { readFileSync } from 'node:fs';
import { basename } from 'node:path';
import type { CurveModel, CurveState } from '@shared/chemistry/curves';
import { distanceUnits, energyUnits, type DistanceUnit, type EnergyUnit } from '@shared/chemistry/units';
import { checksByFamily, markingSchemeSchema, type MarkingScheme } from '@shared/exercises/spec';
import { readReport, readReportWithChoice, unitFromText } from '@shared/marking/read';
import { curveReferenceAt, defaultCurveScheme, markReport } from '@shared/marking/score';
import { CliInputError, type CliCommand } from './command';
import { curveParamsFromFlags, modelOptions, modelUsage } from './model-flags';
import { writeJson } from './output';

function familyOf(model: CurveModel): 'one-electron' | 'two-electron' {
  return model.startsWith('h2-') ? 'two-electron' : 'one-electron';
}

/** "angstrom,ev", "Å,eV", "bohr,hartree", "pm,kJ/mol" → the two units */
export function parseUnitsFlag(text: string): { distance: DistanceUnit; energy: EnergyUnit } {
  const parts = text.split(',').map((p) => p.trim());
  if (parts.length !== 2 || parts.some((p) => p === '')) {
    throw new CliInputError(`--units must be <distance>,<energy>, e.g. angstrom,ev (got '${text}')`);
  }
  const [d, e] = parts;
  const distance = (distanceUnits as readonly string[]).includes(d.toLowerCase()) ? (d.toLowerCase() as DistanceUnit) : unitFromText(d).distance;
  const energy = (energyUnits as readonly string[]).includes(e.toLowerCase()) ? (e.toLowerCase() as EnergyUnit) : unitFromText(e).energy;
  if (!distance) throw new CliInputError(`--units: '${d}' is not a distance unit (${distanceUnits.join(', ')})`);
  if (!energy) throw new CliInputError(`--units: '${e}' is not an energy unit (${energyUnits.join(', ')})`);
  return { distance, energy };
}

/** A scheme file: {"checks":[…]} or a bare array of checks, validated like the authoring form. */
export function readSchemeFile(path: string, family: 'one-electron' | 'two-electron'): MarkingScheme {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (error) {
    throw new CliInputError(`cannot read --scheme file '${path}' (${(error as NodeJS.ErrnoException).code ?? 'unreadable'})`);
  }
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (error) {
    throw new CliInputError(`--scheme file '${path}' is not JSON (${(error as Error).message})`);
  }
  const parsed = markingSchemeSchema.safeParse(Array.isArray(json) ? { checks: json } : json);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    throw new CliInputError(`--scheme file '${path}': ${issue.path.length > 0 ? `${issue.path.join('.')}: ` : ''}${issue.message}`);
  }
  const wrong = parsed.data.checks.find((c) => !checksByFamily[family].includes(c.kind));
  if (wrong) throw new CliInputError(`--scheme file '${path}': a ${wrong.kind} check does not apply to a ${family} curve model`);
  return parsed.data;
}

export const markCommand: CliCommand = {
  name: 'mark',
  summary: 'marks a report file (CSV/TSV/XLSX) against a curve model, as JSON',
  usage: `mark --model <model> [--za 1 --zb 1] [--zeta 1|opt] [--state bonding|antibonding] --report FILE [--scheme scheme.json] [--units angstrom,ev]
${modelUsage}
  --report FILE             the data file: CSV/TSV/text or .xlsx with a distance column and energy columns
  --scheme FILE             marking scheme JSON ({"checks":[…]}, see README "Marking schemes");
                            default: curve-rms, equilibrium-distance, well-depth
                            (+ antibonding-repulsive with --state antibonding)
  --units <distance>,<energy>
                            the file's units when its headers do not say (bohr|angstrom|pm, hartree|ev|kj/mol|kcal/mol|cm-1)
With --state antibonding the file is expected to hold both curves (bonding and antibonding).
Prints JSON: units, points, re_bohr, de_ev, rmsd_hartree, checks [{id, points, max, message}], total, max.
An unreadable report exits with status 2 and the reader's message on one line.`,
  options: { ...modelOptions, report: { type: 'string' }, scheme: { type: 'string' }, units: { type: 'string' } },
  async run(values, out) {
    const params = curveParamsFromFlags(values);
    if (typeof values.report !== 'string' || values.report.trim() === '') throw new CliInputError('--report FILE is required (a CSV/TSV/XLSX data file)');
    const units = typeof values.units === 'string' ? parseUnitsFlag(values.units) : null;
    const scheme = typeof values.scheme === 'string' ? readSchemeFile(values.scheme, familyOf(params.model)) : defaultCurveScheme({ antibonding: params.state === 'antibonding' });
    let bytes: Uint8Array;
    try {
      bytes = new Uint8Array(readFileSync(values.report));
    } catch (error) {
      throw new CliInputError(`cannot read --report file '${values.report}' (${(error as NodeJS.ErrnoException).code ?? 'unreadable'})`);
    }
    const fileName = basename(values.report);
    const reading = units
      ? await readReportWithChoice(bytes, { fileName, distanceUnit: units.distance, energyUnit: units.energy })
      : await readReport(bytes, { fileName });
    if (!reading.ok) throw new CliInputError(reading.error.message);

    const states: CurveState[] = params.state === 'antibonding' ? ['bonding', 'antibonding'] : ['bonding'];
    const { state: _state, ...model } = params;
    const reference = curveReferenceAt(model, states, reading.points.distance);
    const result = markReport({ spec: { scheme }, reference, reading });

    let sum = 0;
    let count = 0;
    for (const c of result.curves) for (const d of c.deviationHartree) { sum += d * d; count++; }
    writeJson(out, {
      units: { distance: reading.units.distance, energy: reading.units.energy },
      points: reading.points.distance.length,
      re_bohr: result.curve?.reBohr ?? null,
      de_ev: result.curve?.deEv ?? null,
      rmsd_hartree: count > 0 ? Math.sqrt(sum / count) : null,
      checks: result.checks.map((c) => ({ id: c.id, points: c.points, max: c.max, message: c.message })),
      total: result.total,
      max: result.max,
    });
  },
};

/**
 * Marks one report against its variant's Reference: every check of the scheme gives points (partial
 * credit by its rule) and one sentence of feedback; the late penalty (exercises/late.ts) comes off
 * the sum. Never throws for anything in the student's data: a check that cannot be evaluated gets
 * 0 points and a sentence saying why.
 */
import { latePenalty, type LateOutcome } from '@shared/exercises/late';
import { ENGINE_VERSION } from '@shared/exercises/reference';
import type { Check } from '@shared/exercises/spec';
import { bondOrder, configuration, huckelEnergies, termSymbol, unpairedElectrons } from './answer-checks';
import { MarkContext, checkResult, notEvaluated, type Outcome } from './context';
import { roundPoints } from './credit';
import { antibondingRepulsive, curveDeviation, equilibriumDistance, vibrationalWavenumber, wellDepth } from './curve-checks';
import type { CheckResult, CurveSummary, MarkReportInput, MarkResult } from './types';

/** Version of the scoring rules (bumped when a change here can change a mark). */
export const MARKING_VERSION = '2026.12.1';

function outcomeOf(check: Check, ctx: MarkContext): Outcome {
  switch (check.kind) {
    case 'curve-rms':
    case 'curve-max':
      return curveDeviation(check, ctx);
    case 'equilibrium-distance':
      return equilibriumDistance(check, ctx);
    case 'well-depth':
      return wellDepth(check, ctx);
    case 'vibrational-wavenumber':
      return vibrationalWavenumber(check, ctx);
    case 'antibonding-repulsive':
      return antibondingRepulsive(check, ctx);
    case 'configuration':
      return configuration(check, ctx);
    case 'bond-order':
      return bondOrder(check, ctx);
    case 'unpaired-electrons':
      return unpairedElectrons(check, ctx);
    case 'term-symbol':
      return termSymbol(check, ctx);
    case 'huckel-energies':
      return huckelEnergies(check, ctx);
    case 'manual':
      return { fraction: 0, text: 'marked by hand', expected: null, found: null, unit: null, deviation: null, evaluated: false };
    default:
      return notEvaluated(`Unknown check kind '${(check as { kind: string }).kind}'`);
  }
}

function markCheck(check: Check, ctx: MarkContext): CheckResult {
  let outcome: Outcome;
  try {
    outcome = outcomeOf(check, ctx);
  } catch (error) {
    outcome = notEvaluated(`This check could not be evaluated (${(error instanceof Error ? error.message : String(error)).replace(/\.$/, '')})`);
  }
  if (check.kind === 'manual') {
    // the sentence is the marker's to write; keep it as the short note the brief asks for
    return { ...checkResult(check, outcome), message: 'marked by hand' };
  }
  return checkResult(check, outcome);
}

function curveSummaries(ctx: MarkContext): CurveSummary[] {
  const pairing = ctx.pairing();
  const primary = ctx.primaryState();
  if (!pairing) return [];
  return pairing.curves.map((curve) => {
    const distanceBohr: number[] = [];
    const energyHartree: number[] = [];
    const deviationHartree: number[] = [];
    let sum = 0;
    for (let i = 0; i < curve.distanceBohr.length; i++) {
      const d = curve.energyTotal[i] - curve.referenceHartree[i];
      if (!Number.isFinite(d)) continue;
      distanceBohr.push(curve.distanceBohr[i]);
      energyHartree.push(curve.energyAsRead[i]);
      deviationHartree.push(d);
      sum += d * d;
    }
    // Re, De and ωe describe the curve the reference's minimum belongs to; the others are not analysed
    const analysis = curve.state === primary ? ctx.analysis(curve.state).analysis : null;
    return {
      state: curve.state,
      column: curve.column,
      distanceBohr,
      energyHartree,
      deviationHartree,
      rmsdHartree: deviationHartree.length > 0 ? Math.sqrt(sum / deviationHartree.length) : null,
      reBohr: analysis?.reBohr ?? null,
      deEv: analysis?.deEv ?? null,
      harmonicWavenumberCm1: analysis?.harmonicWavenumberCm1 ?? null,
    };
  });
}

export function markReport(input: MarkReportInput): MarkResult {
  const ctx = new MarkContext(input.reference, input.reading ?? null, input.answers ?? {}, input.referenceEvaluation ?? 'exact');
  const checks = input.spec.scheme.checks.map((check) => markCheck(check, ctx));
  const points = roundPoints(checks.reduce((s, c) => s + c.points, 0));
  const max = roundPoints(checks.reduce((s, c) => s + c.max, 0));
  let late: LateOutcome | null = null;
  if (input.submittedAt && input.dueAt && input.spec.late) {
    late = latePenalty({ submittedAt: input.submittedAt, dueAt: input.dueAt, extensionMinutes: input.extensionMinutes, policy: input.spec.late });
  }
  const latePenaltyPercent = late?.penaltyPercent ?? 0;
  const curves = curveSummaries(ctx);
  const primary = ctx.primaryState();
  const pairing = ctx.pairing();
  return {
    checks,
    points,
    max,
    latePenaltyPercent,
    late,
    total: roundPoints(points * (1 - latePenaltyPercent / 100)),
    engineVersion: ENGINE_VERSION,
    markingVersion: MARKING_VERSION,
    curve: curves.find((c) => c.state === primary) ?? curves[0] ?? null,
    curves,
    notes: pairing ? [...pairing.notes] : [],
  };
}

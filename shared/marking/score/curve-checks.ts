/**
 * The checks on a potential-energy curve: deviation from the reference (RMS or largest, on the
 * common range of R), Re, De and ωe of the student's own curve (shared/chemistry/analysis), and
 * whether the antibonding curve is repulsive. Sentences speak in the student's units.
 */
import { classifyCurve, type CurveClassification, type CurveKind } from '@shared/chemistry/analysis';
import { energyToHartree } from '@shared/chemistry/units';
import type { Check } from '@shared/exercises/spec';
import { creditFraction } from './credit';
import { MarkContext, notEvaluated, referenceCurveKind, referenceReducedMassMe, type Outcome } from './context';
import { decimalsFor, distanceIn, distanceLabel, energyIn, energyLabel, formatFixed, formatSmall, formatTolerance } from './format';
import { referenceRangeBohr } from './reference-values';

type ToleranceCheck = Extract<Check, { full: number }>;

function toleranceText(check: ToleranceCheck, fullShown: string, unit: string): string {
  return check.credit === 'all-or-nothing' ? `±${fullShown} ${unit}, all or nothing` : `±${fullShown} ${unit} for full points`;
}

function rangeText(fromBohr: number, toBohr: number, ctx: MarkContext): string {
  const unit = ctx.reading!.units.distance;
  const decimals = unit === 'pm' ? 0 : 2;
  return `${formatFixed(distanceIn(fromBohr, unit), decimals)}–${formatFixed(distanceIn(toBohr, unit), decimals)} ${distanceLabel(unit)}`;
}

function curvePreconditions(check: Check, ctx: MarkContext): Outcome | null {
  if (!ctx.curveReference) return notEvaluated(`A ${check.kind} check needs a curve exercise, and this reference is a ${ctx.reference.kind}`);
  if (!ctx.reading) return notEvaluated('No data file was read, so there is no curve to compare with the reference');
  const pairing = ctx.pairing()!;
  if (pairing.curves.length === 0) return notEvaluated('No energy column of your file could be paired with a reference curve');
  return null;
}

/** curve-rms and curve-max: deviation of the student's total energies from the reference on the common range. */
export function curveDeviation(check: Extract<Check, { kind: 'curve-rms' | 'curve-max' }>, ctx: MarkContext): Outcome {
  const refused = curvePreconditions(check, ctx);
  if (refused) return refused;
  const reference = ctx.curveReference!;
  const reading = ctx.reading!;
  const pairing = ctx.pairing()!;
  const eu = energyLabel(reading.units.energy);
  const deviations: number[] = [];
  let low = Number.POSITIVE_INFINITY;
  let high = Number.NEGATIVE_INFINITY;
  let outside = 0;
  let failure: string | null = null;
  for (const curve of pairing.curves) {
    failure ??= curve.failure;
    for (let i = 0; i < curve.distanceBohr.length; i++) {
      const d = curve.energyTotal[i] - curve.referenceHartree[i];
      if (!Number.isFinite(d)) { outside++; continue; }
      deviations.push(d);
      low = Math.min(low, curve.distanceBohr[i]);
      high = Math.max(high, curve.distanceBohr[i]);
    }
  }
  const fullShown = formatTolerance(energyIn(check.full, reading.units.energy));
  if (deviations.length === 0) {
    const [a, b] = referenceRangeBohr(reference);
    return notEvaluated(`None of your points lies in the reference's range of R (${rangeText(a, b, ctx)}), so the curve could not be compared`, energyIn(check.full, reading.units.energy), eu);
  }
  const shift = check.removeShift ? deviations.reduce((s, d) => s + d, 0) / deviations.length : 0;
  let sumSquares = 0;
  let largest = 0;
  for (const d of deviations) {
    const e = d - shift;
    sumSquares += e * e;
    largest = Math.max(largest, Math.abs(e));
  }
  const deviation = check.kind === 'curve-rms' ? Math.sqrt(sumSquares / deviations.length) : largest;
  const states = reference.curves.length;
  const share = pairing.curves.length / states;
  const fraction = creditFraction(deviation, check) * share;
  const found = energyIn(deviation, reading.units.energy);
  const parts = [
    `${check.kind === 'curve-rms' ? 'RMS deviation' : 'Largest deviation'} from the reference ${formatSmall(found)} ${eu}`,
    ` over ${deviations.length} point${deviations.length === 1 ? '' : 's'} (${rangeText(low, high, ctx)}${outside > 0 ? `; ${outside} outside the reference's range not compared` : ''})`,
  ];
  if (check.removeShift) parts.push(` after removing a constant shift of ${formatSmall(energyIn(shift, reading.units.energy))} ${eu}`);
  if (reading.convention === 'relative') {
    parts.push(`, relative energies with the model's dissociation limit ${formatFixed(energyIn(reference.dissociationLimitHartree, reading.units.energy), 6)} ${eu} added to each`);
  }
  parts.push(`, expected at most ${fullShown} ${eu} for full points`);
  if (check.credit === 'all-or-nothing') parts.push(' (all or nothing)');
  else parts.push(` and none from ${formatTolerance(energyIn(check.zero, reading.units.energy))} ${eu}`);
  if (pairing.missing.length > 0) {
    parts.push(`; no ${pairing.missing.join(' or ')} column was found, so the points are scaled by ${pairing.curves.length} of ${states} curves`);
  }
  if (failure) parts.push(`; the model could not be evaluated at some of your distances (${failure}), so the reference was interpolated there`);
  return {
    fraction,
    text: parts.join(''),
    expected: energyIn(check.full, reading.units.energy),
    found,
    unit: eu,
    deviation,
    evaluated: true,
  };
}

function noMinimumText(ctx: MarkContext, state: string): string {
  const { analysis, error } = ctx.analysis(state as 'bonding');
  if (error) return `your ${state} curve could not be analysed (${error.replace(/\.$/, '')})`;
  return `no minimum was found in your ${state} curve (${analysis!.message.replace(/\.$/, '')})`;
}

/** equilibrium-distance: Re of the student's curve against the model's Re. */
export function equilibriumDistance(check: Extract<Check, { kind: 'equilibrium-distance' }>, ctx: MarkContext): Outcome {
  const refused = curvePreconditions(check, ctx);
  if (refused) return refused;
  const reference = ctx.curveReference!;
  const unit = ctx.reading!.units.distance;
  const du = distanceLabel(unit);
  const state = ctx.primaryState()!;
  if (!reference.minimum) return notEvaluated(`The reference ${state} curve has no minimum, so Re cannot be marked`, null, du);
  const decimals = decimalsFor(distanceIn(check.full > 0 ? check.full : check.zero / 10, unit));
  const expected = distanceIn(reference.minimum.reBohr, unit);
  const expectedText = `${formatFixed(expected, decimals)} ${du}`;
  const fullShown = formatTolerance(distanceIn(check.full, unit));
  if (!ctx.curveFor(state)) return notEvaluated(`No ${state} column was found; expected Re ${expectedText}`, expected, du);
  const { analysis } = ctx.analysis(state);
  if (!analysis || analysis.reBohr === null) return notEvaluated(`Re could not be found: ${noMinimumText(ctx, state)}; expected ${expectedText}`, expected, du);
  const deviation = Math.abs(analysis.reBohr - reference.minimum.reBohr);
  const found = distanceIn(analysis.reBohr, unit);
  return {
    fraction: creditFraction(deviation, check),
    text: `Re found ${formatFixed(found, decimals)} ${du}, expected ${expectedText} (${toleranceText(check, fullShown, du)})`,
    expected,
    found,
    unit: du,
    deviation,
    evaluated: true,
  };
}

/** well-depth: De of the student's curve (against the model's limit, or the curve's own tail for relative energies). */
export function wellDepth(check: Extract<Check, { kind: 'well-depth' }>, ctx: MarkContext): Outcome {
  const refused = curvePreconditions(check, ctx);
  if (refused) return refused;
  const reference = ctx.curveReference!;
  const energyUnit = ctx.reading!.units.energy;
  const eu = energyLabel(energyUnit);
  const state = ctx.primaryState()!;
  const inUnit = (ev: number) => energyIn(energyToHartree(ev, 'ev'), energyUnit);
  if (!reference.minimum) return notEvaluated(`The reference ${state} curve has no minimum, so De cannot be marked`, null, eu);
  const decimals = decimalsFor(inUnit(check.full > 0 ? check.full : check.zero / 10));
  const expected = inUnit(reference.minimum.deEv);
  const expectedText = `${formatFixed(expected, decimals)} ${eu}`;
  if (!ctx.curveFor(state)) return notEvaluated(`No ${state} column was found; expected De ${expectedText}`, expected, eu);
  const { analysis } = ctx.analysis(state);
  if (!analysis || analysis.deEv === null) return notEvaluated(`De could not be found: ${noMinimumText(ctx, state)}; expected ${expectedText}`, expected, eu);
  const deviation = Math.abs(analysis.deEv - reference.minimum.deEv);
  const found = inUnit(analysis.deEv);
  const source =
    analysis.limitSource === 'tail'
      ? ` from the tail of your relative energies${analysis.asymptote && !analysis.asymptote.flattened ? ', which has not flattened yet,' : ''}`
      : ` against the model's dissociation limit`;
  return {
    fraction: creditFraction(deviation, check),
    text: `De found ${formatFixed(found, decimals)} ${eu}${source}, expected ${expectedText} (${toleranceText(check, formatTolerance(inUnit(check.full)), eu)})`,
    expected,
    found,
    unit: eu,
    deviation,
    evaluated: true,
  };
}

const isotopeText = (isotopes: readonly [string, string]) => `${isotopes[0]}–${isotopes[1]}`;

/** vibrational-wavenumber: ωe from the curvature of the student's curve at Re, with the check's isotopes. */
export function vibrationalWavenumber(check: Extract<Check, { kind: 'vibrational-wavenumber' }>, ctx: MarkContext): Outcome {
  const refused = curvePreconditions(check, ctx);
  if (refused) return refused;
  const reference = ctx.curveReference!;
  const unit = 'cm⁻¹';
  const state = ctx.primaryState()!;
  const isotopes = check.isotopes ?? reference.isotopes;
  if (reference.harmonicWavenumberCm1 === null) return notEvaluated(`The reference ${state} curve has no harmonic wavenumber, so ωe cannot be marked`, null, unit);
  let muCheck: number;
  try {
    muCheck = referenceReducedMassMe(reference, isotopes);
  } catch (error) {
    return notEvaluated(`The isotopes ${isotopeText(isotopes)} are not known (${error instanceof Error ? error.message : String(error)})`, null, unit);
  }
  // ωe ∝ 1/√μ at fixed curvature (harmonic oscillator), so the reference's ωe scales exactly
  const expected = reference.harmonicWavenumberCm1 * Math.sqrt(referenceReducedMassMe(reference, reference.isotopes) / muCheck);
  const decimals = decimalsFor(check.full > 0 ? check.full : check.zero / 10);
  const expectedText = `${formatFixed(expected, decimals)} ${unit} for ${isotopeText(isotopes)}`;
  if (!ctx.curveFor(state)) return notEvaluated(`No ${state} column was found; expected ωe ${expectedText}`, expected, unit);
  const { analysis } = ctx.analysis(state);
  if (!analysis || analysis.curvatureHartreePerBohr2 === null || analysis.harmonicWavenumberCm1 === null) {
    return notEvaluated(`ωe could not be found: ${noMinimumText(ctx, state)}; expected ${expectedText}`, expected, unit);
  }
  const muAnalysis = referenceReducedMassMe(reference, reference.isotopes);
  const found = analysis.harmonicWavenumberCm1 * Math.sqrt(muAnalysis / muCheck);
  const deviation = Math.abs(found - expected);
  return {
    fraction: creditFraction(deviation, check),
    text: `ωe found ${formatFixed(found, decimals)} ${unit}, expected ${expectedText} (${toleranceText(check, formatTolerance(check.full), unit)})`,
    expected,
    found,
    unit,
    deviation,
    evaluated: true,
  };
}

/**
 * The shape that decides the antibonding check: classifyCurve's kind, except that a curve which
 * falls monotonically within the noise tolerance (its running-minimum test finds no violation)
 * counts as repulsive even when findMinimum reports a "minimum" in the noise of a flat tail
 * (seen on a σ = 2e−5 Eh noisy LCAO σu curve: a "well" at 10.5 a0 with no rise after it).
 */
export function shapeOf(classification: CurveClassification): CurveKind {
  if (classification.kind === 'bound' && classification.monotonicDecreasing) return 'repulsive';
  return classification.kind;
}

/** antibonding-repulsive: the student's antibonding curve has the shape the reference has on its grid (repulsive). */
export function antibondingRepulsive(check: Extract<Check, { kind: 'antibonding-repulsive' }>, ctx: MarkContext): Outcome {
  const refused = curvePreconditions(check, ctx);
  if (refused) return refused;
  const reference = ctx.curveReference!;
  if (!reference.curves.some((c) => c.state === 'antibonding')) return notEvaluated('This exercise has no antibonding curve to check');
  const expectedKind = referenceCurveKind(reference, 'antibonding') ?? 'repulsive';
  const curve = ctx.curveFor('antibonding');
  if (!curve) return notEvaluated('No antibonding column found, so its shape could not be checked', expectedKind);
  let classification: CurveClassification;
  try {
    classification = classifyCurve({ distanceBohr: curve.distanceBohr, energyHartree: curve.energyAsRead });
  } catch (error) {
    return notEvaluated(`Your antibonding curve could not be analysed (${(error instanceof Error ? error.message : String(error)).replace(/\.$/, '')})`, expectedKind);
  }
  const foundKind = shapeOf(classification);
  const unit = ctx.reading!.units.distance;
  const describe = (): string => {
    if (foundKind === 'repulsive') return 'falls steadily with R (repulsive)';
    if (classification.kind === 'bound' && classification.minimum) {
      return `has a minimum near R = ${formatFixed(distanceIn(classification.minimum.reBohr, unit), unit === 'pm' ? 0 : 2)} ${distanceLabel(unit)}`;
    }
    return `is neither repulsive nor bound (${classification.message.replace(/^Unclear: /, '').replace(/\.$/, '')})`;
  };
  const matches = foundKind === expectedKind;
  const expectation = expectedKind === 'repulsive' ? 'a repulsive curve with no minimum' : `a ${expectedKind} curve like the reference`;
  return {
    fraction: matches ? 1 : 0,
    text: matches
      ? `Your antibonding curve ${describe()}, as expected`
      : `Your antibonding curve ${describe()}, expected ${expectation}`,
    expected: expectedKind,
    found: foundKind,
    unit: null,
    deviation: null,
    evaluated: true,
  };
}

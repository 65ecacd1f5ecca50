/**
 * One description of a potential-energy curve: kind, Re, E(Re), De, ωe and
 * warnings — the same for a computed reference and for an uploaded curve.
 * Combines prepareCurve, estimateNoise, classifyCurve (with findMinimum),
 * estimateAsymptote (when no limit is given), dissociationEnergy,
 * harmonicWavenumber and, on request, fitMorse; see those modules for the
 * methods and their sources.
 */
import { estimateAsymptote, type AsymptoteEstimate } from './estimate-asymptote';
import { classifyCurve, type CurveKind } from './classify-curve';
import { dissociationEnergy } from './dissociation-energy';
import { estimateNoise } from './estimate-noise';
import { fitMorse, type MorseFit } from './fit-morse';
import type { CurveMinimum } from './find-minimum';
import { harmonicWavenumber } from './harmonic-wavenumber';
import { prepareCurve, requireUsablePoints, type CurveInput } from './prepare-curve';
import { energyFromHartree } from '../units';

export interface AnalyseCurveOptions {
  /** dissociation limit of the same model; estimated from the curve's tail when omitted */
  limitHartree?: number;
  /** reduced mass for ωe (reducedMassMe); ωe is null without it */
  reducedMassMe?: number;
  /** also fit a Morse potential (slower: 0.6–3 ms for 200 points, against ≈ 0.05 ms for the rest) */
  fitMorse?: boolean;
  /** noise tolerance for classification, Eh (default 6σ + 1e−10) */
  toleranceHartree?: number;
}

export interface CurveAnalysis {
  kind: CurveKind;
  message: string;
  reBohr: number | null;
  energyAtMinimumHartree: number | null;
  curvatureHartreePerBohr2: number | null;
  limitHartree: number | null;
  limitSource: 'given' | 'tail' | null;
  deHartree: number | null;
  deEv: number | null;
  harmonicWavenumberCm1: number | null;
  morse: MorseFit | null;
  minimum: CurveMinimum | null;
  asymptote: AsymptoteEstimate | null;
  noiseHartree: number;
  toleranceHartree: number;
  /** usable points after cleaning */
  pointsUsed: number;
  pointsSkipped: number;
  duplicatesMerged: number;
  warnings: string[];
}

const format = (v: number) => v.toPrecision(3);

export function analyseCurve(input: CurveInput, options: AnalyseCurveOptions = {}): CurveAnalysis {
  const curve = prepareCurve(input);
  requireUsablePoints(curve);
  const warnings: string[] = [];
  if (curve.pointsSkipped > 0) {
    warnings.push(`${curve.pointsSkipped} point${curve.pointsSkipped === 1 ? '' : 's'} skipped (missing, not finite or at R ≤ 0).`);
  }
  if (curve.duplicatesMerged > 0) {
    warnings.push(`${curve.duplicatesMerged} point${curve.duplicatesMerged === 1 ? '' : 's'} at a repeated distance merged (mean energy).`);
  }
  const noise = estimateNoise(curve);
  const classification = classifyCurve(curve, { noiseHartree: noise, toleranceHartree: options.toleranceHartree });
  const result: CurveAnalysis = {
    kind: classification.kind,
    message: classification.message,
    reBohr: null,
    energyAtMinimumHartree: null,
    curvatureHartreePerBohr2: null,
    limitHartree: options.limitHartree ?? null,
    limitSource: options.limitHartree === undefined ? null : 'given',
    deHartree: null,
    deEv: null,
    harmonicWavenumberCm1: null,
    morse: null,
    minimum: classification.minimum,
    asymptote: null,
    noiseHartree: noise,
    toleranceHartree: classification.toleranceHartree,
    pointsUsed: curve.count,
    pointsSkipped: curve.pointsSkipped,
    duplicatesMerged: curve.duplicatesMerged,
    warnings,
  };
  const minimum = classification.minimum;
  if (!minimum) {
    if (classification.kind === 'unclear') warnings.push(classification.message);
    return result;
  }
  result.reBohr = minimum.reBohr;
  result.energyAtMinimumHartree = minimum.energyHartree;
  result.curvatureHartreePerBohr2 = minimum.curvatureHartreePerBohr2;

  const x = curve.distanceBohr;
  if (minimum.windowBohr[0] === x[0] || minimum.windowBohr[1] === x[curve.count - 1]) {
    warnings.push('The minimum lies close to the end of the data; sample further on both sides of Re.');
  }
  if (minimum.wellDepthHartree < 20 * noise) {
    warnings.push(`The well is only ${format(minimum.wellDepthHartree / Math.max(noise, Number.MIN_VALUE))} times the noise level (${format(noise)} Eh).`);
  }

  let limit = options.limitHartree;
  if (limit === undefined) {
    const asymptote = estimateAsymptote(curve, { noiseHartree: noise });
    result.asymptote = asymptote;
    result.limitSource = 'tail';
    limit = asymptote.limitHartree;
    if (!asymptote.flattened) {
      warnings.push(
        `The curve has not flattened by R = ${format(asymptote.tailBohr[1])} a0 (still changing by ${format(asymptote.tailChangeHartree)} Eh ` +
          `over its last ${asymptote.pointsUsed} points); De from its tail is too small.`,
      );
    }
  }
  result.limitHartree = limit;
  const de = dissociationEnergy(minimum.energyHartree, limit);
  result.deHartree = de;
  result.deEv = energyFromHartree(de, 'ev');
  if (!(de > 0)) warnings.push(`The minimum lies above the dissociation limit (De = ${format(de)} Eh): metastable, not bound.`);

  if (options.reducedMassMe !== undefined) {
    result.harmonicWavenumberCm1 = harmonicWavenumber({
      curvatureHartreePerBohr2: minimum.curvatureHartreePerBohr2,
      reducedMassMe: options.reducedMassMe,
    });
  }
  if (options.fitMorse) {
    const morse = fitMorse(curve);
    result.morse = morse;
    if (!morse.converged) warnings.push('The Morse fit did not converge.');
  }
  return result;
}

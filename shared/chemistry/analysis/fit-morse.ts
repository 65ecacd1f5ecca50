/**
 * Least-squares fit of a Morse potential (morse-energy.ts; Morse, Phys. Rev. 34
 * (1929) 57) to a curve: De, a, Re and the limit E∞.
 *
 * Method: Levenberg–Marquardt (Levenberg, Q. Appl. Math. 2 (1944) 164;
 * Marquardt, J. SIAM 11 (1963) 431) as implemented by the ml-levenberg-marquardt
 * package, with the analytic Jacobian. Energies are fitted relative to the
 * starting limit and in units of the starting De, so that all four parameters
 * are of order one. Starting values, unless given: Re, E(Re) and k from
 * findMinimum, E∞ from estimateAsymptote, De = E∞ − E(Re), a = √(k/2De).
 * The fit runs in rounds of 8 iterations; after each round the Gauss–Newton
 * step (least-squares solve of J·δ = r by QR, ml-matrix) is computed, and the
 * fit counts as converged when every parameter's step is below 1e−7 of its
 * size (floor 1e−7 in the scaled units), i.e. the parameters sit at a
 * stationary point of the sum of squares.
 */
import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import { Matrix, QrDecomposition } from 'ml-matrix';
import { estimateAsymptote } from './estimate-asymptote';
import { findMinimum } from './find-minimum';
import type { MorseParameters } from './morse-energy';
import { prepareCurve, requireUsablePoints, type CurveInput } from './prepare-curve';

export interface MorseFitOptions {
  /** fit only points at most this far above the lowest energy (default: all points) */
  energyWindowHartree?: number;
  /** iteration budget over all rounds (default 250) */
  maxIterations?: number;
}

export interface MorseFit extends MorseParameters {
  rmsResidualHartree: number;
  converged: boolean;
  iterations: number;
  pointsUsed: number;
  pointsSkipped: number;
}

const ROUND = 8;
const STEP_TOLERANCE = 1e-7;

/** scaled model: y = e + d[(1 − u)² − 1], u = exp(−a(R − re)); parameters [d, a, re, e] */
const model = (p: number[]) => {
  const [d, a, re, e] = p;
  return (r: number) => {
    const u = Math.exp(-a * (r - re));
    return e + d * (u * u - 2 * u);
  };
};
const jacobian = (p: number[]) => {
  const [d, a, re] = p;
  return (r: number) => {
    const u = Math.exp(-a * (r - re));
    const w = 2 * d * u * (1 - u);
    return [u * u - 2 * u, w * (r - re), -w * a, 1];
  };
};

function gaussNewtonStepIsSmall(x: number[], y: number[], p: number[]): boolean {
  const n = x.length;
  const jac = new Matrix(n, 4);
  const residual = new Matrix(n, 1);
  const f = model(p);
  const g = jacobian(p);
  for (let i = 0; i < n; i++) {
    const row = g(x[i]);
    for (let j = 0; j < 4; j++) jac.set(i, j, row[j]);
    residual.set(i, 0, y[i] - f(x[i]));
  }
  const qr = new QrDecomposition(jac);
  if (!qr.isFullRank()) return false;
  const step = qr.solve(residual);
  for (let j = 0; j < 4; j++) {
    const dj = step.get(j, 0);
    if (!Number.isFinite(dj) || Math.abs(dj) > STEP_TOLERANCE * Math.max(1, Math.abs(p[j]))) return false;
  }
  return true;
}

export function fitMorse(input: CurveInput, initial: Partial<MorseParameters> = {}, options: MorseFitOptions = {}): MorseFit {
  const curve = prepareCurve(input);
  requireUsablePoints(curve);
  const xAll = curve.distanceBohr;
  const yAll = curve.energyHartree;
  let lowest = 0;
  for (let i = 1; i < curve.count; i++) if (yAll[i] < yAll[lowest]) lowest = i;

  // starting values
  const minimum = initial.reBohr === undefined || initial.deHartree === undefined || initial.aPerBohr === undefined ? findMinimum(curve) : null;
  const reStart = initial.reBohr ?? minimum?.reBohr ?? xAll[lowest];
  const minEnergy = minimum?.energyHartree ?? yAll[lowest];
  const limitStart = initial.asymptoteHartree ?? estimateAsymptote(curve).limitHartree;
  let deStart = initial.deHartree ?? limitStart - minEnergy;
  if (!(deStart > 0)) deStart = Math.max(1e-6, 0.1 * (yAll[0] - yAll[lowest]));
  const aStart = initial.aPerBohr ?? (minimum ? Math.sqrt(minimum.curvatureHartreePerBohr2 / (2 * deStart)) : 1);

  // points to fit, scaled
  const window = options.energyWindowHartree ?? Number.POSITIVE_INFINITY;
  const keep: number[] = [];
  for (let i = 0; i < curve.count; i++) if (yAll[i] - yAll[lowest] <= window) keep.push(i);
  const m = keep.length;
  if (m < 5) {
    throw new RangeError(`Morse fit has ${m} usable points inside the energy window; at least 5 are needed.`);
  }
  const scale = deStart;
  // plain arrays: the package's per-point access is about twice as fast on them as on typed arrays
  const x: number[] = new Array(m);
  const y: number[] = new Array(m);
  for (let k = 0; k < m; k++) {
    x[k] = xAll[keep[k]];
    y[k] = (yAll[keep[k]] - limitStart) / scale;
  }
  const span = xAll[curve.count - 1] - xAll[0];
  let parameters = [deStart / scale, aStart, reStart, 0];
  const budget = options.maxIterations ?? 250;
  let iterations = 0;
  let converged = false;
  while (iterations < budget) {
    const result = levenbergMarquardt({ x, y }, model, {
      initialValues: parameters,
      jacobianFunction: jacobian,
      maxIterations: Math.min(ROUND, budget - iterations),
      errorTolerance: 0,
      minValues: [1e-9, 1e-4, xAll[0] - span, -1e6],
      maxValues: [1e6, 1e3, xAll[curve.count - 1] + span, 1e6],
    });
    iterations += result.iterations;
    parameters = result.parameterValues;
    if (!parameters.every(Number.isFinite)) break;
    if (gaussNewtonStepIsSmall(x, y, parameters)) {
      converged = true;
      break;
    }
  }

  const [d, a, re, e] = parameters;
  const f = model(parameters);
  let sum = 0;
  for (let k = 0; k < m; k++) {
    const r = y[k] - f(x[k]);
    sum += r * r;
  }
  return {
    deHartree: d * scale,
    aPerBohr: a,
    reBohr: re,
    asymptoteHartree: limitStart + e * scale,
    rmsResidualHartree: Math.sqrt(sum / m) * scale,
    converged,
    iterations,
    pointsUsed: m,
    pointsSkipped: curve.pointsSkipped,
  };
}

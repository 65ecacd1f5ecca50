/**
 * `npm run bench -- engine`: speed of the curve engine against a bare inline loop
 * of the closed-form ζ = 1 LCAO energy measured in the same run (targets: issue 3,
 * "Speed"). Every engine figure goes through shared/chemistry/curves, the interface
 * the command line, the references and the marking use; the model folders' own
 * entry points are shown beside it for information.
 */
import { curve, curvePoint, type CurveModelParams } from '@shared/chemistry/curves';
import { exactCurve } from '@shared/chemistry/exact';
import { lcaoCurve } from '@shared/chemistry/lcao';
import type { BenchOutcome } from './run';
import { consume, formatMilliseconds, formatTable, interleavedMedians, interleavedSamples, machineLine, median, pairedRatio, sink, warmUp } from './lib/measure';

const CURVE_POINTS = 1000;
const H2_POINTS = 200;
const EXACT_POINTS = 200;
const EXACT_ROUNDS = 5;

/** R = 0.5 + k·step, k = 0 … count − 1, ending at 10 bohr */
const gridBohr = (count: number, from = 0.5, to = 10) => Array.from({ length: count }, (_, k) => from + (k * (to - from)) / (count - 1));

const lcaoGrid = gridBohr(CURVE_POINTS);
const h2Grid = gridBohr(H2_POINTS);
const exactGrid = gridBohr(EXACT_POINTS);
const baselineOut = new Float64Array(CURVE_POINTS);

/**
 * Baseline: the textbook H2+ bonding energy with ζ = 1 (Pauling & Wilson 1935, ch. XII §42),
 * written inline: E+ = −½ + 1/R − (J + K)/(1 + S), S = e^(−R)(1 + R + R²/3),
 * J = (1/R)[1 − (1 + R)e^(−2R)], K = (1 + R)e^(−R).
 */
function baselineLoop(): void {
  for (let i = 0; i < CURVE_POINTS; i++) {
    const r = lcaoGrid[i];
    const e1 = Math.exp(-r);
    const s = e1 * (1 + r + (r * r) / 3);
    const j = (1 - (1 + r) * e1 * e1) / r;
    const k = (1 + r) * e1;
    baselineOut[i] = -0.5 + 1 / r - (j + k) / (1 + s);
  }
  consume(baselineOut);
}

const params = (p: Partial<CurveModelParams> & Pick<CurveModelParams, 'model'>): CurveModelParams => ({ za: 1, zb: 1, zeta: 1, state: 'bonding', ...p });

interface Row {
  what: string;
  points: number;
  perCurveMs: number | null;
  perPointMs: number;
  /** a ratio measured pairwise, when there is one; otherwise per point / baseline per point */
  ratio?: number;
  target?: { text: string; passed: boolean };
}

export default function engineBench(): BenchOutcome {
  console.log('Bondmark engine benchmark (issue 3, "Speed")');
  console.log(machineLine());

  // --- baseline and fixed-ζ LCAO, sampled in turn so that load changes hit both alike
  const fixed = () => consume(curve(params({ model: 'lcao' }), lcaoGrid).energyHartree);
  const fixedGeneral = () => consume(lcaoCurve({ za: 1, zb: 1, zeta: 1, state: 'bonding', distancesBohr: lcaoGrid }).energyHartree);
  for (const fn of [baselineLoop, fixed, fixedGeneral]) warmUp(fn, 400);
  const [baselineSamples, fixedSamples, fixedGeneralSamples] = interleavedSamples(
    [
      { fn: baselineLoop, repeat: 100 },
      { fn: fixed, repeat: 50 },
      { fn: fixedGeneral, repeat: 3 },
    ],
    101,
  );
  const [baselineMs, fixedMs, fixedGeneralMs] = [baselineSamples, fixedSamples, fixedGeneralSamples].map(median);
  // the target is a ratio: take it from samples measured side by side, not from two medians
  const fixedRatio = pairedRatio(fixedSamples, baselineSamples);
  const basePerPoint = baselineMs / CURVE_POINTS;

  // --- optimized-ζ LCAO curve
  const optimized = () => consume(curve(params({ model: 'lcao', zeta: 'opt' }), lcaoGrid).energyHartree);
  warmUp(optimized, 500);
  const [optimizedMs] = interleavedMedians([{ fn: optimized, repeat: 1 }], 21);

  // --- exact σg: single cold points, each call timed, median over points and rounds
  const exactParams = params({ model: 'exact' });
  warmUp(() => exactGrid.forEach((r) => consume(curvePoint(exactParams, r).energyHartree)), 500);
  const pointTimes: number[] = [];
  for (let round = 0; round < EXACT_ROUNDS; round++) {
    for (const r of exactGrid) {
      const start = performance.now();
      const e = curvePoint(exactParams, r).energyHartree;
      pointTimes.push(performance.now() - start);
      consume(e);
    }
  }
  const exactPointMs = median(pointTimes);
  const exactWarm = () => consume(exactCurve({ za: 1, zb: 1, distancesBohr: exactGrid }).totalHartree);
  warmUp(exactWarm, 300);
  const [exactCurveMs] = interleavedMedians([{ fn: exactWarm, repeat: 1 }], 21);

  // --- 200-point optimized-ζ H2 curves
  const h2Models = ['h2-mo', 'h2-ci', 'h2-vb'] as const;
  const h2Fns = h2Models.map((model) => () => consume(curve(params({ model, zeta: 'opt' }), h2Grid).energyHartree));
  for (const fn of h2Fns) warmUp(fn, 300);
  const h2Ms = interleavedMedians(
    h2Fns.map((fn) => ({ fn, repeat: 1 })),
    21,
  );

  const rows: Row[] = [
    { what: 'baseline: inline closed-form LCAO loop, ζ = 1', points: CURVE_POINTS, perCurveMs: baselineMs, perPointMs: basePerPoint },
    {
      what: 'LCAO curve, fixed ζ = 1 (curves.curve)',
      points: CURVE_POINTS,
      perCurveMs: fixedMs,
      perPointMs: fixedMs / CURVE_POINTS,
      ratio: fixedRatio,
      target: { text: '≤ 3× baseline', passed: fixedRatio <= 3 },
    },
    {
      what: '  (info) lcaoCurve, general 2×2 path',
      points: CURVE_POINTS,
      perCurveMs: fixedGeneralMs,
      perPointMs: fixedGeneralMs / CURVE_POINTS,
      ratio: pairedRatio(fixedGeneralSamples, baselineSamples),
    },
    {
      what: 'LCAO curve, ζ optimized (curves.curve)',
      points: CURVE_POINTS,
      perCurveMs: optimizedMs,
      perPointMs: optimizedMs / CURVE_POINTS,
      target: { text: '≤ 50 ms', passed: optimizedMs <= 50 },
    },
    {
      what: `exact σg point, cold (median of ${EXACT_POINTS}×${EXACT_ROUNDS})`,
      points: 1,
      perCurveMs: null,
      perPointMs: exactPointMs,
      target: { text: '≤ 200 µs', passed: exactPointMs <= 0.2 },
    },
    { what: '  (info) exact σg curve, warm-started (mean)', points: EXACT_POINTS, perCurveMs: exactCurveMs, perPointMs: exactCurveMs / EXACT_POINTS },
    ...h2Models.map((model, i) => ({
      what: `H2 curve ${model.slice(3).toUpperCase()}, ζ optimized (curves.curve)`,
      points: H2_POINTS,
      perCurveMs: h2Ms[i],
      perPointMs: h2Ms[i] / H2_POINTS,
      target: { text: '≤ 100 ms', passed: h2Ms[i] <= 100 },
    })),
  ];

  const table = formatTable(
    ['case', 'points', 'per curve', 'per point', '× baseline/point', 'target', 'result'],
    rows.map((row) => [
      row.what,
      String(row.points),
      row.perCurveMs === null ? '—' : formatMilliseconds(row.perCurveMs),
      formatMilliseconds(row.perPointMs),
      (row.ratio ?? row.perPointMs / basePerPoint).toFixed(1),
      row.target?.text ?? '',
      row.target ? (row.target.passed ? 'PASS' : 'FAIL') : '',
    ]),
  );
  console.log('');
  console.log(table);
  console.log('');
  const passed = rows.every((row) => !row.target || row.target.passed);
  console.log('times: medians of repeated samples after warm-up; the LCAO ratios: median of ratios of side-by-side samples');
  console.log(`checksum ${sink.value.toPrecision(6)}`);
  console.log(passed ? 'all targets met' : 'some targets missed');
  return { passed };
}

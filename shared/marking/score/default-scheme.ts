/**
 * The marking scheme used when none is given (the command line without --scheme). Tolerances are
 * common practice for computed curves typed with 5–6 significant figures, not a published rule:
 * - curve-rms: full points up to 1e−4 Eh (≈ 2.7 meV, what rounding to 4 decimals in Eh gives),
 *   none from 1e−2 Eh (≈ 0.27 eV, a different model or a wrong parameter);
 * - equilibrium-distance: full up to 0.01 a0, none from 0.1 a0;
 * - well-depth: full up to 0.02 eV, none from 0.2 eV;
 * - antibonding-repulsive (when the antibonding curve is part of the exercise): all or nothing.
 * Credit is linear between the two tolerances.
 */
import { markingSchemeSchema, type MarkingScheme } from '@shared/exercises/spec';

export function defaultCurveScheme(options: { antibonding?: boolean } = {}): MarkingScheme {
  return markingSchemeSchema.parse({
    checks: [
      { kind: 'curve-rms', id: 'curve-rms', label: 'Curve against the reference (RMS)', weight: 4, full: 1e-4, zero: 1e-2, credit: 'linear', removeShift: false },
      { kind: 'equilibrium-distance', id: 're', label: 'Equilibrium distance Re', weight: 3, full: 0.01, zero: 0.1, credit: 'linear' },
      { kind: 'well-depth', id: 'de', label: 'Well depth De', weight: 3, full: 0.02, zero: 0.2, credit: 'linear' },
      ...(options.antibonding ? [{ kind: 'antibonding-repulsive', id: 'antibonding-repulsive', label: 'Antibonding curve is repulsive', weight: 2 }] : []),
    ],
  });
}

/**
 * Input guard for the curve interface: throws a RangeError with one sentence
 * naming what is wrong (the command line prints it as it is).
 */
import { curveModels, curveStates, type CurveModelParams } from './types';

const isPositiveNumber = (value: unknown): value is number => typeof value === 'number' && Number.isFinite(value) && value > 0;

export function validateCurveParams(p: CurveModelParams): void {
  if (p === null || typeof p !== 'object') throw new RangeError('curve parameters must be an object { model, za, zb, zeta, state }.');
  if (!(curveModels as readonly string[]).includes(p.model)) {
    throw new RangeError(`unknown model '${String(p.model)}'; choose one of ${curveModels.join(', ')}.`);
  }
  if (!(curveStates as readonly string[]).includes(p.state)) {
    throw new RangeError(`unknown state '${String(p.state)}'; choose 'bonding' or 'antibonding'.`);
  }
  if (!isPositiveNumber(p.za)) throw new RangeError(`Za must be a finite number > 0, got ${String(p.za)}.`);
  if (!isPositiveNumber(p.zb)) throw new RangeError(`Zb must be a finite number > 0, got ${String(p.zb)}.`);
  if (p.model !== 'exact' && p.zeta !== 'opt' && !isPositiveNumber(p.zeta)) {
    throw new RangeError(`zeta must be a finite number > 0 or 'opt', got ${String(p.zeta)}.`);
  }
  if (p.model.startsWith('h2-') && (p.za !== 1 || p.zb !== 1)) {
    throw new RangeError(`model ${p.model} is H2 (two protons): Za and Zb must both be 1, got Za = ${p.za}, Zb = ${p.zb}.`);
  }
  if (p.model === 'exact' && p.za !== p.zb && p.state === 'antibonding') {
    throw new RangeError(
      `the exact model has no g/u symmetry when Za ≠ Zb (${p.za}, ${p.zb}): only the lowest state ('bonding') is available.`,
    );
  }
}

/** Throws a RangeError unless `distanceBohr` is a finite number > 0. */
export function validateDistance(distanceBohr: number, where = 'R'): void {
  if (!isPositiveNumber(distanceBohr)) {
    throw new RangeError(`${where} must be a finite distance > 0 bohr, got ${String(distanceBohr)}.`);
  }
}

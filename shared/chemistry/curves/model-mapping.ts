/** Internal: how the interface's names map onto each model's own vocabulary. */
import type { ExactState } from '@shared/chemistry/exact';
import type { H2Method, H2State } from '@shared/chemistry/h2';
import type { CurveModel, CurveState } from './types';

export function h2MethodOf(model: CurveModel): H2Method {
  if (model === 'h2-mo') return 'mo';
  if (model === 'h2-ci') return 'ci';
  if (model === 'h2-vb') return 'vb';
  throw new RangeError(`model ${model} is not an H2 model.`);
}

/** bonding → ground state ¹Σg⁺; antibonding → triplet ³Σu⁺ */
export function h2StateOf(state: CurveState): H2State {
  return state === 'bonding' ? 'ground' : 'triplet';
}

/** bonding → σg (or the lowest state when Za ≠ Zb); antibonding → σu */
export function exactStateOf(state: CurveState): ExactState {
  return state === 'bonding' ? 'sigma-g' : 'sigma-u';
}

export function isH2Model(model: CurveModel): model is 'h2-mo' | 'h2-ci' | 'h2-vb' {
  return model === 'h2-mo' || model === 'h2-ci' || model === 'h2-vb';
}

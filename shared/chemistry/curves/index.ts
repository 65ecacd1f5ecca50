export { curveModels, curveStates } from './types';
export type { CurveModel, CurveState, CurveModelParams, CurvePointResult, CurveResult, CurveMinimumResult } from './types';
export { validateCurveParams, validateDistance } from './validate-curve-params';
export { curvePoint } from './curve-point';
export { curve } from './curve';
export { dissociationLimit } from './dissociation-limit';
export { curveMinimum, minimumScanGrid } from './curve-minimum';
export { describeCurveModel } from './describe-curve-model';

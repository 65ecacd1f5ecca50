export type { ExactState, ExactInput, ExactEnergy, AngularParity, SymmetricBanded } from './types';
export { exactOneElectronEnergy } from './one-electron-energy';
export { exactCurve, type ExactCurveInput, type ExactCurve } from './curve';
export { exactDissociationLimit } from './dissociation-limit';
export { angularSeparationConstant, angularBasisSize, type AngularInput } from './angular-separation-constant';
export { angularLegendreMatrix } from './angular-legendre-matrix';
export { largestEigenvalueBanded } from './largest-eigenvalue-banded';
export { radialContinuedFraction, radialContinuedFractionTerms, type RadialInput } from './radial-continued-fraction';

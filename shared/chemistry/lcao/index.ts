export type { LcaoState, LcaoInput, LcaoMatrixElements, LcaoEnergies, TwoByTwoRoot } from './types';
export { overlapIntegral } from './overlap-integral';
export { coulombIntegral } from './coulomb-integral';
export { resonanceIntegral } from './resonance-integral';
export { lcaoMatrixElements } from './matrix-elements';
export { generalizedEigenTwoByTwo, type SymmetricTwoByTwo } from './generalized-eigen-two-by-two';
export { lcaoEnergies, lcaoEnergiesFromMatrixElements } from './energies';
export { lcaoHomonuclearEnergies } from './homonuclear-energies';
export { lcaoTextbookEnergies, type TextbookEnergies } from './textbook-energies';
export { lcaoOptimizedZeta, zetaSearchBracket, type OptimizedZetaInput, type OptimizedZeta } from './optimized-zeta';
export { lcaoCurve, type LcaoCurveInput, type LcaoCurve } from './curve';
export { lcaoDissociationLimit } from './dissociation-limit';
export {
  lcaoMatrixElementsQuadrature,
  type UnequalExponentsInput,
  type QuadratureMatrixElements,
  type PairElements,
} from './matrix-elements-quadrature';
export { lcaoEnergiesUnequalExponents } from './energies-unequal-exponents';

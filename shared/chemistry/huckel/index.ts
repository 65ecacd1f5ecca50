export { huckelGraph, DEGENERACY_TOLERANCE } from './huckel-graph';
export { huckelChain, huckelRing } from './chain-ring';
export type { PolyeneOptions } from './chain-ring';
export { parseHuckelGraph, huckelGraphSchema, HuckelInputError, MAX_HUCKEL_ATOMS } from './parse-huckel-graph';
export type { HuckelInputIssue } from './parse-huckel-graph';
export { STREITWIESER_PARAMETERS, STREITWIESER_SOURCE, mergeHuckelParameters, bondTypeKey } from './parameters';
export type { HuckelAtomType, HuckelParameters, HuckelParameterOverrides } from './parameters';
export { maximumMatching } from './maximum-matching';
export type {
  HuckelAtomInput,
  HuckelBondInput,
  HuckelBondType,
  HuckelGraphInput,
  HuckelOrbital,
  HuckelResult,
  HuckelBondOrder,
  LocalizedReference,
  OrbitalCharacter,
  ResolvedHuckelAtom,
  ResolvedHuckelBond,
} from './types';

export { buildMoDiagram } from './build-mo-diagram';
export type {
  BuildMoDiagramInput,
  LevelOrderOption,
  MoDiagram,
  MoLevel,
  MoCorrelation,
  AtomicLevel,
  DiagramAtom,
  Spin,
} from './build-mo-diagram';
export { parseDiatomicFormula, describeSupportedSpecies, HETERONUCLEAR_SPECIES, ATOMIC_NUMBER } from './species';
export type { DiatomicSpecies, LevelScheme } from './species';
export type { OrbitalCharacter, ResolvedOrder, Side } from './level-schemes';
export { ATOMIC_ORBITAL_ENERGIES, ORBITAL_ENERGY_SOURCES, atomicOrbitalEnergyEv } from './atomic-orbital-energies';
export type { AtomicOrbitalName, AtomicOrbitalEnergy } from './atomic-orbital-energies';
export { enumerateMicrostates, termsFromShells, groundTermFromShells } from './open-shell-terms';
export type { OpenShell, Microstate, TermWithCount, OrbitalSymmetry } from './open-shell-terms';
export { makeTermSymbol, formatTermSymbol, lambdaName, lambdaValue, LAMBDA_NAMES } from './term-symbol';
export type { TermSymbol, LambdaName, Parity, Reflection, TermSymbolStyle } from './term-symbol';
export { parseTermSymbol, termSymbolsEqual } from './parse-term-symbol';
export type { TermSymbolParseResult } from './parse-term-symbol';
export { EXPERIMENTAL_DIATOMIC_CONSTANTS, experimentalConstants } from './experimental-constants';
export type { DiatomicConstants } from './experimental-constants';

export type { OrbitalInput, LcaoOrbital, DensityLineInput, DensityLine, DensityPlaneInput, DensityPlane } from './types';
export { lcaoOrbital } from './lcao-orbital';
export { orbitalDensityLine } from './density-line';
export { orbitalDensityPlane } from './density-plane';

/**
 * Shapes of the orbital-density helpers (minimal-LCAO orbitals of the
 * one-electron two-centre bond). Geometry: the bond axis is z (or x in the
 * plane), nucleus A at −R/2 and nucleus B at +R/2, the midpoint at 0. Bohr,
 * and densities in bohr⁻³.
 */
import type { LcaoState } from '@shared/chemistry/lcao';

export interface OrbitalInput {
  za: number;
  zb: number;
  /** a fixed exponent, or 'opt' for the variationally optimized ζ of this state at this distance */
  zeta: number | 'opt';
  distanceBohr: number;
  state: LcaoState;
}

export interface LcaoOrbital {
  zeta: number;
  coefficientA: number;
  coefficientB: number;
  /** total energy of the state (hartree) */
  energyHartree: number;
  /** ψ at axial position z (bohr, along the bond from A to B) and distance ρ from the axis (bohr) */
  valueAt: (axialBohr: number, perpendicularBohr: number) => number;
}

export interface DensityLineInput extends OrbitalInput {
  /** start and end of the line on the bond axis (bohr; the midpoint is 0) */
  from: number;
  to: number;
  /** number of sample points, ≥ 2, ends included */
  points: number;
}

export interface DensityLine {
  zBohr: number[];
  /** ψ² in bohr⁻³ */
  density: number[];
}

export interface DensityPlaneInput extends OrbitalInput {
  /** the plane spans −extentBohr … +extentBohr along the bond (x) and across it (y) */
  extentBohr: number;
  nx: number;
  ny: number;
}

export interface DensityPlane {
  /** along the bond axis (bohr) */
  x: number[];
  /** perpendicular to the bond, in a plane containing both nuclei (bohr) */
  y: number[];
  /** density[j][i] = ψ²(x[i], y[j]) in bohr⁻³ */
  density: number[][];
}

import type { HuckelAtomType, HuckelParameterOverrides } from './parameters';

export interface HuckelAtomInput {
  /** key of the parameter table (default 'C'); e.g. 'N-pyridine', 'O-carbonyl' */
  type?: string;
  /** overrides the table's h for this atom (α_r = α + h·β) */
  h?: number;
  /** overrides the table's π-electron contribution for this atom (0, 1 or 2) */
  piElectrons?: number;
  label?: string;
}

export type HuckelBondType = 'single' | 'double';

export interface HuckelBondInput {
  /** 0-based atom indices */
  from: number;
  to: number;
  /** overrides the table's k for this bond (β_rs = k·β) */
  k?: number;
  /**
   * Kekulé marking used only for the localized reference of the delocalization energy
   * ('double' bonds become isolated two-centre π bonds); it does not change k.
   */
  type?: HuckelBondType;
}

export interface HuckelGraphInput {
  atoms: HuckelAtomInput[];
  bonds: HuckelBondInput[];
  /**
   * π-electron charge relative to the atom types' contributions:
   * electrons = Σ piElectrons − charge (allyl cation: +1). Default 0.
   */
  charge?: number;
  /** total π electrons; overrides the count from atom types (must agree with `charge` if both given) */
  electrons?: number;
  /** edits to the Streitwieser table */
  parameters?: HuckelParameterOverrides;
  name?: string;
}

export type OrbitalCharacter = 'bonding' | 'nonbonding' | 'antibonding';

export interface HuckelOrbital {
  /** 0 = lowest energy (largest x) */
  index: number;
  /** E = α + x·β */
  x: number;
  /** normalized LCAO coefficients, one per atom; sign and (within degenerate sets) basis fixed deterministically */
  coefficients: number[];
  /** electrons in this orbital; in a partly filled degenerate set every member gets an equal share */
  occupancy: number;
  character: OrbitalCharacter;
  /** index into `degenerateSets` */
  degenerateSet: number;
  degeneracy: number;
}

export interface ResolvedHuckelAtom {
  type: string;
  h: number;
  piElectrons: number;
  label: string;
}

export interface ResolvedHuckelBond {
  from: number;
  to: number;
  k: number;
  type: HuckelBondType | null;
}

export interface HuckelBondOrder {
  from: number;
  to: number;
  /** p_rs = Σ_i n_i c_ri c_si */
  order: number;
}

export interface LocalizedReference {
  /** two-centre π bonds of the localized structure */
  doubleBonds: Array<[number, number]>;
  /** Σ n_i x_i of the localized structure (same electron count), in units of β */
  energyBeta: number;
  /** 'marked': from bonds typed 'double'; 'matching': maximum matching found automatically */
  method: 'marked' | 'matching';
}

export interface HuckelResult {
  name: string | null;
  atomCount: number;
  electronCount: number;
  charge: number;
  atoms: ResolvedHuckelAtom[];
  bonds: ResolvedHuckelBond[];
  /** H = α·1 + β·M; this is M (h on the diagonal, k between bonded atoms) */
  matrix: number[][];
  /** sorted by x descending (lowest energy first, since β < 0) */
  orbitals: HuckelOrbital[];
  xValues: number[];
  degenerateSets: Array<{ x: number; indices: number[] }>;
  /** q_r = Σ_i n_i c_ri² */
  piElectronDensity: number[];
  /** net π charge: piElectrons_r − q_r */
  netCharges: number[];
  /** p_rs for every bond in `bonds` order */
  bondOrders: HuckelBondOrder[];
  /** P_rs = Σ_i n_i c_ri c_si for all pairs (diagonal = q_r) */
  densityMatrix: number[][];
  /** E_π = n·α + totalPiEnergyBeta·β */
  totalPiEnergyBeta: number;
  localizedReference: LocalizedReference;
  /** totalPiEnergyBeta − localizedReference.energyBeta; positive = stabilization (β < 0) */
  delocalizationEnergyBeta: number;
  /** highest orbital holding electrons */
  homoIndex: number | null;
  /** lowest orbital with a vacancy (in a partly filled set this is in the HOMO's own set) */
  lumoIndex: number | null;
  /** x_HOMO − x_LUMO in units of |β| (0 for a partly filled HOMO set); null without HOMO or LUMO */
  homoLumoGapBeta: number | null;
  /** by Hund's rule over degenerate sets */
  unpairedElectrons: number;
  openShell: boolean;
  parametersSource: string;
  notes: string[];
}

export type { HuckelAtomType };

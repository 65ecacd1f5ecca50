/**
 * Hückel heteroatom parameters: α_X = α + h_X·β, β_CX = k_CX·β.
 * Default table: A. Streitwieser Jr., Molecular Orbital Theory for Organic Chemists (Wiley, 1961),
 * ch. 5, recommended values (from memory). Editable: pass overrides to `huckelGraph`.
 * Atom types with two π electrons are lone-pair donors (pyrrole N, furan/ether O, halogens);
 * B contributes an empty p orbital.
 */

export interface HuckelAtomType {
  /** Coulomb parameter: α_X = α + h·β */
  h: number;
  /** resonance parameter of a bond to carbon: β_CX = k·β */
  k: number;
  /** π electrons the atom contributes (its π core charge) */
  piElectrons: number;
  description: string;
}

export interface HuckelParameters {
  atomTypes: Record<string, HuckelAtomType>;
  /** k for bonds between two named types, keyed "A|B" with A ≤ B in code-point order */
  bondK: Record<string, number>;
  source: string;
}

export const STREITWIESER_SOURCE =
  'A. Streitwieser Jr., Molecular Orbital Theory for Organic Chemists (Wiley, 1961), ch. 5 (from memory)';

export const STREITWIESER_PARAMETERS: Readonly<HuckelParameters> = Object.freeze({
  atomTypes: {
    C: { h: 0, k: 1, piElectrons: 1, description: 'sp² carbon' },
    'N-pyridine': { h: 0.5, k: 1.0, piElectrons: 1, description: '=N−, one π electron (pyridine-type)' },
    'N-pyrrole': { h: 1.5, k: 0.8, piElectrons: 2, description: '−N̈<, two π electrons (pyrrole-, aniline-type)' },
    'N-pyridinium': { h: 2.0, k: 1.0, piElectrons: 1, description: '=N⁺<, one π electron (pyridinium-type)' },
    'O-carbonyl': { h: 1.0, k: 1.0, piElectrons: 1, description: '=O, one π electron (carbonyl-type)' },
    'O-ether': { h: 2.0, k: 0.8, piElectrons: 2, description: '−Ö−, two π electrons (furan-, phenol-, ether-type)' },
    'O-pyrylium': { h: 2.5, k: 1.0, piElectrons: 1, description: '=O⁺−, one π electron (pyrylium-type)' },
    F: { h: 3.0, k: 0.7, piElectrons: 2, description: '−F, two π electrons' },
    Cl: { h: 2.0, k: 0.4, piElectrons: 2, description: '−Cl, two π electrons' },
    Br: { h: 1.5, k: 0.3, piElectrons: 2, description: '−Br, two π electrons' },
    B: { h: -1.0, k: 0.7, piElectrons: 0, description: '>B−, empty p orbital' },
  },
  bondK: {},
  source: STREITWIESER_SOURCE,
});

export interface HuckelParameterOverrides {
  /** new types (complete) or changes to existing ones (partial) */
  atomTypes?: Record<string, Partial<HuckelAtomType>>;
  /** k for bonds between two named types, keyed "A|B" (either order) */
  bondK?: Record<string, number>;
}

/** Key for a pair of atom types, independent of order. */
export function bondTypeKey(a: string, b: string): string {
  return a <= b ? `${a}|${b}` : `${b}|${a}`;
}

/** The default table with overrides applied; RangeError if a new type lacks h, k or piElectrons. */
export function mergeHuckelParameters(overrides?: HuckelParameterOverrides): HuckelParameters {
  const atomTypes: Record<string, HuckelAtomType> = {};
  for (const [name, t] of Object.entries(STREITWIESER_PARAMETERS.atomTypes)) atomTypes[name] = { ...t };
  const bondK: Record<string, number> = { ...STREITWIESER_PARAMETERS.bondK };
  let changed = false;
  for (const [name, partial] of Object.entries(overrides?.atomTypes ?? {})) {
    changed = true;
    const base = atomTypes[name];
    if (!base && (partial.h === undefined || partial.k === undefined || partial.piElectrons === undefined)) {
      throw new RangeError(`new atom type '${name}' needs h, k and piElectrons`);
    }
    atomTypes[name] = { ...(base ?? { description: `user-defined type '${name}'` }), ...partial } as HuckelAtomType;
  }
  for (const [key, k] of Object.entries(overrides?.bondK ?? {})) {
    changed = true;
    const [a, b] = key.split('|');
    if (a === undefined || b === undefined) throw new RangeError(`bond parameter key '${key}' must read "TypeA|TypeB"`);
    bondK[bondTypeKey(a, b)] = k;
  }
  return { atomTypes, bondK, source: changed ? `${STREITWIESER_SOURCE}, edited` : STREITWIESER_SOURCE };
}

/**
 * Simple Hückel MO theory of a π system given as a graph.
 *
 * E. Hückel, Z. Phys. 70 (1931) 204; with heteroatoms α_X = α + h_X·β, β_XY = k_XY·β
 * (A. Streitwieser Jr., Molecular Orbital Theory for Organic Chemists, 1961, ch. 5).
 * Sign convention: E = α + x·β with β < 0, so a larger x is a lower energy. The x are the
 * eigenvalues of M (h_r on the diagonal, k_rs for bonded atoms, 0 otherwise), found with
 * ml-matrix's symmetric EigenvalueDecomposition; orbitals are sorted by x descending.
 *
 * - Occupancy: Aufbau over degenerate sets (|Δx| ≤ 1e−9); a partly filled set shares its
 *   electrons equally among its members, so densities and bond orders do not depend on the
 *   arbitrary basis inside the set; unpaired electrons follow Hund's rule.
 * - π-electron density q_r = Σ_i n_i c_ri², net charge = (π electrons of atom r) − q_r;
 *   bond order p_rs = Σ_i n_i c_ri c_si (C. A. Coulson, Proc. R. Soc. A 169 (1939) 413).
 * - Total π energy E_π = n·α + (Σ_i n_i x_i)·β.
 * - Delocalization energy: against a localized structure of isolated two-centre π bonds
 *   (ethylene-like, each with its own h and k: x = (h_a + h_b)/2 ± √(((h_a − h_b)/2)² + k²))
 *   and isolated centres (x = h), filled by Aufbau with the same electron count. The
 *   double bonds are those typed 'double', else a maximum matching of the atoms that give one
 *   π electron (lone-pair and empty centres stay isolated). For a neutral Kekulé hydrocarbon
 *   this is N/2 ethylene bonds of 2β each, so benzene gets 8β − 6β = 2β; radicals and ions
 *   keep their extra electrons/holes on isolated centres (allyl cation, radical, anion all 0.828β).
 * - HOMO: highest orbital holding electrons; LUMO: lowest orbital with a vacancy. For a partly
 *   filled set (cyclobutadiene, radicals) both lie in the same set and the gap is 0.
 * - Coefficients: in each degenerate set a canonical orthonormal basis is built by projecting
 *   the unit vectors e_1, e_2, … onto the set's eigenspace in atom order (Gram–Schmidt); each
 *   vector's first non-zero coefficient is therefore positive. Non-degenerate vectors: the first
 *   coefficient larger than 1e−8 in magnitude is made positive.
 */
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { maximumMatching } from './maximum-matching';
import { bondTypeKey, mergeHuckelParameters } from './parameters';
import { parseHuckelGraph } from './parse-huckel-graph';
import type {
  HuckelGraphInput,
  HuckelOrbital,
  HuckelResult,
  LocalizedReference,
  OrbitalCharacter,
  ResolvedHuckelAtom,
  ResolvedHuckelBond,
} from './types';

export const DEGENERACY_TOLERANCE = 1e-9;
const OCCUPANCY_TOLERANCE = 1e-12;
const PROJECTION_TOLERANCE = 1e-8;

function characterOf(x: number): OrbitalCharacter {
  if (x > DEGENERACY_TOLERANCE) return 'bonding';
  if (x < -DEGENERACY_TOLERANCE) return 'antibonding';
  return 'nonbonding';
}

/** Canonical orthonormal basis of span(vectors) by projecting e_1, e_2, … (see header). */
function canonicalBasis(vectors: number[][], n: number): number[][] {
  const g = vectors.length;
  const basis: number[][] = [];
  for (let r = 0; r < n && basis.length < g; r++) {
    // w = P e_r = Σ_v v_r v
    const w = new Array<number>(n).fill(0);
    for (const v of vectors) for (let s = 0; s < n; s++) w[s] += v[r] * v[s];
    for (const u of basis) {
      const dot = u.reduce((sum, us, s) => sum + us * w[s], 0);
      for (let s = 0; s < n; s++) w[s] -= dot * u[s];
    }
    const norm = Math.hypot(...w);
    if (norm > Math.sqrt(PROJECTION_TOLERANCE)) basis.push(w.map((c) => c / norm));
  }
  return basis;
}

function fixSign(v: number[]): number[] {
  const first = v.find((c) => Math.abs(c) > PROJECTION_TOLERANCE) ?? 0;
  return first < 0 ? v.map((c) => -c) : v;
}

/** Σ n_i x_i with Aufbau filling of `levels` (x values) by `electrons` (2 per level). */
function aufbauEnergy(levels: number[], electrons: number): number {
  const sorted = [...levels].sort((a, b) => b - a);
  let remaining = electrons;
  let energy = 0;
  for (const x of sorted) {
    const n = Math.min(2, remaining);
    energy += n * x;
    remaining -= n;
    if (remaining <= 0) break;
  }
  return energy;
}

function localizedReference(atoms: ResolvedHuckelAtom[], bonds: ResolvedHuckelBond[], electrons: number): LocalizedReference {
  const marked = bonds.filter((b) => b.type === 'double');
  let pairs: ResolvedHuckelBond[];
  let method: LocalizedReference['method'];
  if (marked.length > 0) {
    pairs = marked;
    method = 'marked';
  } else {
    const adjacency: number[][] = atoms.map(() => []);
    for (const b of bonds) {
      if (atoms[b.from].piElectrons === 1 && atoms[b.to].piElectrons === 1) {
        adjacency[b.from].push(b.to);
        adjacency[b.to].push(b.from);
      }
    }
    const match = maximumMatching(adjacency);
    pairs = bonds.filter((b) => match[b.from] === b.to);
    method = 'matching';
  }
  const paired = new Set<number>();
  const levels: number[] = [];
  for (const b of pairs) {
    paired.add(b.from);
    paired.add(b.to);
    const mean = (atoms[b.from].h + atoms[b.to].h) / 2;
    const root = Math.hypot((atoms[b.from].h - atoms[b.to].h) / 2, b.k);
    levels.push(mean + root, mean - root);
  }
  atoms.forEach((a, r) => {
    if (!paired.has(r)) levels.push(a.h);
  });
  return {
    doubleBonds: pairs.map((b) => [b.from, b.to] as [number, number]),
    energyBeta: aufbauEnergy(levels, electrons),
    method,
  };
}

/**
 * Hückel treatment of any π graph. Validates the input (HuckelInputError with atom/bond
 * indices on problems) and returns energies, orbitals, charges, bond orders and energies in β.
 */
export function huckelGraph(input: HuckelGraphInput): HuckelResult {
  const graph = parseHuckelGraph(input);
  const parameters = mergeHuckelParameters(graph.parameters);
  const notes: string[] = [];

  const atoms: ResolvedHuckelAtom[] = graph.atoms.map((a, r) => {
    const type = a.type ?? 'C';
    const table = parameters.atomTypes[type];
    return { type, h: a.h ?? table.h, piElectrons: a.piElectrons ?? table.piElectrons, label: a.label ?? `${type}${r + 1}` };
  });
  const bonds: ResolvedHuckelBond[] = graph.bonds.map((b, i) => {
    const ta = atoms[b.from].type;
    const tb = atoms[b.to].type;
    let k = b.k;
    if (k === undefined) k = parameters.bondK[bondTypeKey(ta, tb)];
    if (k === undefined && ta === 'C') k = parameters.atomTypes[tb].k;
    if (k === undefined && tb === 'C') k = parameters.atomTypes[ta].k;
    if (k === undefined) {
      k = 1;
      notes.push(`bonds[${i}] (${ta}–${tb}): no k in the table for this pair; k = 1 used (set bond k or parameters.bondK)`);
    }
    return { from: b.from, to: b.to, k, type: b.type ?? null };
  });

  const n = atoms.length;
  const contributed = atoms.reduce((s, a) => s + a.piElectrons, 0);
  const electronCount = graph.electrons ?? contributed - (graph.charge ?? 0);
  const charge = contributed - electronCount;

  const matrix = atoms.map((a, r) => atoms.map((_, s) => (r === s ? a.h : 0)));
  for (const b of bonds) {
    matrix[b.from][b.to] = b.k;
    matrix[b.to][b.from] = b.k;
  }

  const evd = new EigenvalueDecomposition(new Matrix(matrix), { assumeSymmetric: true });
  const values = evd.realEigenvalues;
  const vectors = evd.eigenvectorMatrix;
  const raw = values
    .map((x, i) => ({ x, v: vectors.getColumn(i) }))
    .sort((a, b) => b.x - a.x);

  // degenerate sets and canonical coefficients
  const degenerateSets: Array<{ x: number; indices: number[] }> = [];
  const coefficients: number[][] = [];
  for (let i = 0; i < raw.length; ) {
    let j = i + 1;
    while (j < raw.length && raw[j - 1].x - raw[j].x <= DEGENERACY_TOLERANCE) j++;
    const group = raw.slice(i, j);
    const basis = group.length === 1 ? [fixSign(group[0].v)] : canonicalBasis(group.map((g) => g.v), n);
    if (basis.length !== group.length) throw new Error(`degenerate set at x = ${group[0].x} lost its rank; cannot fix its basis`);
    coefficients.push(...basis);
    const x = group.reduce((s, g) => s + g.x, 0) / group.length;
    degenerateSets.push({ x, indices: group.map((_, k) => i + k) });
    i = j;
  }

  // occupancy by sets
  const occupancy = new Array<number>(n).fill(0);
  let remaining = electronCount;
  let unpairedElectrons = 0;
  let openShell = false;
  for (const set of degenerateSets) {
    const g = set.indices.length;
    const inSet = Math.min(2 * g, remaining);
    remaining -= inSet;
    for (const i of set.indices) occupancy[i] = inSet / g;
    unpairedElectrons += inSet <= g ? inSet : 2 * g - inSet;
    if (inSet > 0 && inSet < 2 * g) openShell = true;
  }

  const orbitals: HuckelOrbital[] = raw.map((r, i) => {
    const setIndex = degenerateSets.findIndex((s) => s.indices.includes(i));
    return {
      index: i,
      x: r.x,
      coefficients: coefficients[i],
      occupancy: occupancy[i],
      character: characterOf(r.x),
      degenerateSet: setIndex,
      degeneracy: degenerateSets[setIndex].indices.length,
    };
  });

  const densityMatrix = atoms.map((_, r) =>
    atoms.map((__, s) => orbitals.reduce((sum, o) => sum + o.occupancy * o.coefficients[r] * o.coefficients[s], 0)),
  );
  const piElectronDensity = atoms.map((_, r) => densityMatrix[r][r]);
  const netCharges = atoms.map((a, r) => a.piElectrons - piElectronDensity[r]);
  const bondOrders = bonds.map((b) => ({ from: b.from, to: b.to, order: densityMatrix[b.from][b.to] }));
  const totalPiEnergyBeta = orbitals.reduce((s, o) => s + o.occupancy * o.x, 0);
  const reference = localizedReference(atoms, bonds, electronCount);

  let homoIndex: number | null = null;
  for (let i = n - 1; i >= 0; i--) {
    if (orbitals[i].occupancy > OCCUPANCY_TOLERANCE) {
      homoIndex = i;
      break;
    }
  }
  const lumo = orbitals.findIndex((o) => o.occupancy < 2 - OCCUPANCY_TOLERANCE);
  const lumoIndex = lumo < 0 ? null : lumo;
  let homoLumoGapBeta: number | null = null;
  if (homoIndex !== null && lumoIndex !== null) {
    homoLumoGapBeta =
      orbitals[homoIndex].degenerateSet === orbitals[lumoIndex].degenerateSet ? 0 : orbitals[homoIndex].x - orbitals[lumoIndex].x;
  }
  if (openShell) notes.push('open shell: the partly filled degenerate set shares its electrons equally in densities and bond orders');

  return {
    name: graph.name ?? null,
    atomCount: n,
    electronCount,
    charge,
    atoms,
    bonds,
    matrix,
    orbitals,
    xValues: orbitals.map((o) => o.x),
    degenerateSets,
    piElectronDensity,
    netCharges,
    bondOrders,
    densityMatrix,
    totalPiEnergyBeta,
    localizedReference: reference,
    delocalizationEnergyBeta: totalPiEnergyBeta - reference.energyBeta,
    homoIndex,
    lumoIndex,
    homoLumoGapBeta,
    unpairedElectrons,
    openShell,
    parametersSource: parameters.source,
    notes,
  };
}

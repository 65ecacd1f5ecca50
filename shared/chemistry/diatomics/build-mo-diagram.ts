/**
 * MO diagram of a diatomic: level order, Aufbau + Hund filling, configuration, bond order,
 * magnetism, HOMO/LUMO and the ground term from the open shells.
 *
 * Bond order = (bonding − antibonding electrons)/2 (Mulliken's count, e.g. Atkins & de Paula,
 * Physical Chemistry, "bond order"); nonbonding electrons do not count.
 *
 * Order rule for 'auto' (common practice, following the photoelectron spectra of N2 and O2 and
 * textbook diagrams, e.g. Miessler & Tarr ch. 5; from memory): s–p mixing is drawn (3σg above
 * 1πu) when the 2s–2p gap is small, i.e. for homonuclear molecules of Z ≤ 7 (Li2 … N2 and their
 * ions); O2, F2, Ne2 and their ions are drawn unmixed. Heteronuclear pairs use the summed
 * nuclear charge: ZA + ZB ≤ 14 (BN, BO, CN, CO) mixed, above (NO, CF, NF) unmixed.
 * H2/He2 (1s only) and the hydrides have a single order ('fixed').
 *
 * HOMO = highest level holding an electron; LUMO = lowest level with a vacancy. In an open-shell
 * species the partly filled level is both (so the gap is zero); `lowestEmptyIndex` gives the
 * lowest entirely empty level as well.
 *
 * Energies are a qualitative sketch for drawing (order and rough spacing only): each pair of
 * atomic orbitals (energies eA, eB) gives mean ∓ r, with r = √(((eB − eA)/2)² + (f·|mean|)²),
 * the antibonding level raised 1.3 times as far as the bonding one is lowered (the overlap
 * asymmetry, common practice); nonbonding levels stay at their atomic energy. In the mixed order
 * 3σg (5σ) is drawn a fifth of the way from 1πu (1π) to 1πg* (2π). A final pass keeps the levels
 * in the chosen order at least 0.05 eV apart.
 */
import { ATOMIC_ORBITAL_ENERGIES, atomicOrbitalEnergyEv, type AtomicOrbitalName } from './atomic-orbital-energies';
import { levelTemplates, type LevelTemplate, type OrbitalCharacter, type ResolvedOrder, type Side } from './level-schemes';
import { termsFromShells, type OrbitalSymmetry, type TermWithCount } from './open-shell-terms';
import { ATOMIC_NUMBER, parseDiatomicFormula, type DiatomicSpecies } from './species';
import { formatTermSymbol, superscriptNumber, type Parity, type TermSymbol } from './term-symbol';

export type LevelOrderOption = 'mixed' | 'unmixed' | 'auto';

export interface BuildMoDiagramInput {
  /** e.g. "O2", "N2+", "O2^2-", "CN-", "NO+" */
  formula: string;
  /** overall charge; may instead be written in the formula (both must then agree) */
  charge?: number;
  /** level order; default 'auto' */
  order?: LevelOrderOption;
}

export type Spin = 'up' | 'down';

export interface MoCorrelation {
  side: Side;
  element: string;
  orbital: AtomicOrbitalName;
}

export interface MoLevel {
  /** 0 = lowest level */
  energyRank: number;
  /** e.g. "2σg", "1σu*", "1πg*" (homonuclear), "5σ", "2π" (heteronuclear) */
  label: string;
  /** e.g. "2sigma_g", "1pi_g*" */
  labelAscii: string;
  /** valence-only name, e.g. "σ2s", "π*2p", "1s(O)" */
  valenceLabel: string;
  symmetry: OrbitalSymmetry;
  parity: Parity | null;
  character: OrbitalCharacter;
  /** 1s-derived core level */
  core: boolean;
  /** spatial degeneracy: σ 1, π 2 */
  degeneracy: 1 | 2;
  /** 2 · degeneracy */
  capacity: number;
  occupancy: number;
  /** electrons per degenerate component as half-arrows, filled by Hund's rule */
  spins: Spin[][];
  /** qualitative energy for drawing, eV */
  energyEv: number;
  /** atomic orbitals the level correlates with (for correlation lines) */
  correlations: MoCorrelation[];
}

export interface AtomicLevel {
  orbital: AtomicOrbitalName;
  energyEv: number;
  /** electrons in the neutral atom's ground configuration */
  electrons: number;
  /** 1 for s, 3 for p */
  degeneracy: 1 | 3;
  source: string;
}

export interface DiagramAtom {
  element: string;
  atomicNumber: number;
  levels: AtomicLevel[];
}

export interface MoDiagram {
  formula: string;
  species: string;
  display: string;
  charge: number;
  electronCount: number;
  homonuclear: boolean;
  atoms: { left: DiagramAtom; right: DiagramAtom };
  order: ResolvedOrder;
  orderRule: string;
  levels: MoLevel[];
  /** e.g. "(1σg)²(1σu*)²(2σg)²(2σu*)²(3σg)²(1πu)⁴(1πg*)²" */
  configuration: string;
  /** e.g. "(1sigma_g)^2(1sigma_u*)^2…(1pi_g*)^2" */
  configurationAscii: string;
  /** core written KK (or K), valence names: "KK(σ2s)²(σ*2s)²(σ2p)²(π2p)⁴(π*2p)²" */
  valenceConfiguration: string;
  bondingElectrons: number;
  antibondingElectrons: number;
  nonbondingElectrons: number;
  bondOrder: number;
  unpairedElectrons: number;
  magnetism: 'paramagnetic' | 'diamagnetic';
  homoIndex: number | null;
  lumoIndex: number | null;
  lowestEmptyIndex: number | null;
  /** partly filled levels */
  openShellIndices: number[];
  termSymbol: TermSymbol;
  termSymbolAscii: string;
  /** every term of the ground configuration, Hund-ordered (the first is `termSymbol`) */
  terms: TermWithCount[];
  notes: string[];
}

const ANTIBONDING_RAISE = 1.3;
const MIXED_FRACTION = 0.2;
const MIN_GAP_EV = 0.05;

function resolveOrder(species: DiatomicSpecies, option: LevelOrderOption, notes: string[]): { order: ResolvedOrder; rule: string } {
  if (species.scheme === 'one-s' || species.scheme === 'hydride') {
    if (option !== 'auto') notes.push(`order '${option}' has no effect for ${species.formula}: its levels have a single order`);
    return {
      order: 'fixed',
      rule: species.scheme === 'one-s' ? '1s levels only: 1σg below 1σu*' : 'hydride: 1σ 2σ 3σ 1π 4σ',
    };
  }
  if (option !== 'auto') return { order: option, rule: `order '${option}' chosen explicitly` };
  if (species.homonuclear) {
    const z = ATOMIC_NUMBER[species.left];
    return z <= 7
      ? { order: 'mixed', rule: `auto: Z = ${z} ≤ 7 (Li … N), s–p mixing puts 3σg above 1πu` }
      : { order: 'unmixed', rule: `auto: Z = ${z} ≥ 8 (O … Ne), large 2s–2p gap, 3σg below 1πu` };
  }
  const zSum = ATOMIC_NUMBER[species.left] + ATOMIC_NUMBER[species.right];
  return zSum <= 14
    ? { order: 'mixed', rule: `auto: ZA + ZB = ${zSum} ≤ 14 (like N2/CO), 5σ above 1π` }
    : { order: 'unmixed', rule: `auto: ZA + ZB = ${zSum} > 14 (like O2), 5σ below 1π` };
}

function atomLevels(element: string, scheme: DiatomicSpecies['scheme']): AtomicLevel[] {
  const z = ATOMIC_NUMBER[element];
  const electrons: Record<AtomicOrbitalName, number> = {
    '1s': Math.min(z, 2),
    '2s': Math.min(Math.max(z - 2, 0), 2),
    '2p': Math.max(z - 4, 0),
  };
  const wanted: AtomicOrbitalName[] = element === 'H' || element === 'He' || scheme === 'one-s' ? ['1s'] : ['1s', '2s', '2p'];
  return wanted.map((orbital) => {
    const entry = ATOMIC_ORBITAL_ENERGIES[element].find((o) => o.orbital === orbital);
    if (!entry) throw new RangeError(`no orbital energy for ${element} ${orbital}`);
    return { orbital, energyEv: entry.energyEv, electrons: electrons[orbital], degeneracy: orbital === '2p' ? 3 : 1, source: entry.source };
  });
}

function sketchEnergies(templates: LevelTemplate[], left: string, right: string): number[] {
  const element = (side: Side) => (side === 'left' ? left : right);
  const energies = templates.map((tpl) => {
    const aos = tpl.correlations.map((c) => atomicOrbitalEnergyEv(element(c.side), c.orbital));
    if (aos.length === 1 || tpl.character === 'nonbonding') return aos[0];
    const [eA, eB] = aos;
    const mean = (eA + eB) / 2;
    const r = Math.hypot((eB - eA) / 2, tpl.strength * Math.abs(mean));
    return tpl.character === 'bonding' ? mean - r : mean + ANTIBONDING_RAISE * r;
  });
  templates.forEach((tpl, i) => {
    if (!tpl.pushedAbovePi) return;
    const bondingPi = templates.findIndex((x) => x.symmetry === 'pi' && x.character === 'bonding');
    const antibondingPi = templates.findIndex((x) => x.symmetry === 'pi' && x.character === 'antibonding');
    energies[i] = energies[bondingPi] + MIXED_FRACTION * (energies[antibondingPi] - energies[bondingPi]);
  });
  for (let i = 1; i < energies.length; i++) energies[i] = Math.max(energies[i], energies[i - 1] + MIN_GAP_EV);
  return energies;
}

function hundSpins(occupancy: number, degeneracy: number): Spin[][] {
  const boxes: Spin[][] = Array.from({ length: degeneracy }, () => []);
  for (let k = 0; k < occupancy; k++) boxes[k % degeneracy].push(k < degeneracy ? 'up' : 'down');
  return boxes;
}

/**
 * MO diagram of a diatomic species. Throws RangeError for unknown formulas or charges
 * (see `parseDiatomicFormula`).
 */
export function buildMoDiagram(input: BuildMoDiagramInput): MoDiagram {
  const species = parseDiatomicFormula(input.formula, input.charge);
  const notes = [...species.notes];
  const optionOrder = input.order ?? 'auto';
  if (!['mixed', 'unmixed', 'auto'].includes(optionOrder)) {
    throw new RangeError(`order must be 'mixed', 'unmixed' or 'auto', got '${String(optionOrder)}'`);
  }
  const { order, rule } = resolveOrder(species, optionOrder, notes);
  const templates = levelTemplates(species.scheme, order, species.left, species.right);
  const energies = sketchEnergies(templates, species.left, species.right);

  let remaining = species.electronCount;
  const levels: MoLevel[] = templates.map((tpl, i) => {
    const degeneracy = tpl.symmetry === 'pi' ? 2 : 1;
    const capacity = 2 * degeneracy;
    const occupancy = Math.min(capacity, remaining);
    remaining -= occupancy;
    return {
      energyRank: i,
      label: tpl.label,
      labelAscii: tpl.labelAscii,
      valenceLabel: tpl.valenceLabel,
      symmetry: tpl.symmetry,
      parity: tpl.parity,
      character: tpl.character,
      core: tpl.core,
      degeneracy,
      capacity,
      occupancy,
      spins: hundSpins(occupancy, degeneracy),
      energyEv: energies[i],
      correlations: tpl.correlations.map((c) => ({ ...c, element: c.side === 'left' ? species.left : species.right })),
    };
  });

  const occupied = levels.filter((l) => l.occupancy > 0);
  const electronsOf = (c: OrbitalCharacter) => levels.filter((l) => l.character === c).reduce((s, l) => s + l.occupancy, 0);
  const bondingElectrons = electronsOf('bonding');
  const antibondingElectrons = electronsOf('antibonding');
  const unpairedElectrons = levels.reduce(
    (s, l) => s + Math.abs(l.spins.flat().filter((x) => x === 'up').length - l.spins.flat().filter((x) => x === 'down').length),
    0,
  );
  const openShells = levels.filter((l) => l.occupancy > 0 && l.occupancy < l.capacity);
  const terms = termsFromShells(
    openShells.map((l) => ({ symmetry: l.symmetry, parity: l.parity, electrons: l.occupancy, label: l.label })),
    { homonuclear: species.homonuclear },
  );
  const termSymbol = terms[0].term;

  const coreLevels = levels.filter((l) => l.core);
  const coreFull = coreLevels.length > 0 && coreLevels.every((l) => l.occupancy === l.capacity);
  const valenceParts = levels
    .filter((l) => l.occupancy > 0 && !(coreFull && l.core))
    .map((l) => `(${l.valenceLabel})${superscriptNumber(l.occupancy)}`);
  const lastIndex = (pred: (l: MoLevel) => boolean) => {
    for (let i = levels.length - 1; i >= 0; i--) if (pred(levels[i])) return i;
    return null;
  };
  const firstIndex = (pred: (l: MoLevel) => boolean) => {
    const i = levels.findIndex(pred);
    return i < 0 ? null : i;
  };

  return {
    formula: species.formula,
    species: species.species,
    display: species.display,
    charge: species.charge,
    electronCount: species.electronCount,
    homonuclear: species.homonuclear,
    atoms: {
      left: { element: species.left, atomicNumber: ATOMIC_NUMBER[species.left], levels: atomLevels(species.left, species.scheme) },
      right: { element: species.right, atomicNumber: ATOMIC_NUMBER[species.right], levels: atomLevels(species.right, species.scheme) },
    },
    order,
    orderRule: rule,
    levels,
    configuration: occupied.map((l) => `(${l.label})${superscriptNumber(l.occupancy)}`).join(''),
    configurationAscii: occupied.map((l) => `(${l.labelAscii})^${l.occupancy}`).join(''),
    valenceConfiguration: (coreFull ? 'K'.repeat(coreLevels.length) : '') + valenceParts.join(''),
    bondingElectrons,
    antibondingElectrons,
    nonbondingElectrons: electronsOf('nonbonding'),
    bondOrder: (bondingElectrons - antibondingElectrons) / 2,
    unpairedElectrons,
    magnetism: unpairedElectrons > 0 ? 'paramagnetic' : 'diamagnetic',
    homoIndex: lastIndex((l) => l.occupancy > 0),
    lumoIndex: firstIndex((l) => l.occupancy < l.capacity),
    lowestEmptyIndex: firstIndex((l) => l.occupancy === 0),
    openShellIndices: openShells.map((l) => l.energyRank),
    termSymbol,
    termSymbolAscii: formatTermSymbol(termSymbol, 'ascii'),
    terms,
    notes,
  };
}

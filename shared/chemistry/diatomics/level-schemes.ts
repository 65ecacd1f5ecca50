/**
 * Molecular-orbital level schemes of diatomics (qualitative correlation diagrams).
 *
 * Labelling convention: all orbitals are numbered within their symmetry species counting the
 * 1s core (1σg, 1σu, 2σg, …), as in Herzberg (Spectra of Diatomic Molecules, 1950) and
 * Mulliken's notation; the antibonding orbitals of homonuclear molecules carry a '*' as well
 * (1σu*, 1πg*). The valence-only names common in general-chemistry texts (σ2s, σ*2s, π2p, …)
 * are given beside them as `valenceLabel`. Heteronuclear orbitals are numbered σ/π without
 * g/u and without '*' (1σ, 2σ, …, 1π, 5σ, 2π, 6σ for CO; 1σ, 2σ, 3σ, 1π, 4σ for HF).
 *
 * Orders (Atkins & de Paula, Physical Chemistry, ch. "Molecular structure"; Miessler & Tarr,
 * Inorganic Chemistry, ch. 5; photoelectron spectra of N2 and O2; from memory):
 *   mixed   (s–p mixing, Li2 … N2): 1σg 1σu* 2σg 2σu* 1πu 3σg 1πg* 3σu*
 *   unmixed (O2, F2, Ne2):          1σg 1σu* 2σg 2σu* 3σg 1πu 1πg* 3σu*
 *   heteronuclear, mixed (CO-like): 1σ 2σ 3σ 4σ 1π 5σ 2π 6σ; unmixed: … 4σ 5σ 1π 2π 6σ
 *   hydrides (BH … HF):            1σ 2σ 3σ 1π 4σ  (X 1s core, X 2s, σ bond H 1s + X 2p, X 2p π lone pairs, σ*)
 *   H2, He2 (1s only):             1σg 1σu*
 * Characters follow the simple correlation diagram (3σg / 5σ counted as bonding, 4σ as antibonding,
 * hydride 2σ and 1π as nonbonding), as far as such a diagram serves.
 */
import type { AtomicOrbitalName } from './atomic-orbital-energies';
import type { OrbitalSymmetry } from './open-shell-terms';
import type { Parity } from './term-symbol';
import type { LevelScheme } from './species';

export type OrbitalCharacter = 'bonding' | 'antibonding' | 'nonbonding';
export type Side = 'left' | 'right';
export type ResolvedOrder = 'mixed' | 'unmixed' | 'fixed';

export interface LevelTemplate {
  label: string;
  labelAscii: string;
  valenceLabel: string;
  symmetry: OrbitalSymmetry;
  parity: Parity | null;
  character: OrbitalCharacter;
  /** a 1s-derived core level */
  core: boolean;
  correlations: Array<{ side: Side; orbital: AtomicOrbitalName }>;
  /** qualitative splitting strength (fraction of the mean atomic energy) for the energy sketch */
  strength: number;
  /** in the mixed order this σ level is drawn just above the bonding π level */
  pushedAbovePi: boolean;
}

// splitting strengths for the qualitative energy sketch (common practice; only spacing matters)
const CORE = 0.002;
const S1 = 0.12;
const S2 = 0.12;
const PI = 0.08;
const SIGMA_P = 0.14;

function t(
  label: string,
  labelAscii: string,
  valenceLabel: string,
  symmetry: OrbitalSymmetry,
  parity: Parity | null,
  character: OrbitalCharacter,
  correlations: Array<[Side, AtomicOrbitalName]>,
  strength: number,
  extra: { core?: boolean; pushedAbovePi?: boolean } = {},
): LevelTemplate {
  return {
    label,
    labelAscii,
    valenceLabel,
    symmetry,
    parity,
    character,
    core: extra.core ?? false,
    correlations: correlations.map(([side, orbital]) => ({ side, orbital })),
    strength,
    pushedAbovePi: extra.pushedAbovePi ?? false,
  };
}

const both = (o: AtomicOrbitalName): Array<[Side, AtomicOrbitalName]> => [
  ['left', o],
  ['right', o],
];

/** Ordered level templates for a scheme and order; `left`/`right` are element symbols. */
export function levelTemplates(scheme: LevelScheme, order: ResolvedOrder, left: string, right: string): LevelTemplate[] {
  if (scheme === 'one-s') {
    return [
      t('1σg', '1sigma_g', 'σ1s', 'sigma', 'g', 'bonding', both('1s'), S1),
      t('1σu*', '1sigma_u*', 'σ*1s', 'sigma', 'u', 'antibonding', both('1s'), S1),
    ];
  }
  if (scheme === 'hydride') {
    return [
      t('1σ', '1sigma', `1s(${right})`, 'sigma', null, 'nonbonding', [['right', '1s']], 0, { core: true }),
      t('2σ', '2sigma', `2s(${right})`, 'sigma', null, 'nonbonding', [['right', '2s']], 0),
      t('3σ', '3sigma', 'σ', 'sigma', null, 'bonding', [['left', '1s'], ['right', '2p']], SIGMA_P),
      t('1π', '1pi', `2pπ(${right})`, 'pi', null, 'nonbonding', [['right', '2p']], 0),
      t('4σ', '4sigma', 'σ*', 'sigma', null, 'antibonding', [['left', '1s'], ['right', '2p']], SIGMA_P),
    ];
  }
  const mixed = order === 'mixed';
  if (scheme === 'second-period') {
    const sigmaP = t('3σg', '3sigma_g', 'σ2p', 'sigma', 'g', 'bonding', both('2p'), SIGMA_P, { pushedAbovePi: mixed });
    const piU = t('1πu', '1pi_u', 'π2p', 'pi', 'u', 'bonding', both('2p'), PI);
    return [
      t('1σg', '1sigma_g', 'σ1s', 'sigma', 'g', 'bonding', both('1s'), CORE, { core: true }),
      t('1σu*', '1sigma_u*', 'σ*1s', 'sigma', 'u', 'antibonding', both('1s'), CORE, { core: true }),
      t('2σg', '2sigma_g', 'σ2s', 'sigma', 'g', 'bonding', both('2s'), S2),
      t('2σu*', '2sigma_u*', 'σ*2s', 'sigma', 'u', 'antibonding', both('2s'), S2),
      ...(mixed ? [piU, sigmaP] : [sigmaP, piU]),
      t('1πg*', '1pi_g*', 'π*2p', 'pi', 'g', 'antibonding', both('2p'), PI),
      t('3σu*', '3sigma_u*', 'σ*2p', 'sigma', 'u', 'antibonding', both('2p'), SIGMA_P),
    ];
  }
  // heteronuclear, both atoms from the second period; right = more electronegative
  const fiveSigma = t('5σ', '5sigma', 'σ2p', 'sigma', null, 'bonding', both('2p'), SIGMA_P, { pushedAbovePi: mixed });
  const onePi = t('1π', '1pi', 'π2p', 'pi', null, 'bonding', both('2p'), PI);
  return [
    t('1σ', '1sigma', `1s(${right})`, 'sigma', null, 'nonbonding', [['right', '1s']], 0, { core: true }),
    t('2σ', '2sigma', `1s(${left})`, 'sigma', null, 'nonbonding', [['left', '1s']], 0, { core: true }),
    t('3σ', '3sigma', 'σ2s', 'sigma', null, 'bonding', both('2s'), S2),
    t('4σ', '4sigma', 'σ*2s', 'sigma', null, 'antibonding', both('2s'), S2),
    ...(mixed ? [onePi, fiveSigma] : [fiveSigma, onePi]),
    t('2π', '2pi', 'π*2p', 'pi', null, 'antibonding', both('2p'), PI),
    t('6σ', '6sigma', 'σ*2p', 'sigma', null, 'antibonding', both('2p'), SIGMA_P),
  ];
}

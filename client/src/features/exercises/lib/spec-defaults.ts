/**
 * Starting points for the exercise editor: a sensible model of each family,
 * the checks that suit it, new checks with unique ids, and the labels the
 * editor shows. Every value here is only a default the lecturer edits.
 */
import { checksByFamily, type Check, type CheckKind, type ExerciseSpecInput, type ModelFamily } from '@shared/exercises/spec';

type ModelInput = ExerciseSpecInput['model'];
type CheckInput = ExerciseSpecInput['scheme']['checks'][number];

export const familyLabel: Record<ModelFamily, string> = {
  'one-electron': 'One-electron bond',
  'two-electron': 'Two-electron bond (H₂)',
  diatomic: 'MO diagram of a diatomic',
  huckel: 'Hückel pi system',
};

export const methodLabel: Record<string, string> = {
  lcao: 'LCAO (two 1s orbitals)',
  exact: 'Exact (Born–Oppenheimer)',
  mo: 'Simple MO',
  ci: 'MO with configuration interaction',
  vb: 'Valence bond (Heitler–London)',
};

export const checkKindLabel: Record<CheckKind, string> = {
  'curve-rms': 'Curve deviation (RMS)',
  'curve-max': 'Curve deviation (maximum)',
  'equilibrium-distance': 'Equilibrium distance Rₑ',
  'well-depth': 'Well depth Dₑ',
  'vibrational-wavenumber': 'Vibrational wavenumber ωₑ',
  'antibonding-repulsive': 'Antibonding curve repulsive',
  configuration: 'Configuration',
  'bond-order': 'Bond order',
  'unpaired-electrons': 'Unpaired electrons',
  'term-symbol': 'Term symbol',
  'huckel-energies': 'Hückel energies',
  manual: 'Marked by hand',
};

export const checkUnitLabel: Partial<Record<CheckKind, string>> = {
  'curve-rms': 'Eₕ',
  'curve-max': 'Eₕ',
  'equilibrium-distance': 'a₀',
  'well-depth': 'eV',
  'vibrational-wavenumber': 'cm⁻¹',
  'huckel-energies': '|β|',
};

const grid = { unit: 'bohr' as const, start: 0.5, end: 8, step: 0.1 };

export function defaultModel(family: ModelFamily): ModelInput {
  switch (family) {
    case 'one-electron':
      return {
        family,
        method: 'lcao',
        za: { kind: 'fixed', value: 1 },
        zb: { kind: 'fixed', value: 1 },
        zeta: { kind: 'list', values: [1, 1.1, 1.2, 1.3] },
        states: ['bonding', 'antibonding'],
        grid,
      };
    case 'two-electron':
      return { family, method: 'mo', zeta: { kind: 'fixed', value: 1 }, grid };
    case 'diatomic':
      return { family, species: ['O2', 'N2', 'F2'], order: 'auto' };
    case 'huckel':
      return { family, systems: [{ kind: 'chain', n: 4 }, { kind: 'ring', n: 6 }] };
  }
}

/** Default tolerances (full, zero) in each check's unit. */
const tolerances: Partial<Record<CheckKind, [number, number]>> = {
  'curve-rms': [0.0005, 0.005],
  'curve-max': [0.001, 0.01],
  'equilibrium-distance': [0.02, 0.2],
  'well-depth': [0.02, 0.2],
  'vibrational-wavenumber': [25, 250],
  'huckel-energies': [0.005, 0.05],
};

export function newCheck(kind: CheckKind, takenIds: string[]): CheckInput {
  let id: string = kind === 'manual' ? 'write-up' : kind;
  for (let n = 2; takenIds.includes(id); n++) id = `${kind}-${n}`;
  const label = kind === 'manual' ? 'Write-up' : checkKindLabel[kind];
  const tol = tolerances[kind];
  if (kind === 'manual') return { kind, id, label, weight: 10, description: '' };
  if (!tol) return { kind, id, label, weight: 10 } as CheckInput;
  const base = { kind, id, label, weight: 10, full: tol[0], zero: tol[1], credit: 'linear' as const };
  if (kind === 'curve-rms' || kind === 'curve-max') return { ...base, kind, removeShift: false };
  return base as CheckInput;
}

export function defaultChecks(family: ModelFamily): CheckInput[] {
  const kinds: CheckKind[] =
    family === 'one-electron'
      ? ['curve-rms', 'equilibrium-distance', 'well-depth', 'antibonding-repulsive']
      : family === 'two-electron'
        ? ['curve-rms', 'equilibrium-distance', 'well-depth']
        : family === 'diatomic'
          ? ['configuration', 'bond-order', 'unpaired-electrons', 'term-symbol']
          : ['huckel-energies'];
  const out: CheckInput[] = [];
  for (const k of kinds) out.push(newCheck(k, out.map((c) => c.id)));
  return out;
}

/** The browser's own zone when it has one, else London. */
export function browserTimeZone(): string {
  try {
    return Intl.DateTimeFormat().resolvedOptions().timeZone || 'Europe/London';
  } catch {
    return 'Europe/London';
  }
}

/** IANA zones the browser knows, with `current` kept in the list. */
export function timeZoneOptions(current: string): string[] {
  let zones: string[] = [];
  try {
    zones = (Intl as unknown as { supportedValuesOf(k: string): string[] }).supportedValuesOf('timeZone');
  } catch {
    zones = ['Europe/London', 'UTC'];
  }
  const all = new Set([...zones, 'UTC', current]);
  return [...all].sort();
}

function nextFridayAt17(): string {
  const d = new Date();
  d.setDate(d.getDate() + ((5 - d.getDay() + 7) % 7 || 7) + 7);
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T17:00`;
}

export function newExerciseSpec(timeZone: string): ExerciseSpecInput {
  return {
    title: '',
    instructionsMarkdown: '',
    model: defaultModel('one-electron'),
    variantSeed: Math.random().toString(36).slice(2, 10),
    dueLocal: nextFridayAt17(),
    timeZone,
    late: { graceMinutes: 0, penaltyPerDayPercent: 10, capPercent: 50 },
    allowedFileTypes: ['csv', 'tsv', 'xlsx'],
    writeUp: 'optional',
    scheme: { checks: defaultChecks('one-electron') },
  };
}

/** Switching family keeps the checks that still apply; with none left, the family's defaults. */
export function switchFamily(spec: ExerciseSpecInput, family: ModelFamily): ExerciseSpecInput {
  const allowed = checksByFamily[family];
  const kept = spec.scheme.checks.filter((c) => allowed.includes(c.kind));
  return { ...spec, model: defaultModel(family), scheme: { checks: kept.some((c) => c.kind !== 'manual') ? kept : [...defaultChecks(family), ...kept] } };
}

export type { CheckInput, ModelInput, Check };

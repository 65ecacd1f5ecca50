/**
 * The demo exercises: at least one of each model family in the two demo
 * courses, each with a marking scheme; the published and closed ones with a
 * variant for every enrolled student. Invented teaching material, made for
 * the demo. Called from seeds/demo.ts after the courses and rosters exist.
 */
import type { Knex } from 'knex';
import { checkedExerciseSpecSchema } from '../shared/api/exercises';
import type { ExerciseSpecInput } from '../shared/exercises/spec';
import { closeExercise, createExercise, publishExercise } from '../server/src/modules/exercises/service';

type Db = Knex | Knex.Transaction;

const LATE = { graceMinutes: 15, penaltyPerDayPercent: 10, capPercent: 50 };
const ZONE = 'Europe/London';

interface DemoExercise {
  course: string;
  state: 'draft' | 'published' | 'closed';
  spec: ExerciseSpecInput;
}

const oneElectronLcao: ExerciseSpecInput = {
  title: 'The one-electron bond (LCAO)',
  instructionsMarkdown: [
    'Two protons share one electron. Using a minimal LCAO of two 1s orbitals with **your** orbital exponent ζ',
    '(on your personal template), compute the bonding and antibonding energies on the R grid of the template.',
    '',
    '1. Fill in the total energy E(R) in hartree for both states.',
    '2. From your bonding curve, find Rₑ, E(Rₑ) and Dₑ.',
    '3. Estimate the harmonic wavenumber ωₑ for the ¹H–¹H nuclei.',
    '',
    'In the write-up, sketch both orbitals along the axis and explain where the nodal plane of the antibonding one lies.',
  ].join('\n'),
  model: {
    family: 'one-electron',
    method: 'lcao',
    za: { kind: 'fixed', value: 1 },
    zb: { kind: 'fixed', value: 1 },
    zeta: { kind: 'list', values: [1, 1.1, 1.2, 1.24, 1.3] },
    states: ['bonding', 'antibonding'],
    grid: { unit: 'bohr', start: 0.6, end: 8, step: 0.2 },
  },
  variantSeed: 'aldermere-2140-one-electron',
  dueLocal: '2026-10-09T17:00',
  timeZone: ZONE,
  late: LATE,
  allowedFileTypes: ['xlsx', 'csv'],
  writeUp: 'required',
  scheme: {
    checks: [
      { kind: 'curve-rms', id: 'curve-rms', label: 'Bonding and antibonding curves (RMS deviation)', weight: 30, full: 0.0005, zero: 0.005, credit: 'linear', removeShift: false },
      { kind: 'equilibrium-distance', id: 're', label: 'Equilibrium distance Rₑ', weight: 20, full: 0.02, zero: 0.2, credit: 'linear' },
      { kind: 'well-depth', id: 'de', label: 'Well depth Dₑ', weight: 15, full: 0.02, zero: 0.2, credit: 'linear' },
      { kind: 'vibrational-wavenumber', id: 'we', label: 'Harmonic wavenumber ωₑ', weight: 10, full: 25, zero: 250, credit: 'linear', isotopes: ['1H', '1H'] },
      { kind: 'antibonding-repulsive', id: 'repulsive', label: 'Antibonding curve has no minimum', weight: 10 },
      { kind: 'manual', id: 'write-up', label: 'Write-up: orbitals and nodal plane', weight: 15, description: 'Orbital sketches along the axis; position of the nodal plane; why the upper state does not bind.' },
    ],
  },
};

const oneElectronExact: ExerciseSpecInput = {
  title: 'The one-electron bond: exact against LCAO',
  instructionsMarkdown: 'Compute the exact ground-state energy of the one-electron bond on the grid and compare it with your LCAO curve from the first exercise. Where does the minimal basis fail most?',
  model: {
    family: 'one-electron',
    method: 'exact',
    za: { kind: 'fixed', value: 1 },
    zb: { kind: 'fixed', value: 1 },
    zeta: { kind: 'fixed', value: 1 },
    states: ['bonding'],
    grid: { unit: 'angstrom', start: 0.5, end: 4, step: 0.1 },
  },
  variantSeed: 'aldermere-2140-exact',
  dueLocal: '2026-11-20T17:00',
  timeZone: ZONE,
  late: LATE,
  allowedFileTypes: ['xlsx', 'csv', 'tsv'],
  writeUp: 'optional',
  scheme: {
    checks: [
      { kind: 'curve-max', id: 'curve-max', label: 'Ground-state curve (largest deviation)', weight: 40, full: 0.0002, zero: 0.002, credit: 'linear', removeShift: false },
      { kind: 'equilibrium-distance', id: 're', label: 'Equilibrium distance Rₑ', weight: 30, full: 0.01, zero: 0.1, credit: 'linear' },
      { kind: 'well-depth', id: 'de', label: 'Well depth Dₑ', weight: 30, full: 0.01, zero: 0.1, credit: 'linear' },
    ],
  },
};

const h2Scheme = (id: string) => ({
  checks: [
    { kind: 'curve-rms' as const, id: 'curve-rms', label: 'Ground-state curve (RMS deviation, shift removed)', weight: 35, full: 0.0005, zero: 0.005, credit: 'linear' as const, removeShift: true },
    { kind: 'equilibrium-distance' as const, id: 're', label: 'Equilibrium distance Rₑ', weight: 25, full: 0.02, zero: 0.2, credit: 'linear' as const },
    { kind: 'well-depth' as const, id: 'de', label: 'Well depth Dₑ', weight: 25, full: 0.03, zero: 0.3, credit: 'linear' as const },
    { kind: 'manual' as const, id, label: 'Write-up: comparison of the two wavefunctions', weight: 15, description: 'Ionic terms in the simple MO function; why it dissociates wrongly.' },
  ],
});

const h2Mo: ExerciseSpecInput = {
  title: 'H₂ by simple MO',
  instructionsMarkdown:
    'Build the ground state of H₂ from one doubly occupied bonding orbital of two 1s functions with your exponent ζ. Compute E(R) on the grid, then Rₑ and Dₑ, and explain in the write-up what goes wrong as R grows.',
  model: { family: 'two-electron', method: 'mo', zeta: { kind: 'list', values: [1, 1.1, 1.2] }, grid: { unit: 'bohr', start: 0.6, end: 6, step: 0.1 } },
  variantSeed: 'aldermere-2140-h2-mo',
  dueLocal: '2026-10-23T17:00',
  timeZone: ZONE,
  late: LATE,
  allowedFileTypes: ['xlsx', 'csv'],
  writeUp: 'optional',
  scheme: h2Scheme('write-up'),
};

const h2Vb: ExerciseSpecInput = {
  title: 'H₂ by valence bond (Heitler–London)',
  instructionsMarkdown:
    'Compute the Heitler–London energy of H₂ with the exponent optimized at every R. Report Rₑ and Dₑ, and compare with the simple MO result from the previous week.',
  model: { family: 'two-electron', method: 'vb', zeta: { kind: 'optimized' }, grid: { unit: 'angstrom', start: 0.4, end: 3, step: 0.05 } },
  variantSeed: 'aldermere-2140-h2-vb',
  dueLocal: '2026-10-02T17:00',
  timeZone: ZONE,
  late: LATE,
  allowedFileTypes: ['xlsx', 'csv'],
  writeUp: 'optional',
  scheme: h2Scheme('comparison'),
};

const diatomics: ExerciseSpecInput = {
  title: 'MO diagrams of second-row diatomics',
  instructionsMarkdown: [
    'Draw the MO diagram of **your** species (on your template). Give:',
    '',
    '- the ground configuration, e.g. `(1σg)²(1σu*)²…`',
    '- the bond order',
    '- the number of unpaired electrons',
    '- the ground term symbol, e.g. `3Σg-`',
    '',
    'State whether you used the level order with or without s–p mixing, and why.',
  ].join('\n'),
  model: { family: 'diatomic', species: ['O2', 'N2', 'O2+', 'B2', 'C2', 'F2'], order: 'auto' },
  variantSeed: 'aldermere-3310-diatomics',
  dueLocal: '2026-10-16T12:00',
  timeZone: ZONE,
  late: { graceMinutes: 0, penaltyPerDayPercent: 20, capPercent: 100 },
  allowedFileTypes: ['xlsx'],
  writeUp: 'none',
  scheme: {
    checks: [
      { kind: 'configuration', id: 'configuration', label: 'Ground configuration', weight: 30 },
      { kind: 'bond-order', id: 'bond-order', label: 'Bond order', weight: 25 },
      { kind: 'unpaired-electrons', id: 'unpaired', label: 'Unpaired electrons', weight: 20 },
      { kind: 'term-symbol', id: 'term', label: 'Ground term symbol', weight: 25 },
    ],
  },
};

const huckel: ExerciseSpecInput = {
  title: 'Hückel pi energies',
  instructionsMarkdown:
    'For your pi system (a chain or a ring, on your template), set up the Hückel matrix, find the orbital energies as E = α + xβ and list x from the lowest orbital up. Then give the total pi energy and the delocalization energy.',
  model: {
    family: 'huckel',
    systems: [
      { kind: 'chain', n: 3 },
      { kind: 'chain', n: 4 },
      { kind: 'chain', n: 5 },
      { kind: 'chain', n: 6 },
      { kind: 'ring', n: 4 },
      { kind: 'ring', n: 5 },
      { kind: 'ring', n: 6 },
    ],
  },
  variantSeed: 'aldermere-3310-huckel',
  dueLocal: '2026-11-06T17:00',
  timeZone: ZONE,
  late: LATE,
  allowedFileTypes: ['xlsx', 'csv'],
  writeUp: 'optional',
  scheme: {
    checks: [
      { kind: 'huckel-energies', id: 'x-values', label: 'Orbital energies (x values)', weight: 80, full: 0.005, zero: 0.05, credit: 'linear' },
      { kind: 'manual', id: 'pi-energy', label: 'Total and delocalization pi energy', weight: 20, description: 'Marked by hand from the write-up or the answer cells.' },
    ],
  },
};

export const demoExercises: DemoExercise[] = [
  { course: 'CHEM 2140', state: 'closed', spec: h2Vb },
  { course: 'CHEM 2140', state: 'published', spec: oneElectronLcao },
  { course: 'CHEM 2140', state: 'published', spec: h2Mo },
  { course: 'CHEM 2140', state: 'draft', spec: oneElectronExact },
  { course: 'CHEM 3310', state: 'published', spec: diatomics },
  { course: 'CHEM 3310', state: 'published', spec: huckel },
];

/**
 * Adds the demo exercises to the demo courses (found by code), authored by
 * each course's first lecturer. Returns what it made.
 */
export async function seedDemoExercises(knex: Db): Promise<{ id: number; course: string; title: string; state: string; variants: number }[]> {
  const made: { id: number; course: string; title: string; state: string; variants: number }[] = [];
  for (const demo of demoExercises) {
    const course = await knex('courses').where({ code: demo.course }).first('id');
    if (!course) throw new Error(`seedDemoExercises: the demo course ${demo.course} does not exist yet; seed the courses first.`);
    const lecturer = await knex('course_staff').where({ course_id: course.id, role: 'lecturer' }).orderBy('created_at').orderBy('user_id').first('user_id');
    if (!lecturer) throw new Error(`seedDemoExercises: the demo course ${demo.course} has no lecturer.`);
    const author = { id: lecturer.user_id as number, isAdmin: false };
    const spec = checkedExerciseSpecSchema.parse(demo.spec);
    const { exercise } = await createExercise(knex as Knex, author, course.id, spec);
    let variants = 0;
    if (demo.state !== 'draft') variants = (await publishExercise(knex as Knex, author, exercise.id)).variantsDrawn ?? 0;
    if (demo.state === 'closed') await closeExercise(knex as Knex, author, exercise.id);
    made.push({ id: exercise.id, course: demo.course, title: spec.title, state: demo.state, variants });
  }
  return made;
}
